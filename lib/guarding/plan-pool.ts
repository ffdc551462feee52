// The server's planning pool: every plan the server computes (the plan preview, saving a plan, the
// `posts` command's batch) runs here, in worker threads, so the request thread only parses, queues
// and answers. Sized to the machine's cores less one. A full queue is refused at once (the route
// answers 503 with Retry-After); each job has a hard deadline enforced by ending its thread, and
// the answer then carries the best plan found so far (the guaranteed plan once it exists) and why
// it stopped; a cancelled request ends its job the same way; a thread that runs out of memory is
// replaced and its job answers what it had.
//
// Why our own pool over node:worker_threads rather than a pool library: Next.js's bundler compiles
// a worker entry (and everything it imports, TypeScript and path aliases included) only when it
// sees `new Worker(new URL("./entry.ts", import.meta.url))` in the source; pool libraries build
// their threads from a file name they load themselves, which after `next build` does not exist.
import { Worker } from "node:worker_threads";
import { availableParallelism } from "node:os";
import type { PlanProgress } from "./plan-room";
import { PlanPoolFull, type PlanJob, type PlanJobResult, type WorkerReply } from "./plan-pool-types";

export { PlanPoolFull, type PlanJob, type PlanJobResult } from "./plan-pool-types";

export interface PlanPoolOptions {
  /** Threads (default: cores less one, at least one; SIGHTWARD_PLAN_WORKERS). */
  size?: number;
  /** Jobs that may wait for a thread (default 4 per thread; SIGHTWARD_PLAN_QUEUE). */
  queue?: number;
  /** Heap limit of each thread in MB (default 1024; SIGHTWARD_PLAN_WORKER_MB). */
  workerMemoryMb?: number;
  /** Seconds between the deadline the pipeline is told and the moment the thread is ended (default 2). */
  graceSeconds?: number;
}

export interface RunOptions {
  /** Seconds the job may take once a thread has it; planning stops between stages at this point. */
  seconds: number;
  /** An aborted signal (the request was cancelled, the editor closed) ends the job. */
  signal?: AbortSignal;
  /** Called with each stage's progress the thread reports (the best plan so far, the timings). */
  onProgress?: (progress: PlanProgress) => void;
}

/** Why a job was ended: its deadline, its request was cancelled, its thread's heap, or the server stopping. */
export type StopReason = "deadline" | "cancelled" | "memory-limit" | "shutdown";

export type PoolAnswer =
  | { status: "done"; result: PlanJobResult; ms: number }
  /** The job was ended; `progress` is the last the thread reported (its best plan and the room's facts). */
  | { status: "stopped"; reason: StopReason; progress?: PlanProgress; ms: number }
  | { status: "failed"; message: string; ms: number };


// Under vitest and tsx this module is TypeScript source, and so is the worker entry: the thread then
// needs tsx's loader. In a Next.js server Turbopack has compiled the entry; it defines NEXT_RUNTIME.
const RUNS_FROM_SOURCE = process.env.NEXT_RUNTIME === undefined;

function throughTsx(entryUrl: string): string {
  return `import("tsx/esm/api").then((tsx) => { tsx.register(); return import(${JSON.stringify(entryUrl)}); });`;
}

interface Pending {
  id: number;
  job: PlanJob;
  options: RunOptions;
  queuedAt: number;
  resolve: (answer: PoolAnswer) => void;
  onAbort?: () => void;
}

interface Running extends Pending {
  startedAt: number;
  progress?: PlanProgress;
  timer: ReturnType<typeof setTimeout>;
}

interface Slot {
  worker: Worker;
  /** The thread has loaded the planner (a job's clock starts only then). */
  ready: boolean;
  running?: Running;
}

const envNumber = (name: string): number | undefined => {
  const value = Number(process.env[name]);
  return Number.isFinite(value) && value > 0 ? value : undefined;
};

export class PlanPool {
  readonly size: number;
  readonly queueLimit: number;
  private readonly memoryMb: number;
  private readonly graceMs: number;
  private readonly slots: Slot[] = [];
  private readonly queue: Pending[] = [];
  private nextId = 1;
  private closed = false;
  /** Recent job durations (ms), for the Retry-After estimate. */
  private readonly recent: number[] = [];

  constructor(options: PlanPoolOptions = {}) {
    this.size = Math.max(1, Math.floor(options.size ?? envNumber("SIGHTWARD_PLAN_WORKERS") ?? availableParallelism() - 1));
    const queueFromEnv = process.env.SIGHTWARD_PLAN_QUEUE === undefined ? undefined : Number(process.env.SIGHTWARD_PLAN_QUEUE);
    const queue = options.queue ?? (Number.isFinite(queueFromEnv) ? queueFromEnv! : this.size * 4);
    this.queueLimit = Math.max(0, Math.floor(queue));
    this.memoryMb = options.workerMemoryMb ?? envNumber("SIGHTWARD_PLAN_WORKER_MB") ?? 1024;
    this.graceMs = (options.graceSeconds ?? envNumber("SIGHTWARD_PLAN_GRACE_SECONDS") ?? 2) * 1000;
  }

  /** Threads planning now, jobs waiting, and the limits. */
  stats(): { size: number; busy: number; queued: number; queueLimit: number } {
    return { size: this.size, busy: this.slots.filter((s) => s.running).length, queued: this.queue.length, queueLimit: this.queueLimit };
  }

  /** Queues a job; resolves with its answer. Throws PlanPoolFull at once when nothing can take it. */
  run(job: PlanJob, options: RunOptions): Promise<PoolAnswer> {
    if (this.closed) return Promise.resolve({ status: "stopped", reason: "shutdown", ms: 0 });
    if (options.signal?.aborted) return Promise.resolve({ status: "stopped", reason: "cancelled", ms: 0 });
    const running = this.slots.filter((s) => s.running).length;
    if (this.queue.length >= this.queueLimit + (this.size - running)) throw new PlanPoolFull(this.retryAfter());
    return new Promise<PoolAnswer>((resolve) => {
      const pending: Pending = { id: this.nextId++, job, options, queuedAt: Date.now(), resolve };
      if (options.signal) {
        pending.onAbort = () => this.cancel(pending);
        options.signal.addEventListener("abort", pending.onAbort, { once: true });
      }
      this.queue.push(pending);
      this.pump();
    });
  }

  /** Ends every thread; running and queued jobs answer "stopped" with reason "shutdown". */
  async close(): Promise<void> {
    this.closed = true;
    for (const pending of this.queue.splice(0)) this.settle(pending, { status: "stopped", reason: "shutdown", ms: 0 });
    await Promise.all(
      this.slots.splice(0).map((slot) => {
        const running = slot.running;
        if (running) this.finish(slot, { status: "stopped", reason: "shutdown", progress: running.progress, ms: Date.now() - running.startedAt });
        return slot.worker.terminate();
      }),
    );
  }

  private retryAfter(): number {
    const typical = this.recent.length ? this.recent.reduce((a, b) => a + b, 0) / this.recent.length : 5000;
    const waves = Math.ceil((this.queue.length + 1) / this.size);
    return Math.max(1, Math.min(120, Math.ceil((typical * waves) / 1000)));
  }

  private spawn(): Slot {
    const resourceLimits = { maxOldGenerationSizeMb: this.memoryMb };
    const worker = RUNS_FROM_SOURCE
      ? new Worker(throughTsx(import.meta.url.replace(/plan-pool\.ts$/, "plan-pool-worker.ts")), { eval: true, resourceLimits })
      : new Worker(new URL("./plan-pool-worker.ts", import.meta.url), { resourceLimits });
    const slot: Slot = { worker, ready: false };
    worker.unref();
    worker.on("message", (reply: WorkerReply) => this.receive(slot, reply));
    worker.on("error", (error: Error & { code?: string }) => this.lose(slot, error));
    worker.on("exit", (code) => this.lose(slot, new Error(`the planning thread stopped (exit code ${code})`)));
    this.slots.push(slot);
    return slot;
  }

  private pump(): void {
    if (this.closed) return;
    while (this.queue.length > 0) {
      const slot = this.slots.find((s) => s.ready && !s.running);
      if (!slot) break;
      this.start(slot, this.queue.shift()!);
    }
    // Threads still loading will take the next jobs; start more only for the jobs beyond them.
    const loading = this.slots.filter((s) => !s.ready).length;
    for (let extra = this.queue.length - loading; extra > 0 && this.slots.length < this.size; extra--) this.spawn();
  }

  private start(slot: Slot, pending: Pending): void {
    const startedAt = Date.now();
    const deadline = startedAt + pending.options.seconds * 1000;
    const timer = setTimeout(() => this.end(slot, "deadline"), pending.options.seconds * 1000 + this.graceMs);
    slot.running = { ...pending, startedAt, timer };
    // A busy thread keeps the process alive (the `posts` command waits for it); an idle one does not.
    slot.worker.ref();
    slot.worker.postMessage({ id: pending.id, job: pending.job, deadline });
  }

  private receive(slot: Slot, reply: WorkerReply): void {
    if (reply.type === "ready") {
      slot.ready = true;
      this.pump();
      return;
    }
    const running = slot.running;
    if (!running || reply.id !== running.id) return;
    const ms = Date.now() - running.startedAt;
    if (reply.type === "progress") {
      running.progress = reply.progress;
      running.options.onProgress?.(reply.progress);
    }
    else if (reply.type === "done") this.finish(slot, { status: "done", result: reply.result, ms });
    else if (reply.type === "stopped") this.finish(slot, { status: "stopped", reason: reply.reason, progress: running.progress, ms });
    else this.finish(slot, { status: "failed", message: reply.message, ms });
  }

  /** Ends a running job by ending its thread (the only way to stop synchronous work). */
  private end(slot: Slot, reason: StopReason): void {
    const running = slot.running;
    if (!running) return;
    this.drop(slot);
    void slot.worker.terminate();
    this.finish(slot, { status: "stopped", reason, progress: running.progress, ms: Date.now() - running.startedAt });
    this.pump();
  }

  private cancel(pending: Pending): void {
    const queued = this.queue.indexOf(pending);
    if (queued >= 0) {
      this.queue.splice(queued, 1);
      this.settle(pending, { status: "stopped", reason: "cancelled", ms: 0 });
      return;
    }
    const slot = this.slots.find((s) => s.running?.id === pending.id);
    if (slot) this.end(slot, "cancelled");
  }

  /** A thread died on its own (out of memory, a crash): its job answers what it had. */
  private lose(slot: Slot, error: Error & { code?: string }): void {
    if (!this.slots.includes(slot)) return;
    const running = slot.running;
    this.drop(slot);
    if (!slot.ready) {
      // The thread could not load the planner: starting another would fail the same way.
      console.error(`[planner] a planning thread failed to start: ${error.message}`);
      for (const pending of this.queue.splice(0)) this.settle(pending, { status: "failed", message: `the planner could not start (${error.message})`, ms: 0 });
      return;
    }
    if (running) {
      const ms = Date.now() - running.startedAt;
      const outOfMemory = error.code === "ERR_WORKER_OUT_OF_MEMORY";
      this.finish(slot, outOfMemory ? { status: "stopped", reason: "memory-limit", progress: running.progress, ms } : { status: "failed", message: error.message, ms });
    }
    this.pump();
  }

  private drop(slot: Slot): void {
    const at = this.slots.indexOf(slot);
    if (at >= 0) this.slots.splice(at, 1);
  }

  private finish(slot: Slot, answer: PoolAnswer): void {
    const running = slot.running;
    if (!running) return;
    slot.running = undefined;
    clearTimeout(running.timer);
    slot.worker.unref();
    this.recent.push(answer.ms);
    if (this.recent.length > 20) this.recent.shift();
    this.settle(running, answer);
    if (this.slots.includes(slot)) this.pump();
  }

  private settle(pending: Pending, answer: PoolAnswer): void {
    if (pending.onAbort) pending.options.signal?.removeEventListener("abort", pending.onAbort);
    pending.resolve(answer);
  }
}

const holder = globalThis as unknown as { sightwardPlanPool?: PlanPool; sightwardPlanPoolShutDown?: boolean };

/** The server's one pool, made on first use (kept on globalThis across development reloads). */
export function planPool(): PlanPool {
  holder.sightwardPlanPool ??= new PlanPool();
  return holder.sightwardPlanPool;
}

/** The server is stopping: ends the pool, and every later job answers "shutdown" at once. */
export async function shutDownPlanPool(): Promise<void> {
  const pool = planPool();
  holder.sightwardPlanPoolShutDown = true;
  await pool.close();
}

/** Ends the server's pool (tests, shutdown); the next planPool() makes a new one. */
export async function closePlanPool(): Promise<void> {
  if (holder.sightwardPlanPoolShutDown) return;
  const pool = holder.sightwardPlanPool;
  holder.sightwardPlanPool = undefined;
  await pool?.close();
}

/** Ends the pool on SIGTERM or SIGINT (the server's instrumentation calls this once). */
export function shutDownPlanPoolOnSignals(): void {
  const stop = () => void shutDownPlanPool();
  process.once("SIGTERM", stop);
  process.once("SIGINT", stop);
}
