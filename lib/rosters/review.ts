// The publish review: what a manager sees before a draft becomes a version, and what is stored
// with the version (rosters.publish_review). Computed from the draft's own rows and scenario by the
// engine's safety summary (lib/scheduling/safety.ts).
import type { Kysely } from "kysely";
import type { Database, Roster as RosterRow } from "@/db/schema";
import { guardsOfSite, rosterById, shiftsOfRoster } from "@/db/queries/rosters";
import { buildDemand } from "@/lib/scheduling/demand";
import { emptyRoomStretches, guardHours, roomShortfalls } from "@/lib/scheduling/safety";
import { rosterScenario } from "./edit";
import { RosterProblem } from "./problem";
import { guardIdOfKey } from "./scenario";
import { engineRoster } from "./stored";

export type RoomRisk = "high" | "standard";

export interface PublishReview {
  /** The draft revision the review describes. */
  revision: number;
  /** Unfilled post-hours per room (and hours it stands empty), high-risk rooms first. */
  unfilledByRoom: { room: string; risk: RoomRisk; postHours: number; emptyHours?: number }[];
  /** Hours in which a room open to visitors has no guard at any of its posts. */
  emptyRooms: { room: string; risk: RoomRisk; hours: { start: string; end: string }[] }[];
  /** Guards planned over their contract (within or over the extra hours they accept), or over the weekly maximum. */
  overContract: { guardId: number; name: string; contractHours: number; limitHours: number; maxHours: number; plannedHours: number }[];
  /** Manual changes to the draft kept against a rule, with who and why, when the draft records any. */
  overrides: { rule: string; message: string; note: string; by: string | null; at: string | null }[];
  /** True when a room stands empty in some open hour: publishing then needs a typed confirmation and a note. */
  needsConfirmation: boolean;
  /** What to type to confirm (the first empty room's name, high-risk rooms first), when confirmation is needed. */
  confirmationWord: string | null;
}

type ShiftRows = Awaited<ReturnType<typeof shiftsOfRoster>>;

/** The review of a roster's content (a draft, or what a version was published from). */
export function reviewOf(roster: Pick<RosterRow, "id" | "scenario" | "unfilled" | "revision">, shifts: ShiftRows, names: ReadonlyMap<number, string>): PublishReview {
  const scenario = rosterScenario(roster);
  const demand = buildDemand(scenario);
  const engine = engineRoster({ shifts, unfilled: roster.unfilled });
  const empty = emptyRoomStretches(scenario, engine, demand);
  const emptyRooms: PublishReview["emptyRooms"] = [];
  for (const stretch of empty) {
    let room = emptyRooms.find((r) => r.room === stretch.room);
    if (!room) emptyRooms.push((room = { room: stretch.room, risk: stretch.risk, hours: [] }));
    room.hours.push({ start: new Date(stretch.start).toISOString(), end: new Date(stretch.end).toISOString() });
  }
  const overContract = guardHours(scenario, engine, demand)
    .filter((g) => g.plannedHours > g.contractHours + 1e-6 || g.plannedHours > g.maxHours + 1e-6)
    .map((g) => {
      const guardId = guardIdOfKey(g.guard) ?? 0;
      return { guardId, name: names.get(guardId) ?? g.guard, contractHours: g.contractHours, limitHours: g.limitHours, maxHours: g.maxHours, plannedHours: g.plannedHours };
    })
    .sort((a, b) => b.plannedHours - b.limitHours - (a.plannedHours - a.limitHours) || a.name.localeCompare(b.name));
  const round = (h: number) => Math.round(h * 100) / 100;
  return {
    revision: roster.revision,
    unfilledByRoom: roomShortfalls(scenario, engine, empty).map((r) => ({ room: r.room, risk: r.risk, postHours: round(r.postHours), emptyHours: round(r.emptyHours) })),
    emptyRooms,
    overContract,
    // Manual changes are checked by the rules and refused when they break one, so none is kept against a rule.
    overrides: [],
    needsConfirmation: emptyRooms.length > 0,
    confirmationWord: emptyRooms[0]?.room ?? null,
  };
}

/** The review of a roster by id (the draft the manager is about to publish). */
export async function reviewOfRoster(db: Kysely<Database>, rosterId: number): Promise<PublishReview> {
  const roster = await rosterById(db, rosterId);
  if (!roster) throw new RosterProblem(404, "not-found", `No roster with id ${rosterId}.`);
  const [shifts, guards] = await Promise.all([shiftsOfRoster(db, roster.id), guardsOfSite(db, roster.site_id)]);
  return reviewOf(roster, shifts, new Map(guards.map((g) => [g.id, g.name])));
}

/**
 * Refuses a publication the review says needs saying so: with a room empty in an open hour, the
 * manager must type the room's name (any case, outer spaces ignored) and give a note.
 */
export function requireConfirmation(review: PublishReview, confirmation: string | undefined, note: string | undefined): void {
  if (!review.needsConfirmation) return;
  const first = review.emptyRooms[0]!;
  const typed = (confirmation ?? "").trim().toLocaleLowerCase();
  const typedOk = typed === (review.confirmationWord ?? "").trim().toLocaleLowerCase();
  if (typedOk && (note ?? "").trim().length > 0) return;
  const rooms = review.emptyRooms.map((r) => `${r.room}${r.risk === "high" ? " (high risk)" : ""}`).join(", ");
  throw new RosterProblem(
    422,
    "confirmation-needed",
    `This week leaves ${review.emptyRooms.length === 1 ? "a room" : `${review.emptyRooms.length} rooms`} without a guard while open: ${rooms}. Close ${first.room} to visitors for those hours or add guards; to publish anyway, type "${review.confirmationWord}" and give a note.`,
    { field: typedOk ? "note" : "confirmation", review },
  );
}
