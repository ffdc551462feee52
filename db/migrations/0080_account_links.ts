// Accounts that are invited, disabled and reset: a user may be disabled (refused at sign-in, their
// sessions end at the next request), the last sign-in is kept, and single-use links to set a
// password (an invitation, or a reset) are stored by the SHA-256 of their token only, with an
// expiry and the time they were used.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`alter table users add column disabled_at timestamptz, add column last_sign_in_at timestamptz`.execute(db);
  await sql`
    create table account_links (
      id integer generated always as identity primary key,
      user_id integer not null references users (id) on delete cascade,
      token_hash text not null unique check (token_hash ~ '^[0-9a-f]{64}$'),
      purpose text not null check (purpose in ('invite', 'reset')),
      expires_at timestamptz not null,
      used_at timestamptz,
      created_at timestamptz not null default now(),
      created_by integer references users (id) on delete set null
    )
  `.execute(db);
  await sql`create index account_links_user on account_links (user_id)`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`drop table account_links`.execute(db);
  await sql`alter table users drop column disabled_at, drop column last_sign_in_at`.execute(db);
}
