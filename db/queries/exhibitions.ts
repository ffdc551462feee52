// Exhibitions and the rooms in them, with each room's risk level, sight range and double cover.
// Saving replaces the room list as a whole, in one transaction.
import type { Kysely, Transaction } from "kysely";
import type { Database, RiskLevel } from "../schema";

type Handle = Kysely<Database> | Transaction<Database>;

export interface ExhibitionRoomSetting {
  roomId: number;
  riskLevel: RiskLevel;
  sightRange: number | null;
  doubleCover: boolean;
}

export interface ExhibitionInput {
  siteId: number;
  name: string;
  startsOn: string;
  endsOn: string;
  rooms: ExhibitionRoomSetting[];
}

export interface ExhibitionDetail extends ExhibitionInput {
  id: number;
}

const day = (value: unknown) => (value instanceof Date ? value.toISOString().slice(0, 10) : String(value).slice(0, 10));

export async function exhibitionById(handle: Handle, id: number): Promise<ExhibitionDetail | null> {
  const row = await handle.selectFrom("exhibitions").selectAll().where("id", "=", id).executeTakeFirst();
  if (!row) return null;
  const rooms = await handle.selectFrom("exhibition_rooms").selectAll().where("exhibition_id", "=", id).orderBy("room_id").execute();
  return {
    id: row.id,
    siteId: row.site_id,
    name: row.name,
    startsOn: day(row.starts_on),
    endsOn: day(row.ends_on),
    rooms: rooms.map((r) => ({ roomId: r.room_id, riskLevel: r.risk_level, sightRange: r.sight_range === null ? null : Number(r.sight_range), doubleCover: r.double_cover })),
  };
}

/** Rooms of `roomIds` that are not on the site (by id). */
export async function roomsNotOnSite(handle: Handle, siteId: number, roomIds: number[]): Promise<number[]> {
  if (roomIds.length === 0) return [];
  const found = await handle
    .selectFrom("rooms")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .select("rooms.id")
    .where("floors.site_id", "=", siteId)
    .where("rooms.id", "in", roomIds)
    .execute();
  const on = new Set(found.map((r) => r.id));
  return roomIds.filter((id) => !on.has(id));
}

export async function exhibitionNameTaken(handle: Handle, siteId: number, name: string, exceptId?: number): Promise<boolean> {
  let query = handle.selectFrom("exhibitions").select("id").where("site_id", "=", siteId).where("name", "=", name);
  if (exceptId !== undefined) query = query.where("id", "!=", exceptId);
  return (await query.executeTakeFirst()) !== undefined;
}

async function replaceRooms(trx: Transaction<Database>, id: number, rooms: ExhibitionRoomSetting[]) {
  await trx.deleteFrom("exhibition_rooms").where("exhibition_id", "=", id).execute();
  if (rooms.length === 0) return;
  await trx
    .insertInto("exhibition_rooms")
    .values(rooms.map((r) => ({ exhibition_id: id, room_id: r.roomId, risk_level: r.riskLevel, sight_range: r.sightRange, double_cover: r.doubleCover })))
    .execute();
}

export async function createExhibition(trx: Transaction<Database>, input: ExhibitionInput): Promise<ExhibitionDetail> {
  const { id } = await trx
    .insertInto("exhibitions")
    .values({ site_id: input.siteId, name: input.name, starts_on: input.startsOn, ends_on: input.endsOn })
    .returning("id")
    .executeTakeFirstOrThrow();
  await replaceRooms(trx, id, input.rooms);
  return (await exhibitionById(trx, id))!;
}

export async function updateExhibition(trx: Transaction<Database>, id: number, input: Omit<ExhibitionInput, "siteId">): Promise<ExhibitionDetail> {
  await trx.updateTable("exhibitions").set({ name: input.name, starts_on: input.startsOn, ends_on: input.endsOn }).where("id", "=", id).execute();
  await replaceRooms(trx, id, input.rooms);
  return (await exhibitionById(trx, id))!;
}

/** Site rooms for the editor's room list: id, name, floor. */
export async function roomsOfSite(handle: Handle, siteId: number) {
  return handle
    .selectFrom("rooms")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .select(["rooms.id", "rooms.name", "floors.name as floor"])
    .where("floors.site_id", "=", siteId)
    .orderBy("floors.position")
    .orderBy("floors.id")
    .orderBy("rooms.position")
    .orderBy("rooms.id")
    .execute();
}
