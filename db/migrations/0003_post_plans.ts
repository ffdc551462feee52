// Post plans: the posts computed for a room (at one version of its walls), optionally for an
// exhibition, proposed by the planner and approved by operations. The latest approved plan per
// (exhibition, room) is the one staffing counts.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    create table post_plans (
      id integer generated always as identity primary key,
      room_id integer not null references rooms (id) on delete cascade,
      exhibition_id integer references exhibitions (id) on delete cascade,
      room_version integer not null check (room_version >= 1),
      method text not null check (method in ('guaranteed', 'fewest')),
      posts jsonb not null check (jsonb_typeof(posts) = 'array'),
      lower_bound integer check (lower_bound is null or lower_bound >= 0),
      proven boolean not null default false,
      covered numeric not null check (covered >= 0 and covered <= 1),
      options jsonb not null default '{}' check (jsonb_typeof(options) = 'object'),
      status text not null default 'proposed' check (status in ('proposed', 'approved')),
      approved_by integer references users (id) on delete set null,
      approved_at timestamptz,
      created_at timestamptz not null default now(),
      check ((status = 'approved') = (approved_at is not null))
    )`.execute(db);
  await sql`create index post_plans_room on post_plans (room_id, created_at desc)`.execute(db);
  await sql`create index post_plans_approved on post_plans (exhibition_id, room_id, approved_at desc) where status = 'approved'`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`drop table if exists post_plans`.execute(db);
}
