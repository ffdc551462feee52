// Settings several parts of the app read: the site's locale and currency (every date and amount is
// formatted with them), its default labour rules (partial overrides of the engine's defaults, plus
// the extra hours a guard accepts beyond contract), the mail sender; per guard, the extra hours
// they accept (null: the site's default), whether they are still employed, and weekly availability.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    alter table sites
      add column locale text not null default 'en-GB',
      add column currency text not null default 'EUR' check (currency ~ '^[A-Z]{3}$'),
      add column labour_rules jsonb not null default '{}'::jsonb,
      add column mail_sender text
  `.execute(db);
  await sql`
    alter table guards
      add column accepted_extra_hours numeric check (accepted_extra_hours >= 0),
      add column active boolean not null default true,
      add column availability jsonb
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`alter table guards drop column availability, drop column active, drop column accepted_extra_hours`.execute(db);
  await sql`alter table sites drop column mail_sender, drop column labour_rules, drop column currency, drop column locale`.execute(db);
}
