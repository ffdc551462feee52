// The one typed picture of the database (see db/migrations). Column names stay snake_case:
// no CamelCasePlugin, so what you read here is what PostgreSQL holds.
//
// How values travel (set up in db/index.ts):
// - numeric columns come back as JavaScript numbers (parsed with parseFloat);
// - date columns come back as "YYYY-MM-DD" strings (never a Date, which would shift by time zone);
// - timestamptz columns come back as Date;
// - jsonb columns come back parsed; on insert/update pass JSON text, e.g. `toJson(outline)`
//   (node-postgres would send a JavaScript array as a PostgreSQL array, not as JSON).
import type { ColumnType, Generated, GeneratedAlways, Insertable, Selectable, Updateable } from "kysely";
import type { Point, Ring } from "@/lib/geometry/types";
import type { Totals } from "@/lib/scheduling/totals";
import type { PublishReview } from "@/lib/rosters/review";

/** A jsonb column: read as T, written as JSON text (use toJson). */
export type Json<T> = ColumnType<T, string, string>;
/** A numeric column: read as number, written as number or decimal text. */
export type Numeric = ColumnType<number, number | string, number | string>;
/** A date column: "YYYY-MM-DD" both ways. */
export type DateOnly = ColumnType<string, string, string>;
/** A timestamptz column: read as Date, written as Date or ISO text. */
export type Timestamp = ColumnType<Date, Date | string, Date | string>;

/** Serialise a value for a jsonb column. */
export function toJson<T>(value: T): string {
  return JSON.stringify(value);
}

export const ROLES = ["admin", "operations", "curator", "guard"] as const;
export type Role = (typeof ROLES)[number];

export const RISK_LEVELS = ["standard", "high"] as const;
export type RiskLevel = (typeof RISK_LEVELS)[number];

export const ROSTER_STATUSES = ["draft", "published"] as const;
export type RosterStatus = (typeof ROSTER_STATUSES)[number];

export type Weekday = "mon" | "tue" | "wed" | "thu" | "fri" | "sat" | "sun";
/** Local wall-clock opening, ["HH:mm", "HH:mm"], or null when closed. */
export type OpeningSpan = [string, string] | null;
/** A site's opening hours: the weekly pattern plus dated exceptions (scripts/README.md `opening`). */
export interface OpeningHours {
  weekly: Record<Weekday, OpeningSpan>;
  dates: Record<string, OpeningSpan>;
}

/** One stretch of a shift at a post (timestamps as ISO text). */
export interface ShiftSegment {
  post: string;
  start: string;
  end: string;
  [extra: string]: unknown;
}
/** One break in a shift (timestamps as ISO text). */
export interface ShiftBreak {
  start: string;
  end: string;
  [extra: string]: unknown;
}

export interface UsersTable {
  id: GeneratedAlways<number>;
  /** Always lower-case; unique. */
  email: string;
  name: string;
  password_hash: string;
  role: Role;
  created_at: ColumnType<Date, Date | string | undefined, Date | string>;
  /** Set while the account is disabled: sign-in is refused and sessions end (0080). */
  disabled_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  last_sign_in_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
}

/** A single-use link to set a password: an invitation or a reset, kept by its token's SHA-256 (0080). */
export interface AccountLinksTable {
  id: GeneratedAlways<number>;
  user_id: number;
  token_hash: string;
  purpose: "invite" | "reset";
  expires_at: ColumnType<Date, Date | string, Date | string>;
  used_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  created_at: ColumnType<Date, Date | string | undefined, Date | string>;
  created_by: number | null;
}

export interface SitesTable {
  id: GeneratedAlways<number>;
  name: string;
  /** IANA zone, e.g. "Europe/Berlin". */
  time_zone: string;
  hourly_rate: Numeric;
  opening_hours: Json<OpeningHours>;
  /** BCP 47 locale every date, time and number is shown in, e.g. "en-GB" (0006). */
  locale: ColumnType<string, string | undefined, string>;
  /** ISO 4217 code money is shown in, e.g. "EUR" (0006). */
  currency: ColumnType<string, string | undefined, string>;
  /** The site's default labour rules: partial overrides of the engine's rules (0006). */
  labour_rules: ColumnType<SiteLabourRules, string | undefined, string>;
  /** From address of the product's mail; null = the app's default (0006). */
  mail_sender: ColumnType<string | null, string | null | undefined, string | null>;
  /** Order on the galleries page, smallest first (0070). */
  position: ColumnType<number, number | undefined, number>;
}

/**
 * A site's labour-rule defaults as stored: any of the engine's rule fields
 * (lib/scheduling/scenario.ts `rulesSchema`), plus the extra hours a week a guard accepts beyond
 * contract when the guard has no value of their own.
 */
export interface SiteLabourRules {
  acceptedExtraHours?: number;
  [rule: string]: unknown;
}

/** When a guard can work, per weekday: local ["HH:mm", "HH:mm"] spans; a missing day = not available. */
export type WeeklyAvailability = Partial<Record<Weekday, Array<[string, string]>>>;

export interface FloorsTable {
  id: GeneratedAlways<number>;
  site_id: number;
  name: string;
  level: number;
  /** Order on the galleries page, smallest first (0070). */
  position: ColumnType<number, number | undefined, number>;
}

export interface RoomsTable {
  id: GeneratedAlways<number>;
  floor_id: number;
  name: string;
  /** Outer ring in metres, closing point not repeated. */
  outline: Json<Ring>;
  /** Holes: vitrines, plinths, pillars, partitions. */
  obstacles: ColumnType<Ring[], string | undefined, string>;
  /** Optimistic concurrency: bump on every edit, compare on update. */
  version: Generated<number>;
  updated_at: ColumnType<Date, Date | string | undefined, Date | string>;
  /** Order on its floor, smallest first (0070). */
  position: ColumnType<number, number | undefined, number>;
}

export interface ExhibitionsTable {
  id: GeneratedAlways<number>;
  site_id: number;
  name: string;
  starts_on: DateOnly;
  ends_on: DateOnly;
}

export interface ExhibitionRoomsTable {
  exhibition_id: number;
  room_id: number;
  risk_level: RiskLevel;
  /** Metres a guard can watch well; null = unlimited. */
  sight_range: ColumnType<number | null, number | string | null | undefined, number | string | null>;
  double_cover: Generated<boolean>;
}

export interface GuardsTable {
  id: GeneratedAlways<number>;
  user_id: number | null;
  site_id: number;
  name: string;
  email: string;
  contract_hours: Numeric;
  max_hours: ColumnType<number, number | string | undefined, number | string>;
  skills: Generated<string[]>;
  /** The secret in the guard's personal calendar feed address (0004; a random default). */
  calendar_token: Generated<string>;
  /** Extra hours a week beyond contract the guard accepts; null = the site's default (0006). */
  accepted_extra_hours: ColumnType<number | null, number | string | null | undefined, number | string | null>;
  /** False once the guard has left: kept for history, never rostered (0006). */
  active: Generated<boolean>;
  /** Weekly availability; null = any time (0006). */
  availability: ColumnType<WeeklyAvailability | null, string | null | undefined, string | null>;
}

export interface RostersTable {
  id: GeneratedAlways<number>;
  site_id: number;
  starts_on: DateOnly;
  days: number;
  status: ColumnType<RosterStatus, RosterStatus | undefined, RosterStatus>;
  version: Generated<number>;
  published_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  created_at: ColumnType<Date, Date | string | undefined, Date | string>;
  /** The published version this one replaced (0004). */
  supersedes: ColumnType<number | null, number | null | undefined, number | null>;
  /** Bumped by every manual edit of a draft, so publishing what you loaded can be checked (0004). */
  revision: Generated<number>;
  /** The scenario the engine staffed (scripts/README.md roster input), kept so edits are checked by the same rules. */
  scenario: ColumnType<unknown, string | null | undefined, string | null>;
  unfilled: ColumnType<RosterUnfilled[], string | undefined, string>;
  totals: ColumnType<RosterTotals | null, string | null | undefined, string | null>;
  violations: ColumnType<RosterViolation[], string | undefined, string>;
  created_by: ColumnType<number | null, number | null | undefined, number | null>;
  published_by: ColumnType<number | null, number | null | undefined, number | null>;
  /** The draft revision a published version was made from; each revision is published once (0040). */
  draft_revision: ColumnType<number | null, number | null | undefined, number | null>;
  /** What the publish review showed when this version was published (0040). */
  publish_review: ColumnType<PublishReview | null, string | null | undefined, string | null>;
  /** What the manager typed to confirm publishing with a high-risk room empty (0040). */
  publish_confirmation: ColumnType<string | null, string | null | undefined, string | null>;
  /** The manager's note on publishing with a high-risk room empty (0040). */
  publish_note: ColumnType<string | null, string | null | undefined, string | null>;
}

/** A post-slot nobody staffs (timestamps as ISO text), with the engine's reason. */
export interface RosterUnfilled {
  post: string;
  start: string;
  end: string;
  reason: string;
}

/** A roster's totals as the engine computes them (lib/scheduling/totals.ts), as stored. */
export type RosterTotals = Pick<
  Totals,
  "postHours" | "filledPostHours" | "unfilledPostHours" | "paidHours" | "overtimeHours" | "cost" | "lowerBoundCost" | "gap"
> &
  Partial<Pick<Totals, "unfilledLowerBound" | "unfilledBoundReason">> & { [extra: string]: unknown };

/** A broken hard rule (timestamps as ISO text). */
export interface RosterViolation {
  rule: string;
  message: string;
  guard?: string;
  post?: string;
  start?: string;
  end?: string;
}

export const JOB_STATUSES = ["queued", "running", "done", "failed"] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

export interface JobsTable {
  id: GeneratedAlways<number>;
  /** What to do, e.g. 'roster-build', 'roster-publish-mail'. */
  kind: string;
  payload: ColumnType<unknown, string | undefined, string>;
  status: ColumnType<JobStatus, JobStatus | undefined, JobStatus>;
  /** 0..1 */
  progress: ColumnType<number, number | undefined, number>;
  message: ColumnType<string, string | undefined, string>;
  result: ColumnType<unknown, string | null | undefined, string | null>;
  attempts: ColumnType<number, number | undefined, number>;
  locked_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  /** A queued job is not claimed before this time (set when a passing failure is retried later). */
  run_after: ColumnType<Date, Date | string | undefined, Date | string>;
  created_by: ColumnType<number | null, number | null | undefined, number | null>;
  created_at: ColumnType<Date, Date | string | undefined, Date | string>;
  finished_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
}

export const TIME_OFF_STATUSES = ["requested", "approved", "declined"] as const;
export type TimeOffStatus = (typeof TIME_OFF_STATUSES)[number];

export interface TimeOffTable {
  id: GeneratedAlways<number>;
  guard_id: number;
  /** First and last day off, inclusive, as the site's calendar dates. */
  starts_on: DateOnly;
  ends_on: DateOnly;
  note: ColumnType<string, string | undefined, string>;
  status: ColumnType<TimeOffStatus, TimeOffStatus | undefined, TimeOffStatus>;
  decided_by: ColumnType<number | null, number | null | undefined, number | null>;
  decided_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  created_at: ColumnType<Date, Date | string | undefined, Date | string>;
}

export const POST_PLAN_METHODS = ["guaranteed", "fewest"] as const;
export type PostPlanMethod = (typeof POST_PLAN_METHODS)[number];
export const POST_PLAN_STATUSES = ["proposed", "approved"] as const;
export type PostPlanStatus = (typeof POST_PLAN_STATUSES)[number];

/** The conditions a post plan was computed under (rings and points in metres). */
export interface PostPlanOptions {
  sightRange: number | null;
  pinned: Point[];
  forbidden: Ring[];
  doubleCover: boolean;
  [extra: string]: unknown;
}

/** A room's posts computed at one version of its walls; staffing counts the latest approved one. */
export interface PostPlansTable {
  id: GeneratedAlways<number>;
  room_id: number;
  exhibition_id: number | null;
  /** The room's version the plan was computed for; approval needs it to be current. */
  room_version: number;
  method: PostPlanMethod;
  posts: Json<Point[]>;
  lower_bound: number | null;
  proven: boolean;
  /** Seen share of the floor, 0..1. */
  covered: Numeric;
  options: Json<PostPlanOptions>;
  status: ColumnType<PostPlanStatus, PostPlanStatus | undefined, PostPlanStatus>;
  approved_by: ColumnType<number | null, number | null | undefined, number | null>;
  approved_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
  created_at: ColumnType<Date, Date | string | undefined, Date | string>;
}

export interface ShiftsTable {
  id: GeneratedAlways<number>;
  roster_id: number;
  guard_id: number;
  starts_at: Timestamp;
  ends_at: Timestamp;
  segments: ColumnType<ShiftSegment[], string | undefined, string>;
  breaks: ColumnType<ShiftBreak[], string | undefined, string>;
}

/** Every outline a room had, one row per version, written by a trigger on rooms (0070). */
export interface RoomVersionsTable {
  id: GeneratedAlways<number>;
  room_id: number;
  version: number;
  outline: Json<Ring>;
  obstacles: Json<Ring[]>;
  /** n: corners of the outline and every obstacle. */
  corners: number;
  /** h: obstacles (holes). */
  holes: number;
  /** Floor area in m²: the outline's less its obstacles'. */
  area: number;
  /** Who saved it; null when unknown (seed, command line) or the account is gone. */
  saved_by: number | null;
  saved_at: Timestamp;
}

export interface Database {
  users: UsersTable;
  sites: SitesTable;
  floors: FloorsTable;
  rooms: RoomsTable;
  exhibitions: ExhibitionsTable;
  exhibition_rooms: ExhibitionRoomsTable;
  guards: GuardsTable;
  rosters: RostersTable;
  shifts: ShiftsTable;
  jobs: JobsTable;
  time_off: TimeOffTable;
  post_plans: PostPlansTable;
  room_versions: RoomVersionsTable;
  sign_in_throttle: SignInThrottleTable;
  account_links: AccountLinksTable;
  outbox: OutboxTable;
  audit_events: AuditEventsTable;
  roster_overrides: RosterOverridesTable;
}

/** A change to a draft kept against labour rules, with the note saying why, who and when (0110). */
export interface RosterOverridesTable {
  id: GeneratedAlways<number>;
  roster_id: number;
  /** The draft revision the change made. */
  revision: number;
  guard_id: number | null;
  post: string;
  starts_at: Timestamp;
  ends_at: Timestamp;
  rules: string[];
  /** The violations the change was kept with, as stored on the roster (names, not ids). */
  violations: ColumnType<RosterViolation[], string | undefined, string>;
  note: string;
  created_by: number | null;
  created_by_name: string;
  created_at: ColumnType<Date, Date | string | undefined, Date | string>;
}

/** One change someone made (0100); append-only: the database refuses UPDATE and DELETE. */
export interface AuditEventsTable {
  id: GeneratedAlways<string>;
  at: ColumnType<Date, Date | string | undefined, never>;
  actor_id: number | null;
  actor_name: string;
  actor_role: string;
  /** "<area>.<verb>", e.g. "room.save-walls". */
  action: string;
  subject_type: string;
  subject_id: number | null;
  subject_label: ColumnType<string, string | undefined, never>;
  site_id: number | null;
  summary: string;
  changes: ColumnType<Record<string, unknown>, string | undefined, never>;
}

export type OutboxKind = "roster" | "invitation" | "reset" | "notice";
export type OutboxStatus = "queued" | "sent" | "failed";

/** An attachment as the outbox keeps it: its text content (calendar files are text). */
export interface OutboxAttachment {
  filename: string;
  contentType: string;
  content: string;
}

/** One message the product sent or tried to send (0090). */
export interface OutboxTable {
  id: GeneratedAlways<number>;
  kind: OutboxKind;
  sender: string;
  recipient: string;
  subject: string;
  /** The text part; set-password links are stored masked. */
  body: string;
  attachments: ColumnType<OutboxAttachment[], string | undefined, string>;
  status: ColumnType<OutboxStatus, OutboxStatus | undefined, OutboxStatus>;
  attempts: ColumnType<number, number | undefined, number>;
  last_error: string | null;
  message_id: string | null;
  user_id: number | null;
  guard_id: number | null;
  roster_id: number | null;
  created_at: ColumnType<Date, Date | string | undefined, Date | string>;
  updated_at: ColumnType<Date, Date | string | undefined, Date | string>;
  sent_at: ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;
}

/** Failed sign-ins per "account:<e-mail>" and "address:<client>" (migration 0060). */
export interface SignInThrottleTable {
  key: string;
  failures: Generated<number>;
  window_started_at: Generated<Timestamp>;
  locked_until: Timestamp | null;
}

export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type UserUpdate = Updateable<UsersTable>;
export type Site = Selectable<SitesTable>;
export type NewSite = Insertable<SitesTable>;
export type Floor = Selectable<FloorsTable>;
export type NewFloor = Insertable<FloorsTable>;
export type RoomRow = Selectable<RoomsTable>;
export type NewRoom = Insertable<RoomsTable>;
export type RoomUpdate = Updateable<RoomsTable>;
export type Exhibition = Selectable<ExhibitionsTable>;
export type NewExhibition = Insertable<ExhibitionsTable>;
export type ExhibitionRoom = Selectable<ExhibitionRoomsTable>;
export type NewExhibitionRoom = Insertable<ExhibitionRoomsTable>;
export type Guard = Selectable<GuardsTable>;
/** What the people table and the roster scenario read of a guard. */
export type GuardRow = Pick<Guard, "id" | "name" | "email" | "contract_hours" | "max_hours" | "skills"> & { accepted_extra_hours?: Guard["accepted_extra_hours"] | string };
export type NewGuard = Insertable<GuardsTable>;
export type Roster = Selectable<RostersTable>;
export type NewRoster = Insertable<RostersTable>;
export type Shift = Selectable<ShiftsTable>;
export type NewShift = Insertable<ShiftsTable>;
export type Job = Selectable<JobsTable>;
export type TimeOff = Selectable<TimeOffTable>;
export type PostPlanRow = Selectable<PostPlansTable>;
