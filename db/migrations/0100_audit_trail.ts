// The audit trail: who changed rooms, post plans, approvals, rosters, people, roles and settings,
// when, and what changed. Rows are only ever added: a trigger refuses UPDATE and DELETE, so not
// even a bug in the app can rewrite history. No foreign keys on purpose: removing a user or a room
// must not touch the trail, which keeps the actor's name and the subject's label as they were.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    create table audit_events (
      id bigint generated always as identity primary key,
      at timestamptz not null default now(),
      actor_id integer,
      actor_name text not null,
      actor_role text not null,
      action text not null check (action ~ '^[a-z-]+\\.[a-z-]+$'),
      subject_type text not null,
      subject_id integer,
      subject_label text not null default '',
      site_id integer,
      summary text not null,
      changes jsonb not null default '{}'::jsonb
    )
  `.execute(db);
  await sql`create index audit_events_at on audit_events (at desc, id desc)`.execute(db);
  await sql`create index audit_events_subject on audit_events (subject_type, subject_id)`.execute(db);
  await sql`
    create function audit_events_append_only() returns trigger language plpgsql as $$
    begin
      raise exception 'the audit trail is append-only: % on audit_events is refused', tg_op;
    end
    $$
  `.execute(db);
  await sql`
    create trigger audit_events_append_only before update or delete on audit_events
    for each row execute function audit_events_append_only()
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`drop table audit_events`.execute(db);
  await sql`drop function audit_events_append_only()`.execute(db);
}
