// The one HiGHS wrapper (Huangfu & Hall 2018; npm `highs`, WebAssembly) for both engines: the
// staffing engine's covers (lib/scheduling) and the fewest plan's integer programs (lib/guarding).
// One loaded instance per thread; loading costs tens of milliseconds, solving reuses it.

export type HighsColumn = { Primal?: number };
export type HighsSolution = { Status: string; ObjectiveValue: number; Columns: Record<string, HighsColumn> };
export type Highs = { solve(problem: string, options?: Record<string, unknown>): HighsSolution };

let loading: Promise<Highs> | null = null;
let loaded: Highs | null = null;

// HiGHS's first branch and bound runs its WebAssembly before the engine has optimised it (a few
// hundred milliseconds on a small cover); one small program at load time pays that once, here,
// instead of inside the first plan's time.
const WARM_UP = ["Minimize", " obj: x0 + x1 + x2 + x3 + x4", "Subject To", " c0: x0 + x1 >= 1", " c1: x1 + x2 >= 1", " c2: x2 + x3 >= 1", " c3: x3 + x4 >= 1", " c4: x4 + x0 >= 1", "Binary", " x0 x1 x2 x3 x4", "End"].join("\n");

/** The thread's HiGHS instance, loaded (and warmed up) on first call. */
export function loadHighs(): Promise<Highs> {
  loading ??= import("highs").then(async (module) => {
    const load = (module as unknown as { default: (settings?: unknown) => Promise<Highs> }).default;
    const highs = await load();
    highs.solve(WARM_UP, { output_flag: false, mip_heuristic_run_feasibility_jump: false });
    loaded = highs;
    return highs;
  });
  return loading;
}

/** The loaded instance for synchronous solves; the fewest plan runs inside synchronous code. */
export function highsNow(): Highs {
  if (!loaded) throw new Error("the integer program solver is not loaded yet (await loadHighs() first)");
  return loaded;
}

// In Node (server, worker threads, command-line tools, tests) load at import, so the planners' synchronous
// solves find the instance ready. The browser's plan worker never runs the fewest plan and skips it.
if (typeof window === "undefined" && !("WorkerGlobalScope" in globalThis)) await loadHighs();

export interface BinaryAnswer {
  /** "optimal", "stopped" (node or time limit, best found so far) or "infeasible". */
  status: "optimal" | "stopped" | "infeasible";
  /** Indices of the variables set to 1 (empty when infeasible or nothing found in time). */
  chosen: number[];
}

/**
 * Minimise the weighted count of chosen items under constraints written as lists of item indices:
 * `sum(items) >= need` (cover) and `sum(items) <= most` (a cut-off). Written in CPLEX LP format.
 */
export function solveBinaryProgram(problem: {
  weights: number[];
  atLeast?: { items: number[]; need: number }[];
  atMost?: { items: number[]; most: number }[];
  /** Wall-clock safety net; `nodes` is the deterministic limit that normally ends a hard search. */
  seconds: number;
  /** Branch-and-bound nodes HiGHS may explore (mip_max_nodes): the same answer on any machine. */
  nodes?: number;
}): BinaryAnswer {
  const n = problem.weights.length;
  if (n === 0) return { status: "optimal", chosen: [] };
  const lines: string[] = ["Minimize"];
  lines.push(" obj: " + problem.weights.map((w, i) => `${w} x${i}`).join(" + "));
  lines.push("Subject To");
  let row = 0;
  for (const { items, need } of problem.atLeast ?? []) {
    if (items.length === 0) continue;
    lines.push(` c${row++}: ${items.map((i) => `x${i}`).join(" + ")} >= ${need}`);
  }
  for (const { items, most } of problem.atMost ?? []) lines.push(` c${row++}: ${items.map((i) => `x${i}`).join(" + ")} <= ${most}`);
  if (row === 0) lines.push(" c0: x0 >= 0");
  lines.push("Binary");
  for (let i = 0; i < n; i += 20) lines.push(" " + Array.from({ length: Math.min(20, n - i) }, (_, k) => `x${i + k}`).join(" "));
  lines.push("End");
  let answer: HighsSolution;
  try {
    // Feasibility jump (a primal heuristic) costs about 15 ms per call even on a 5 x 5 program,
    // more than the whole branch and bound of the reduced covers here (measured with highs 1.15).
    const options: Record<string, unknown> = {
      time_limit: Math.max(0.05, problem.seconds),
      output_flag: false,
      mip_rel_gap: 0,
      mip_heuristic_run_feasibility_jump: false,
    };
    if (problem.nodes !== undefined) options.mip_max_nodes = problem.nodes;
    answer = highsNow().solve(lines.join("\n"), options);
  } catch (error) {
    // An out-of-memory WebAssembly instance cannot recover; report it as the solver's failure.
    throw new Error(`the integer program solver failed: ${(error as Error).message}`);
  }
  if (/infeasible/i.test(answer.Status)) return { status: "infeasible", chosen: [] };
  const chosen: number[] = [];
  for (let i = 0; i < n; i++) if ((answer.Columns[`x${i}`]?.Primal ?? 0) > 0.5) chosen.push(i);
  return { status: answer.Status === "Optimal" ? "optimal" : "stopped", chosen };
}
