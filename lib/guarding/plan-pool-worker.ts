// One planning thread of the server's pool (started by plan-pool.ts): it takes one job at a time,
// runs the one planning pipeline on it, and tells the pool after each stage what the best plan so
// far is, so that a job the pool has to end at its deadline still answers that plan.
import { parentPort } from "node:worker_threads";
import { planRoomReport } from "./room-report";
import { PlanStopped, planPostPlan, type PlanProgress } from "./plan-room";
import type { PlanJob, PlanJobResult, WorkerReply } from "./plan-pool-types";

const port = parentPort!;

function run(job: PlanJob, deadline: number, onProgress: (progress: PlanProgress) => void): PlanJobResult {
  if (job.kind === "report") return { kind: "report", outcome: planRoomReport(job.named, { ...job.options, deadline, onProgress }) };
  return { kind: "storable", outcome: planPostPlan(job.room, { ...job.request, deadline, onProgress }) };
}

port.on("message", ({ id, job, deadline }: { id: number; job: PlanJob; deadline: number }) => {
  const reply = (message: WorkerReply) => port.postMessage(message);
  try {
    const result = run(job, deadline, (progress) => reply({ id, type: "progress", progress }));
    reply({ id, type: "done", result });
  } catch (error) {
    if (error instanceof PlanStopped) reply({ id, type: "stopped", reason: error.reason });
    else reply({ id, type: "failed", message: error instanceof Error ? error.message : String(error) });
  }
});

port.postMessage({ id: 0, type: "ready" } satisfies WorkerReply);
