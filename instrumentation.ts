// Runs once when a Next.js server process starts: the background job worker lives in the Node.js
// server (not the edge runtime, not `next build`), polling PostgreSQL for queued jobs. On SIGTERM
// or SIGINT the planning pool ends its threads at once, so the requests waiting for a plan answer
// (503, try again) and Next.js's graceful close does not wait for plans to finish.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  const { startAppJobWorker } = await import("./lib/jobs/app-worker");
  startAppJobWorker();
  const { shutDownPlanPoolOnSignals } = await import("./lib/guarding/plan-pool");
  shutDownPlanPoolOnSignals();
}
