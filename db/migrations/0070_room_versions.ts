// Galleries a curator runs: sites, floors and rooms get a position (their order on the galleries
// page), and every outline a room ever had is kept in room_versions (who, when, corners n,
// obstacles h, floor area). A trigger writes the version row, so every path that changes walls
// (the API, the seed, the command-line tools) keeps its history; the saver's user id travels in
// the transaction setting sightward.user_id (set_config(..., true)), absent = unknown.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`alter table sites add column position integer not null default 0`.execute(db);
  await sql`alter table floors add column position integer not null default 0`.execute(db);
  await sql`alter table rooms add column position integer not null default 0`.execute(db);
  await sql`
    update floors set position = ordered.n from (
      select id, row_number() over (partition by site_id order by level, id) as n from floors
    ) ordered where ordered.id = floors.id`.execute(db);
  await sql`
    update rooms set position = ordered.n from (
      select id, row_number() over (partition by floor_id order by name, id) as n from rooms
    ) ordered where ordered.id = rooms.id`.execute(db);
  await sql`update sites set position = id`.execute(db);

  // Shoelace formula over a jsonb ring [[x, y], ...] (closing point not repeated): its area, m².
  await sql`
    create function sightward_ring_area(ring jsonb) returns double precision
    language sql immutable as $$
      select coalesce(abs(sum(
        (ring->i->>0)::double precision * (ring->((i + 1) % n)->>1)::double precision
        - (ring->((i + 1) % n)->>0)::double precision * (ring->i->>1)::double precision
      )) / 2, 0)
      from (select jsonb_array_length(ring) as n) size, generate_series(0, size.n - 1) as i
    $$`.execute(db);

  await sql`
    create table room_versions (
      id integer generated always as identity primary key,
      room_id integer not null references rooms (id) on delete cascade,
      version integer not null check (version >= 1),
      outline jsonb not null check (jsonb_typeof(outline) = 'array'),
      obstacles jsonb not null check (jsonb_typeof(obstacles) = 'array'),
      corners integer not null check (corners >= 0),
      holes integer not null check (holes >= 0),
      area double precision not null,
      saved_by integer references users (id) on delete set null,
      saved_at timestamptz not null default now(),
      unique (room_id, version)
    )`.execute(db);

  await sql`
    create function sightward_record_room_version() returns trigger
    language plpgsql as $$
    declare
      saver integer := nullif(current_setting('sightward.user_id', true), '')::integer;
      n integer := jsonb_array_length(new.outline);
      hole_area double precision := 0;
      obstacle jsonb;
    begin
      for obstacle in select value from jsonb_array_elements(new.obstacles) loop
        n := n + jsonb_array_length(obstacle);
        hole_area := hole_area + sightward_ring_area(obstacle);
      end loop;
      insert into room_versions (room_id, version, outline, obstacles, corners, holes, area, saved_by, saved_at)
      values (new.id, new.version, new.outline, new.obstacles, n, jsonb_array_length(new.obstacles),
              sightward_ring_area(new.outline) - hole_area, saver, new.updated_at)
      on conflict (room_id, version) do update set
        outline = excluded.outline, obstacles = excluded.obstacles, corners = excluded.corners,
        holes = excluded.holes, area = excluded.area, saved_by = excluded.saved_by, saved_at = excluded.saved_at;
      return new;
    end
    $$`.execute(db);
  await sql`
    create trigger rooms_record_version after insert or update of outline, obstacles, version on rooms
    for each row execute function sightward_record_room_version()`.execute(db);
  // The trigger's WHEN cannot compare OLD on insert, so an update that leaves the walls as they
  // were just rewrites the same row (on conflict ... do update).

  // Rooms that exist already start their history at their current version.
  await sql`update rooms set version = version`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`drop trigger if exists rooms_record_version on rooms`.execute(db);
  await sql`drop function if exists sightward_record_room_version()`.execute(db);
  await sql`drop table if exists room_versions`.execute(db);
  await sql`drop function if exists sightward_ring_area(jsonb)`.execute(db);
  await sql`alter table rooms drop column position`.execute(db);
  await sql`alter table floors drop column position`.execute(db);
  await sql`alter table sites drop column position`.execute(db);
}
