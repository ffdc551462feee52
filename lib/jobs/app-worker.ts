// The job worker of the Next.js server process (started by instrumentation.ts): one per process,
// kept on globalThis so a development reload does not start a second one.
import { db } from "@/db";
import { rosterJobHandlers } from "@/lib/rosters/jobs";
import { startWorker, type RunningWorker } from "./worker";

const holder = globalThis as unknown as { sightwardJobWorker?: RunningWorker };

export function startAppJobWorker(): void {
  if (holder.sightwardJobWorker) return;
  if (process.env.SIGHTWARD_JOB_WORKER === "off") {
    console.log("[jobs] worker off (SIGHTWARD_JOB_WORKER=off): queued jobs wait for another process");
    return;
  }
  holder.sightwardJobWorker = startWorker(db, { ...rosterJobHandlers });
  console.log("[jobs] worker polling for jobs every second");
}
