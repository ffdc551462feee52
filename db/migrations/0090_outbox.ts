// The outbox: a record of every message the product sends (roster mails, invitations, password
// resets), with its status, attempts and the last failure's reason, so an administrator can see
// what went out and send again. Set-password links are stored masked: a copy of the database
// holds no working link.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    create table outbox (
      id integer generated always as identity primary key,
      kind text not null check (kind in ('roster', 'invitation', 'reset', 'notice')),
      sender text not null,
      recipient text not null,
      subject text not null,
      body text not null,
      attachments jsonb not null default '[]'::jsonb,
      status text not null default 'queued' check (status in ('queued', 'sent', 'failed')),
      attempts integer not null default 0 check (attempts >= 0),
      last_error text,
      message_id text,
      user_id integer references users (id) on delete set null,
      guard_id integer references guards (id) on delete set null,
      roster_id integer references rosters (id) on delete set null,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      sent_at timestamptz
    )
  `.execute(db);
  await sql`create index outbox_created on outbox (created_at desc, id desc)`.execute(db);
  await sql`create index outbox_roster_guard on outbox (roster_id, guard_id)`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`drop table outbox`.execute(db);
}
