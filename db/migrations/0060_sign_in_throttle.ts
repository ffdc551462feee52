// Failed sign-ins per account and per client address, kept in PostgreSQL so a throttle holds
// across restarts and across several app processes (lib/auth/throttle.ts has the rules).
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    create table sign_in_throttle (
      key text primary key check (key ~ '^(account|address):'),
      failures integer not null default 0 check (failures >= 0),
      window_started_at timestamptz not null default now(),
      locked_until timestamptz
    )
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`drop table sign_in_throttle`.execute(db);
}
