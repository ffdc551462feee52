// Background jobs, what a roster needs to be built, edited and published, guards' calendar
// tokens and time-off requests.
//
// Publishing never rewrites a published roster: it inserts a new roster row (status 'published',
// the next version for the site and week, `supersedes` pointing at the version it replaces) and
// copies the draft's shifts into it. Triggers below refuse any later change to a published
// roster or its shifts, so "a published version never changes" holds whatever code runs.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    create table jobs (
      id integer generated always as identity primary key,
      kind text not null,
      payload jsonb not null default '{}',
      status text not null default 'queued' check (status in ('queued', 'running', 'done', 'failed')),
      progress numeric not null default 0 check (progress >= 0 and progress <= 1),
      message text not null default '',
      result jsonb,
      attempts integer not null default 0 check (attempts >= 0),
      locked_at timestamptz,
      created_by integer references users (id) on delete set null,
      created_at timestamptz not null default now(),
      finished_at timestamptz
    )`.execute(db);
  // The worker looks for the oldest queued job, and for running jobs whose lock went stale.
  await sql`create index jobs_queued on jobs (id) where status = 'queued'`.execute(db);
  await sql`create index jobs_running on jobs (locked_at) where status = 'running'`.execute(db);

  await sql`
    alter table rosters
      add column supersedes integer references rosters (id) on delete set null,
      add column revision integer not null default 1 check (revision >= 1),
      add column scenario jsonb,
      add column unfilled jsonb not null default '[]' check (jsonb_typeof(unfilled) = 'array'),
      add column totals jsonb,
      add column violations jsonb not null default '[]' check (jsonb_typeof(violations) = 'array'),
      add column created_by integer references users (id) on delete set null,
      add column published_by integer references users (id) on delete set null`.execute(db);
  // One draft per site and week; published versions numbered 1, 2, ... per site and week.
  await sql`create unique index rosters_one_draft on rosters (site_id, starts_on) where status = 'draft'`.execute(db);
  await sql`create unique index rosters_published_version on rosters (site_id, starts_on, version) where status = 'published'`.execute(db);

  await sql`
    create function sightward_published_roster_is_frozen() returns trigger language plpgsql as $$
    begin
      -- Only the bookkeeping references (who, which version it supersedes) may be cleared when
      -- the row they point at is deleted.
      if old.status = 'published' and
         (new.status, new.version, new.site_id, new.starts_on, new.days, new.published_at, new.revision,
          new.scenario, new.unfilled, new.totals, new.violations)
         is distinct from
         (old.status, old.version, old.site_id, old.starts_on, old.days, old.published_at, old.revision,
          old.scenario, old.unfilled, old.totals, old.violations) then
        raise exception 'roster % (version %) is published and never changes; publish a new version instead', old.id, old.version
          using errcode = 'check_violation';
      end if;
      return new;
    end $$`.execute(db);
  await sql`
    create trigger rosters_published_frozen before update on rosters
      for each row execute function sightward_published_roster_is_frozen()`.execute(db);

  // Shifts of a published roster: inserted only in the transaction that publishes it (now() is
  // the transaction's start time, which is the roster's published_at), never updated afterwards.
  await sql`
    create function sightward_published_shifts_are_frozen() returns trigger language plpgsql as $$
    declare
      target rosters%rowtype;
    begin
      select * into target from rosters where id = coalesce(new.roster_id, old.roster_id);
      if target.status = 'published' and (tg_op = 'UPDATE' or target.published_at <> now()) then
        raise exception 'shifts of roster % (version %) are published and never change', target.id, target.version
          using errcode = 'check_violation';
      end if;
      return new;
    end $$`.execute(db);
  await sql`
    create trigger shifts_published_frozen before insert or update on shifts
      for each row execute function sightward_published_shifts_are_frozen()`.execute(db);

  // The secret in a guard's personal calendar feed address: two v4 UUIDs without dashes, 64 hex
  // digits carrying 244 random bits (gen_random_uuid draws from the server's strong random source).
  await sql`
    alter table guards add column calendar_token text not null unique
      default replace(gen_random_uuid()::text || gen_random_uuid()::text, '-', '')`.execute(db);

  await sql`
    create table time_off (
      id integer generated always as identity primary key,
      guard_id integer not null references guards (id) on delete cascade,
      starts_on date not null,
      ends_on date not null,
      note text not null default '',
      status text not null default 'requested' check (status in ('requested', 'approved', 'declined')),
      decided_by integer references users (id) on delete set null,
      decided_at timestamptz,
      created_at timestamptz not null default now(),
      check (ends_on >= starts_on)
    )`.execute(db);
  await sql`create index time_off_guard on time_off (guard_id, starts_on)`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`drop table if exists time_off`.execute(db);
  await sql`alter table guards drop column if exists calendar_token`.execute(db);
  await sql`drop trigger if exists shifts_published_frozen on shifts`.execute(db);
  await sql`drop function if exists sightward_published_shifts_are_frozen()`.execute(db);
  await sql`drop trigger if exists rosters_published_frozen on rosters`.execute(db);
  await sql`drop function if exists sightward_published_roster_is_frozen()`.execute(db);
  await sql`drop index if exists rosters_published_version`.execute(db);
  await sql`drop index if exists rosters_one_draft`.execute(db);
  await sql`
    alter table rosters
      drop column if exists supersedes, drop column if exists revision, drop column if exists scenario,
      drop column if exists unfilled, drop column if exists totals, drop column if exists violations,
      drop column if exists created_by, drop column if exists published_by`.execute(db);
  await sql`drop table if exists jobs`.execute(db);
}
