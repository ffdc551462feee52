// Jobs that failed for a passing reason (the mail server not answering) try again later: a queued
// job waits until `run_after`, and the worker backs off a little more after each attempt.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`alter table jobs add column run_after timestamptz not null default now()`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`alter table jobs drop column run_after`.execute(db);
}
