// The integer programs of the fewest plan, solved by HiGHS (Huangfu & Hall 2018; npm `highs`,
// WebAssembly, the same in Node and the browser), written in CPLEX LP format.

type HighsColumn = { Primal?: number };
type HighsAnswer = { Status: string; ObjectiveValue?: number; Columns: Record<string, HighsColumn> };
type HighsSolver = { solve(problem: string, options?: Record<string, unknown>): HighsAnswer };

// Loaded once when this module is first imported (top-level await), so every solve after that is
// synchronous and the planners can run inside synchronous code such as the `posts` command's report.
async function loadSolver(): Promise<HighsSolver> {
  const module = await import("highs");
  const load = (module as unknown as { default: (settings?: unknown) => Promise<HighsSolver> }).default;
  return load();
}
const highs: HighsSolver = await loadSolver();
// HiGHS's first branch and bound runs its WebAssembly before the engine has optimised it (a few
// hundred milliseconds on a small cover); one small program at load time pays that once, here,
// instead of inside the first plan's time.
highs.solve(
  ["Minimize", " obj: x0 + x1 + x2 + x3 + x4", "Subject To", " c0: x0 + x1 >= 1", " c1: x1 + x2 >= 1", " c2: x2 + x3 >= 1", " c3: x3 + x4 >= 1", " c4: x4 + x0 >= 1", "Binary", " x0 x1 x2 x3 x4", "End"].join("\n"),
  { output_flag: false, mip_heuristic_run_feasibility_jump: false },
);

export interface BinaryAnswer {
  /** "optimal", "stopped" (node or time limit, best found so far) or "infeasible". */
  status: "optimal" | "stopped" | "infeasible";
  /** Indices of the variables set to 1 (empty when infeasible or nothing found in time). */
  chosen: number[];
}

/**
 * Minimise the weighted count of chosen items under constraints written as lists of item indices:
 * `sum(items) >= need` (cover) and `sum(items) <= most` (a cut-off).
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
  let answer: HighsAnswer;
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
    answer = highs.solve(lines.join("\n"), options);
  } catch (error) {
    // An out-of-memory WebAssembly instance cannot recover; report it as the solver's failure.
    throw new Error(`the integer program solver failed: ${(error as Error).message}`);
  }
  if (/infeasible/i.test(answer.Status)) return { status: "infeasible", chosen: [] };
  const chosen: number[] = [];
  for (let i = 0; i < n; i++) if ((answer.Columns[`x${i}`]?.Primal ?? 0) > 0.5) chosen.push(i);
  return { status: answer.Status === "Optimal" ? "optimal" : "stopped", chosen };
}
