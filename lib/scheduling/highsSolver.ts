// One loaded HiGHS instance (WebAssembly) per process; loading costs tens of milliseconds, solving reuses it.
type HighsSolution = {
  Status: string;
  ObjectiveValue: number;
  Columns: Record<string, { Primal?: number }>;
};
type Highs = { solve(problem: string, options?: Record<string, unknown>): HighsSolution };

let loaded: Promise<Highs> | null = null;

export function loadHighs(): Promise<Highs> {
  loaded ??= import("highs").then((m) => (m.default as unknown as () => Promise<Highs>)());
  return loaded;
}

export type { HighsSolution };
