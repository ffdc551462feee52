// The messages between the planning pool (plan-pool.ts) and its threads (plan-pool-worker.ts), and
// the pool's "full" error (here so that route() can recognise it without loading the pool).
import type { Room } from "../geometry/types";
import type { NamedRoom } from "../geometry/geojson";
import type { RoomOutcome, RoomReportOptions } from "./room-report";
import type { PlanProgress, PostPlanRequest, planPostPlan } from "./plan-room";

/** Options a job carries across the thread boundary: no callbacks, no signal, no deadline (the pool sets it). */
type Transferable<T> = Omit<T, "onProgress" | "signal" | "deadline">;

export type PlanJob =
  /** The `posts` command's room answer (the plan preview and the command's batch). */
  | { kind: "report"; named: NamedRoom; options: Transferable<RoomReportOptions> }
  /** A plan to store as proposed (saving a plan from the room page). */
  | { kind: "storable"; room: Room; request: Transferable<PostPlanRequest> };

export type PlanJobResult =
  | { kind: "report"; outcome: RoomOutcome }
  | { kind: "storable"; outcome: ReturnType<typeof planPostPlan> };

export type WorkerReply =
  /** Sent once, when the thread has loaded the planner and takes jobs. */
  | { id: 0; type: "ready" }
  | { id: number; type: "progress"; progress: PlanProgress }
  | { id: number; type: "done"; result: PlanJobResult }
  | { id: number; type: "stopped"; reason: "deadline" | "cancelled" }
  | { id: number; type: "failed"; message: string };

/** Thrown by PlanPool.run() when every thread is busy and the queue is full. */
export class PlanPoolFull extends Error {
  constructor(readonly retryAfterSeconds: number) {
    super(`Every planner is busy with other rooms; try again in ${retryAfterSeconds} s.`);
    this.name = "PlanPoolFull";
  }
}
