// One published version per draft revision, and the publish review kept with the version.
//
// A published roster records the draft revision it was made from (draft_revision); a unique index
// lets each revision of a week's draft become a version once, so two Publish clicks at once give one
// version and one set of mails. The review a manager saw (unfilled hours by room and risk, rooms
// empty by hour, guards over contract, manual overrides), what they typed to confirm an empty
// high-risk room and their note are stored with the version and, like the rest of it, never change.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    alter table rosters
      add column draft_revision integer check (draft_revision >= 1),
      add column publish_review jsonb check (publish_review is null or jsonb_typeof(publish_review) = 'object'),
      add column publish_confirmation text,
      add column publish_note text`.execute(db);
  // Versions published before this migration: the first version of each draft revision claims it,
  // later copies of the same revision stay without one (their history is kept as it was).
  await sql`
    update rosters set draft_revision = revision
    where status = 'published' and id in (
      select distinct on (site_id, starts_on, revision) id from rosters
      where status = 'published'
      order by site_id, starts_on, revision, version)`.execute(db);
  await sql`
    create unique index rosters_published_once on rosters (site_id, starts_on, draft_revision)
      where status = 'published' and draft_revision is not null`.execute(db);
  // A new draft of a week continues after the revisions already published (a deleted and rebuilt
  // draft would otherwise start again at revision 1 and collide with version 1).
  await sql`
    create function sightward_draft_revision_continues() returns trigger language plpgsql as $$
    declare
      published_max integer;
    begin
      if new.status = 'draft' then
        select max(draft_revision) into published_max from rosters
          where site_id = new.site_id and starts_on = new.starts_on and status = 'published';
        if published_max is not null and new.revision <= published_max then
          new.revision := published_max + 1;
        end if;
      end if;
      return new;
    end $$`.execute(db);
  await sql`
    create trigger rosters_draft_revision_continues before insert on rosters
      for each row execute function sightward_draft_revision_continues()`.execute(db);
  // The 0004 trigger freezes the columns it knows; this one freezes the columns added here.
  await sql`
    create function sightward_published_review_is_frozen() returns trigger language plpgsql as $$
    begin
      if old.status = 'published' and
         (new.draft_revision, new.publish_review, new.publish_confirmation, new.publish_note)
         is distinct from
         (old.draft_revision, old.publish_review, old.publish_confirmation, old.publish_note) then
        raise exception 'roster % (version %) is published and never changes; publish a new version instead', old.id, old.version
          using errcode = 'check_violation';
      end if;
      return new;
    end $$`.execute(db);
  await sql`
    create trigger rosters_published_review_frozen before update on rosters
      for each row execute function sightward_published_review_is_frozen()`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`drop trigger if exists rosters_published_review_frozen on rosters`.execute(db);
  await sql`drop function if exists sightward_published_review_is_frozen()`.execute(db);
  await sql`drop trigger if exists rosters_draft_revision_continues on rosters`.execute(db);
  await sql`drop function if exists sightward_draft_revision_continues()`.execute(db);
  await sql`drop index if exists rosters_published_once`.execute(db);
  await sql`
    alter table rosters
      drop column if exists publish_note, drop column if exists publish_confirmation,
      drop column if exists publish_review, drop column if exists draft_revision`.execute(db);
}
