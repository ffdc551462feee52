// Runs the staffing engine (lib/scheduling's buildRoster) in a worker thread, so the server's event
// loop keeps answering requests while a week is built, and reports that it is still working.
import { Worker } from "node:worker_threads";
import type { RosterResult } from "@/lib/scheduling/engine";
import type { Scenario } from "@/lib/scheduling/scenario";

export interface EngineThreadOptions {
  timeLimit?: number;
  /** Called every `heartbeatMs` while the engine works, with the seconds since it started. */
  onWorking?: (seconds: number) => Promise<void> | void;
  heartbeatMs?: number;
}

type EngineAnswer = { ok: true; result: RosterResult } | { ok: false; message: string };

// Under vitest and tsx this module is TypeScript source, and so is the worker entry: the worker
// then needs tsx's loader (a development dependency). In a Next.js server (dev or after
// `next build`) Turbopack has compiled the entry to JavaScript; it defines NEXT_RUNTIME there
// (import.meta.url cannot tell: the bundle reports the source file's address).
const RUNS_FROM_SOURCE = process.env.NEXT_RUNTIME === undefined;

// A worker's --import flag does not reach its module loader on Node 20, so register tsx in code.
function throughTsx(entryUrl: string): string {
  return `import("tsx/esm/api").then((tsx) => { tsx.register(); return import(${JSON.stringify(entryUrl)}); });`;
}

export function buildRosterOffThread(scenario: Scenario, options: EngineThreadOptions = {}): Promise<RosterResult> {
  const heartbeatMs = options.heartbeatMs ?? 5000;
  return new Promise<RosterResult>((resolve, reject) => {
    const began = Date.now();
    let settled = false;
    const workerData = { scenario, timeLimit: options.timeLimit };
    const worker = RUNS_FROM_SOURCE
      ? new Worker(throughTsx(import.meta.url.replace(/engine-thread\.ts$/, "engine-worker.ts")), { eval: true, workerData })
      : // The bundler (Turbopack) recognises `new Worker(new URL("./…", import.meta.url))` and emits
        // the entry with everything it imports as its own chunk, loadable after `next build`.
        new Worker(new URL("./engine-worker.ts", import.meta.url), { workerData });
    const heartbeat = setInterval(() => {
      void Promise.resolve(options.onWorking?.(Math.round((Date.now() - began) / 1000))).catch(() => {});
    }, heartbeatMs);
    const finish = (outcome: () => void) => {
      if (settled) return;
      settled = true;
      clearInterval(heartbeat);
      outcome();
    };
    worker.once("message", (answer: EngineAnswer) => {
      finish(() => (answer.ok ? resolve(answer.result) : reject(new Error(answer.message))));
      void worker.terminate();
    });
    worker.once("error", (error) => finish(() => reject(new Error(`the staffing engine's thread failed: ${error.message}`))));
    worker.once("exit", (code) => finish(() => reject(new Error(`the staffing engine's thread stopped (exit code ${code}) before answering`))));
  });
}
