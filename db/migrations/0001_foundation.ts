// The foundation tables: people and roles, the site with its floors and rooms, the exhibition,
// guards, and rosters with their shifts. Later features add their own migrations after this one.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    create table users (
      id integer generated always as identity primary key,
      email text not null unique check (email = lower(email) and email like '%@%'),
      name text not null,
      password_hash text not null,
      role text not null check (role in ('admin', 'operations', 'curator', 'guard')),
      created_at timestamptz not null default now()
    )`.execute(db);

  await sql`
    create table sites (
      id integer generated always as identity primary key,
      name text not null,
      time_zone text not null,
      hourly_rate numeric(10, 2) not null check (hourly_rate >= 0),
      opening_hours jsonb not null check (jsonb_typeof(opening_hours) = 'object')
    )`.execute(db);

  await sql`
    create table floors (
      id integer generated always as identity primary key,
      site_id integer not null references sites (id) on delete cascade,
      name text not null,
      level integer not null
    )`.execute(db);
  await sql`create index floors_site_id on floors (site_id)`.execute(db);

  await sql`
    create table rooms (
      id integer generated always as identity primary key,
      floor_id integer not null references floors (id) on delete cascade,
      name text not null,
      outline jsonb not null check (jsonb_typeof(outline) = 'array'),
      obstacles jsonb not null default '[]' check (jsonb_typeof(obstacles) = 'array'),
      version integer not null default 1 check (version >= 1),
      updated_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index rooms_floor_id on rooms (floor_id)`.execute(db);

  await sql`
    create table exhibitions (
      id integer generated always as identity primary key,
      site_id integer not null references sites (id) on delete cascade,
      name text not null,
      starts_on date not null,
      ends_on date not null,
      check (ends_on >= starts_on)
    )`.execute(db);
  await sql`create index exhibitions_site_id on exhibitions (site_id)`.execute(db);

  await sql`
    create table exhibition_rooms (
      exhibition_id integer not null references exhibitions (id) on delete cascade,
      room_id integer not null references rooms (id) on delete cascade,
      risk_level text not null default 'standard' check (risk_level in ('standard', 'high')),
      sight_range numeric check (sight_range is null or sight_range > 0),
      double_cover boolean not null default false,
      primary key (exhibition_id, room_id)
    )`.execute(db);
  await sql`create index exhibition_rooms_room_id on exhibition_rooms (room_id)`.execute(db);

  await sql`
    create table guards (
      id integer generated always as identity primary key,
      user_id integer unique references users (id) on delete set null,
      site_id integer not null references sites (id) on delete cascade,
      name text not null,
      email text not null,
      contract_hours numeric not null check (contract_hours >= 0),
      max_hours numeric not null default 48 check (max_hours > 0),
      skills text[] not null default '{}'
    )`.execute(db);
  await sql`create index guards_site_id on guards (site_id)`.execute(db);

  await sql`
    create table rosters (
      id integer generated always as identity primary key,
      site_id integer not null references sites (id) on delete cascade,
      starts_on date not null,
      days integer not null check (days > 0),
      status text not null default 'draft' check (status in ('draft', 'published')),
      version integer not null default 1 check (version >= 1),
      published_at timestamptz,
      created_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index rosters_site_id on rosters (site_id, starts_on)`.execute(db);

  await sql`
    create table shifts (
      id integer generated always as identity primary key,
      roster_id integer not null references rosters (id) on delete cascade,
      guard_id integer not null references guards (id),
      starts_at timestamptz not null,
      ends_at timestamptz not null,
      segments jsonb not null default '[]' check (jsonb_typeof(segments) = 'array'),
      breaks jsonb not null default '[]' check (jsonb_typeof(breaks) = 'array'),
      check (ends_at > starts_at)
    )`.execute(db);
  await sql`create index shifts_roster_id on shifts (roster_id)`.execute(db);
  await sql`create index shifts_guard_id on shifts (guard_id, starts_at)`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const table of ["shifts", "rosters", "guards", "exhibition_rooms", "exhibitions", "rooms", "floors", "sites", "users"]) {
    await sql`drop table if exists ${sql.table(table)}`.execute(db);
  }
}
