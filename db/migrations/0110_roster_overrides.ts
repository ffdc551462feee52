// Changes to a draft roster kept against a labour rule: which rules, the note saying why, who and
// when. Rows are kept when the draft is rebuilt (history); the page shows those made since the build.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    create table roster_overrides (
      id integer generated always as identity primary key,
      roster_id integer not null references rosters (id) on delete cascade,
      revision integer not null,
      guard_id integer,
      post text not null,
      starts_at timestamptz not null,
      ends_at timestamptz not null,
      rules text[] not null,
      violations jsonb not null default '[]'::jsonb,
      note text not null check (length(note) between 1 and 500),
      created_by integer references users (id) on delete set null,
      created_by_name text not null,
      created_at timestamptz not null default now()
    )
  `.execute(db);
  await sql`create index roster_overrides_roster on roster_overrides (roster_id, created_at)`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`drop table roster_overrides`.execute(db);
}
