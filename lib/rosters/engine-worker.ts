// The staffing engine's own thread (started by engine-thread.ts): building a week takes seconds of
// pure computation, which must not stall the Next.js server's requests on the main thread.
import { parentPort, workerData } from "node:worker_threads";
import { buildRoster } from "@/lib/scheduling/engine";
import type { Scenario } from "@/lib/scheduling/scenario";

const { scenario, timeLimit } = workerData as { scenario: Scenario; timeLimit?: number };

buildRoster(scenario, timeLimit === undefined ? {} : { timeLimit }).then(
  (result) => parentPort!.postMessage({ ok: true, result }),
  (error: unknown) => parentPort!.postMessage({ ok: false, message: error instanceof Error ? error.message : String(error) }),
);
