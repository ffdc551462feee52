// npm run worker: runs queued jobs (roster builds, roster mails) in a process of its own, beside
// or instead of the web server's worker (start the server with SIGHTWARD_JOB_WORKER=off to leave
// every job to it). Several may run at once: each job is taken by exactly one. Stops on SIGTERM or
// SIGINT after the job at hand; a worker killed mid-job leaves the job to be taken again once it is
// stale (2 minutes without progress), never a half-written roster (a draft is stored in one
// transaction).
import { createDb } from "../db";
import { rosterJobHandlers } from "../lib/rosters/jobs";
import { startWorker } from "../lib/jobs/worker";

const db = createDb(process.env.DATABASE_URL, { max: 2 });
const worker = startWorker(db, { ...rosterJobHandlers });
console.log(`[jobs] worker ${process.pid} polling for jobs every second`);

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`[jobs] worker ${process.pid}: ${signal}, stopping after the job at hand`);
  await worker.stop();
  await db.destroy();
  process.exit(0);
}
process.on("SIGTERM", () => void stop("SIGTERM"));
process.on("SIGINT", () => void stop("SIGINT"));
