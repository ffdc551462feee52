// The publish review: what a manager sees before a draft becomes a version, and what is stored
// with the version (rosters.publish_review). Computed from the draft's own rows and scenario.

export type RoomRisk = "high" | "standard";

export interface PublishReview {
  /** The draft revision the review describes. */
  revision: number;
  /** Unfilled post-hours per room, high-risk rooms first. */
  unfilledByRoom: { room: string; risk: RoomRisk; postHours: number }[];
  /** Hours in which a room open to visitors has no guard at any of its posts. */
  emptyRooms: { room: string; risk: RoomRisk; hours: { start: string; end: string }[] }[];
  /** Guards planned over their contract plus accepted extra hours, or over the weekly maximum. */
  overContract: { guardId: number; name: string; contractHours: number; limitHours: number; maxHours: number; plannedHours: number }[];
  /** Manual changes to the draft kept against a rule, with who and why, when the draft records any. */
  overrides: { rule: string; message: string; note: string; by: string | null; at: string | null }[];
  /** True when a high-risk room stands empty in some hour: publishing then needs a typed confirmation and a note. */
  needsConfirmation: boolean;
  /** What to type to confirm (the first empty high-risk room's name), when confirmation is needed. */
  confirmationWord: string | null;
}
