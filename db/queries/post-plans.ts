// Post plans (SQL only): storing a proposed plan (computed by lib/guarding/plan-room.ts), listing,
// approving under the rules, and the posts staffing counts (the latest approved plan per
// exhibition and room).
import type { Kysely } from "kysely";
import { db as appDb } from "../index";
import { toJson, type Database, type PostPlanMethod, type PostPlanOptions, type PostPlanRow } from "../schema";
import type { Point, Ring } from "../../lib/geometry/types";

/** A computed plan as stored (lib/guarding/plan-room.ts computes it; this module only keeps it). */
export interface StoredPlanInput {
  method: PostPlanMethod;
  posts: Point[];
  lowerBound: number | null;
  proven: boolean;
  covered: number;
}

export interface PostPlanView {
  id: number;
  room_id: number;
  exhibition_id: number | null;
  room_version: number;
  method: PostPlanMethod;
  posts: Point[];
  lower_bound: number | null;
  proven: boolean;
  covered: number;
  options: PostPlanOptions;
  status: "proposed" | "approved";
  approved_by: number | null;
  approved_by_name: string | null;
  approved_at: string | null;
  created_at: string;
}

function view(row: PostPlanRow & { approved_by_name?: string | null }): PostPlanView {
  return {
    id: row.id,
    room_id: row.room_id,
    exhibition_id: row.exhibition_id,
    room_version: row.room_version,
    method: row.method,
    posts: row.posts,
    lower_bound: row.lower_bound,
    proven: row.proven,
    covered: row.covered,
    options: row.options,
    status: row.status,
    approved_by: row.approved_by,
    approved_by_name: row.approved_by_name ?? null,
    approved_at: row.approved_at ? row.approved_at.toISOString() : null,
    created_at: row.created_at.toISOString(),
  };
}

/** Stores a computed plan as 'proposed' for the room at `roomVersion`. */
export async function insertProposedPlan(
  plan: { roomId: number; exhibitionId: number | null; roomVersion: number; options: PostPlanOptions; computed: StoredPlanInput },
  db: Kysely<Database> = appDb,
): Promise<PostPlanView> {
  const row = await db
    .insertInto("post_plans")
    .values({
      room_id: plan.roomId,
      exhibition_id: plan.exhibitionId,
      room_version: plan.roomVersion,
      method: plan.computed.method,
      posts: toJson(plan.computed.posts),
      lower_bound: plan.computed.lowerBound,
      proven: plan.computed.proven,
      covered: plan.computed.covered,
      options: toJson(plan.options),
    })
    .returningAll()
    .executeTakeFirstOrThrow();
  return view(row);
}

/** A room's plans, newest first (optionally only one exhibition's). */
export async function postPlansForRoom(roomId: number, exhibitionId?: number | null, db: Kysely<Database> = appDb): Promise<PostPlanView[]> {
  let query = db
    .selectFrom("post_plans")
    .leftJoin("users", "users.id", "post_plans.approved_by")
    .selectAll("post_plans")
    .select("users.name as approved_by_name")
    .where("post_plans.room_id", "=", roomId);
  if (exhibitionId !== undefined) {
    query = exhibitionId === null ? query.where("post_plans.exhibition_id", "is", null) : query.where("post_plans.exhibition_id", "=", exhibitionId);
  }
  return (await query.orderBy("post_plans.created_at", "desc").orderBy("post_plans.id", "desc").execute()).map(view);
}

/** Every plan of an exhibition with its room's name and current version, newest first. */
export async function postPlansForExhibition(exhibitionId: number, db: Kysely<Database> = appDb) {
  const rows = await db
    .selectFrom("post_plans")
    .innerJoin("rooms", "rooms.id", "post_plans.room_id")
    .leftJoin("users", "users.id", "post_plans.approved_by")
    .selectAll("post_plans")
    .select(["rooms.name as room_name", "rooms.version as current_room_version", "users.name as approved_by_name"])
    .where("post_plans.exhibition_id", "=", exhibitionId)
    .orderBy("rooms.name")
    .orderBy("post_plans.created_at", "desc")
    .orderBy("post_plans.id", "desc")
    .execute();
  return rows.map((row) => ({ ...view(row), room_name: row.room_name, current_room_version: row.current_room_version }));
}

export async function postPlanById(planId: number, db: Kysely<Database> = appDb): Promise<PostPlanView | null> {
  const row = await db
    .selectFrom("post_plans")
    .leftJoin("users", "users.id", "post_plans.approved_by")
    .selectAll("post_plans")
    .select("users.name as approved_by_name")
    .where("post_plans.id", "=", planId)
    .executeTakeFirst();
  return row ? view(row) : null;
}

export type Approval =
  | { ok: true; plan: PostPlanView; alreadyApproved: boolean }
  | { ok: false; reason: "not-found"; message: string }
  | { ok: false; reason: "stale"; message: string; roomVersion: number; planRoomVersion: number }
  | { ok: false; reason: "not-covered"; message: string; covered: number };

/**
 * Approves a plan when it was computed for the room's current walls and sees the whole floor; in
 * one transaction with the plan and room rows locked, so a concurrent wall edit cannot slip between
 * the check and the approval. Approving an approved plan again changes nothing.
 */
export async function approvePostPlan(planId: number, userId: number, db: Kysely<Database> = appDb): Promise<Approval> {
  return db.transaction().execute(async (trx) => {
    const plan = await trx.selectFrom("post_plans").selectAll().where("id", "=", planId).forUpdate().executeTakeFirst();
    if (!plan) return { ok: false, reason: "not-found", message: `There is no post plan ${planId}.` };
    const room = await trx.selectFrom("rooms").select(["version", "name"]).where("id", "=", plan.room_id).forShare().executeTakeFirstOrThrow();
    if (plan.room_version !== room.version) {
      return {
        ok: false,
        reason: "stale",
        message: `This plan was computed for version ${plan.room_version} of ${room.name}, but the room is now at version ${room.version}: someone changed its walls. Compute a new plan and approve that.`,
        roomVersion: room.version,
        planRoomVersion: plan.room_version,
      };
    }
    if (plan.covered < 1) {
      const percent = (plan.covered * 100).toFixed(1);
      return {
        ok: false,
        reason: "not-covered",
        message: `This plan sees ${percent}% of the floor${plan.options.doubleCover ? " twice" : ""}; only a plan that covers the whole room can be approved. Add or unpin posts, widen the sight range or shrink forbidden zones, then compute again.`,
        covered: plan.covered,
      };
    }
    if (plan.status === "approved") {
      return { ok: true, plan: (await postPlanById(planId, trx))!, alreadyApproved: true };
    }
    await trx.updateTable("post_plans").set({ status: "approved", approved_by: userId, approved_at: new Date() }).where("id", "=", planId).execute();
    return { ok: true, plan: (await postPlanById(planId, trx))!, alreadyApproved: false };
  });
}

/** A post as staffing and rosters know it. */
export interface ApprovedPost {
  /** Stable id for rosters: "R<room id>-P<n>". */
  id: string;
  /** The room's name. */
  room: string;
  /** Display label: "<room name> · post <n>". */
  label: string;
  /** ['high-value'] in a high-risk exhibition room, else []. */
  skills: string[];
  /** The room's risk in its exhibition. */
  risk: "standard" | "high";
  roomId: number;
  exhibitionId: number;
  planId: number;
  at: Point;
  /** False when the room's walls changed after the plan was approved (re-plan and approve again). */
  current: boolean;
}

/**
 * The posts staffing counts on `onDate` (YYYY-MM-DD) at a site: for each room of each exhibition
 * running that day, the posts of the latest approved plan. A room in two running exhibitions counts
 * once, with the latest approval.
 */
export async function approvedPostsForSite(siteId: number, onDate: string, db: Kysely<Database> = appDb): Promise<ApprovedPost[]> {
  const rows = await db
    .selectFrom("post_plans")
    .innerJoin("exhibitions", "exhibitions.id", "post_plans.exhibition_id")
    .innerJoin("exhibition_rooms", (join) =>
      join.onRef("exhibition_rooms.exhibition_id", "=", "post_plans.exhibition_id").onRef("exhibition_rooms.room_id", "=", "post_plans.room_id"),
    )
    .innerJoin("rooms", "rooms.id", "post_plans.room_id")
    .innerJoin("floors", "floors.id", "rooms.floor_id")
    .select([
      "post_plans.id",
      "post_plans.room_id",
      "post_plans.exhibition_id",
      "post_plans.posts",
      "post_plans.room_version",
      "rooms.name as room_name",
      "rooms.version as room_current_version",
      "exhibition_rooms.risk_level",
      "floors.level",
    ])
    .distinctOn("post_plans.room_id")
    .where("exhibitions.site_id", "=", siteId)
    .where("exhibitions.starts_on", "<=", onDate)
    .where("exhibitions.ends_on", ">=", onDate)
    .where("post_plans.status", "=", "approved")
    .orderBy("post_plans.room_id")
    .orderBy("post_plans.approved_at", "desc")
    .orderBy("post_plans.id", "desc")
    .execute();
  rows.sort((a, b) => a.level - b.level || a.room_name.localeCompare(b.room_name));
  return rows.flatMap((row) =>
    row.posts.map((at, index) => ({
      id: `R${row.room_id}-P${index + 1}`,
      room: row.room_name,
      label: `${row.room_name} · post ${index + 1}`,
      skills: row.risk_level === "high" ? ["high-value"] : [],
      risk: row.risk_level,
      roomId: row.room_id,
      exhibitionId: row.exhibition_id!,
      planId: row.id,
      at,
      current: row.room_version === row.room_current_version,
    })),
  );
}

export type { PostPlanOptions, Ring };


/** Where an exhibition room's approval stands: the latest approved plan and whether the walls moved since. */
export interface ApprovalState {
  exhibitionId: number;
  exhibitionName: string;
  roomId: number;
  roomName: string;
  roomVersion: number;
  /** The latest approved plan for the exhibition and room, or null when none is approved. */
  planId: number | null;
  planRoomVersion: number | null;
  posts: number | null;
  /** Approved for walls the room no longer has: the roster still staffs the old posts. */
  stale: boolean;
}

/** Every room of the site's exhibitions running on `onDate` (or the given ones), with its approval. */
export async function approvalStates(db: Kysely<Database>, filter: { siteId?: number; onDate?: string; exhibitionIds?: number[]; roomId?: number }): Promise<ApprovalState[]> {
  let query = db
    .selectFrom("exhibition_rooms")
    .innerJoin("exhibitions", "exhibitions.id", "exhibition_rooms.exhibition_id")
    .innerJoin("rooms", "rooms.id", "exhibition_rooms.room_id")
    .leftJoin(
      (eb) =>
        eb
          .selectFrom("post_plans")
          .select(["post_plans.id", "post_plans.room_id", "post_plans.exhibition_id", "post_plans.room_version", "post_plans.posts"])
          .distinctOn(["post_plans.exhibition_id", "post_plans.room_id"])
          .where("post_plans.status", "=", "approved")
          .orderBy("post_plans.exhibition_id")
          .orderBy("post_plans.room_id")
          .orderBy("post_plans.approved_at", "desc")
          .orderBy("post_plans.id", "desc")
          .as("approved"),
      (join) => join.onRef("approved.exhibition_id", "=", "exhibition_rooms.exhibition_id").onRef("approved.room_id", "=", "exhibition_rooms.room_id"),
    )
    .select([
      "exhibitions.id as exhibition_id",
      "exhibitions.name as exhibition_name",
      "rooms.id as room_id",
      "rooms.name as room_name",
      "rooms.version as room_version",
      "approved.id as plan_id",
      "approved.room_version as plan_room_version",
      "approved.posts as plan_posts",
    ])
    .orderBy("exhibitions.starts_on")
    .orderBy("rooms.name");
  if (filter.siteId !== undefined) query = query.where("exhibitions.site_id", "=", filter.siteId);
  if (filter.onDate !== undefined) query = query.where("exhibitions.starts_on", "<=", filter.onDate).where("exhibitions.ends_on", ">=", filter.onDate);
  if (filter.exhibitionIds !== undefined) query = filter.exhibitionIds.length ? query.where("exhibitions.id", "in", filter.exhibitionIds) : query.where((eb) => eb.val(false));
  if (filter.roomId !== undefined) query = query.where("rooms.id", "=", filter.roomId);
  const rows = await query.execute();
  return rows.map((row) => ({
    exhibitionId: row.exhibition_id,
    exhibitionName: row.exhibition_name,
    roomId: row.room_id,
    roomName: row.room_name,
    roomVersion: row.room_version,
    planId: row.plan_id ?? null,
    planRoomVersion: row.plan_room_version ?? null,
    posts: row.plan_posts ? (row.plan_posts as Point[]).length : null,
    stale: row.plan_id != null && row.plan_room_version !== row.room_version,
  }));
}

/** Every room of a floor with the approved posts of the exhibition running on `onDate` (if any). */
export async function floorRoomsWithApprovedPosts(db: Kysely<Database>, floorId: number, onDate: string) {
  const rooms = await db.selectFrom("rooms").select(["id", "name", "outline", "obstacles", "version"]).where("floor_id", "=", floorId).orderBy("position").orderBy("id").execute();
  if (rooms.length === 0) return [];
  const floor = await db.selectFrom("floors").select("site_id").where("id", "=", floorId).executeTakeFirstOrThrow();
  const states = await approvalStates(db, { siteId: floor.site_id, onDate });
  const planIds = states.filter((s) => s.planId !== null && rooms.some((r) => r.id === s.roomId)).map((s) => s.planId!);
  const plans = planIds.length ? await db.selectFrom("post_plans").select(["id", "posts"]).where("id", "in", planIds).execute() : [];
  return rooms.map((room) => {
    const state = states.find((s) => s.roomId === room.id && s.planId !== null) ?? states.find((s) => s.roomId === room.id) ?? null;
    const plan = state?.planId ? plans.find((p) => p.id === state.planId) : undefined;
    return { ...room, exhibition: state?.exhibitionName ?? null, posts: plan ? (plan.posts as Point[]) : null, stale: state?.stale ?? false };
  });
}
