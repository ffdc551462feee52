// Runs once when a Next.js server process starts: the background job worker lives in the Node.js
// server (not the edge runtime, not `next build`), polling PostgreSQL for queued jobs.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  const { startAppJobWorker } = await import("./lib/jobs/app-worker");
  startAppJobWorker();
}
