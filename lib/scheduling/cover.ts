// Dantzig's set-covering model of shift scheduling (Dantzig 1954), aggregated by day, shift pattern and guard skill class, solved with HiGHS.
import type { Demand } from "./demand";
import { loadHighs } from "../solver/highs";
import { dayPatterns, paidHoursOf, worksAt, type ShiftPattern } from "./patterns";
import type { Scenario } from "./scenario";
import { HOUR } from "./time";

/** Guards grouped by the post skills they hold (skills no post asks for do not matter here). */
export interface SkillClass {
  key: string;
  skills: string[];
  guards: string[];
}

export interface CoverPlan {
  patterns: ShiftPattern[][];
  classes: SkillClass[];
  /** How many shifts of each pattern and class on each day. */
  shifts: { day: number; pattern: ShiftPattern; skillClass: SkillClass; count: number }[];
  status: string;
  objective: number;
  ms: number;
}

export function skillClasses(scenario: Scenario): SkillClass[] {
  const relevant = new Set(scenario.posts.flatMap((p) => p.skills));
  const byKey = new Map<string, SkillClass>();
  for (const guard of scenario.guards) {
    const skills = [...new Set(guard.skills.filter((s) => relevant.has(s)))].sort();
    const key = skills.join("+");
    const entry = byKey.get(key) ?? { key, skills, guards: [] };
    entry.guards.push(guard.id);
    byKey.set(key, entry);
  }
  return [...byKey.values()].sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
}

/** Distinct skill sets of posts, the empty set (every post) first. */
export function postSkillSets(scenario: Scenario): string[][] {
  const sets = new Map<string, string[]>([["", []]]);
  for (const post of scenario.posts) {
    const skills = [...new Set(post.skills)].sort();
    sets.set(skills.join("+"), skills);
  }
  return [...sets.values()];
}

const covers = (classSkills: string[], need: string[]) => need.every((s) => classSkills.includes(s));

/**
 * Builds and solves the covering program one opening day at a time (weekly limits are the assignment's job, where
 * each guard's own hours are known); days with the same opening and guards share one solve.
 */
export async function solveCover(scenario: Scenario, demand: Demand, options: { timeLimit?: number } = {}): Promise<CoverPlan> {
  const began = performance.now();
  const classes = skillClasses(scenario);
  const patterns = demand.days.map((d) => (d.open === null ? [] : dayPatterns(demand, d.day, scenario.rules)));
  const shifts: CoverPlan["shifts"] = [];
  const statuses = new Set<string>();
  let objective = 0;
  const cache = new Map<string, { counts: Map<string, number>; status: string; objective: number }>();
  const highs = await loadHighs();
  for (const d of demand.days) {
    if (patterns[d.day].length === 0) continue;
    const model = dayModel(scenario, demand, d.day, patterns[d.day], classes);
    let answer = cache.get(model.lp);
    if (!answer) {
      answer = solveDay(highs, model, options.timeLimit ?? 20);
      cache.set(model.lp, answer);
    }
    statuses.add(answer.status);
    objective += answer.objective;
    for (const [name, count] of answer.counts) if (count > 0) shifts.push({ day: d.day, ...model.column.get(name)!, count });
  }
  return { patterns, classes, shifts, status: [...statuses].join("; ") || "no patterns", objective, ms: performance.now() - began };
}

interface DayModel {
  lp: string;
  column: Map<string, { pattern: ShiftPattern; skillClass: SkillClass }>;
  columnCost: Map<string, number>;
  coverRows: { columns: string[]; slacks: string[]; rhs: number; skills: number }[];
  /** Guards available per skill class that day: sum(columns) <= rhs. */
  capacityRows: { columns: string[]; rhs: number }[];
}

/** The covering program of one day: columns = (pattern, skill class), rows = posts to staff per slot and skill set. */
function dayModel(scenario: Scenario, demand: Demand, day: number, dayPatterns: ShiftPattern[], classes: SkillClass[]): DayModel {
  const rules = scenario.rules;
  const d = demand.days[day];
  const sets = postSkillSets(scenario);
  const slotHours = rules.slotMinutes / 60;
  const unfilledPenalty = rules.hourlyRate * (rules.maxShiftHours + 1) * 20 + 1000;
  // A lone qualified guard must leave after maxHoursAtOnePost and the post goes empty: nearly as bad as a gap.
  const rotationPenalty = (unfilledPenalty * slotHours) / 4;
  const rotationMatters = rules.maxHoursAtOnePost < rules.maxShiftHours;
  const objective: string[] = [];
  const rows: string[] = [];
  const generals: string[] = [];
  const column: DayModel["column"] = new Map();
  const columnCost = new Map<string, number>();
  const coverRows: DayModel["coverRows"] = [];
  const capacityRows: DayModel["capacityRows"] = [];
  const bySlot: string[][][] = d.slots.map(() => classes.map(() => [] as string[]));
  const byClass: string[][] = classes.map(() => []);
  dayPatterns.forEach((pattern, p) => {
    classes.forEach((skillClass, c) => {
      const name = `x_${p}_${c}`;
      column.set(name, { pattern, skillClass });
      // A hair of cost per shift prefers fewer, longer shifts among equal-cost covers.
      const cost = paidHoursOf(pattern, rules) * rules.hourlyRate + 0.01;
      columnCost.set(name, cost);
      objective.push(`${fmt(cost)} ${name}`);
      generals.push(name);
      for (let o = 0; o < pattern.length; o++) if (worksAt(pattern, o)) bySlot[pattern.first + o][c].push(name);
      byClass[c].push(name);
    });
  });
  d.slots.forEach((slotIndex, position) => {
    const slot = demand.slots[slotIndex];
    const weight = (slot.end - slot.start) / HOUR;
    sets.forEach((need, s) => {
      const needed = scenario.posts.filter((p) => covers(p.skills, need)).length;
      if (needed === 0) return;
      const terms = classes.flatMap((k, c) => (covers(k.skills, need) ? bySlot[position][c] : []));
      const slack = `u_${position}_${s}`;
      objective.push(`${fmt(unfilledPenalty * weight)} ${slack}`);
      rows.push(`cov_${position}_${s}: ${[...terms, slack].join(" + ")} >= ${needed}`);
      coverRows.push({ columns: terms, slacks: [slack], rhs: needed, skills: need.length });
      // Rotation needs a spare qualified guard on duty when only some posts ask for a skill.
      if (rotationMatters && s > 0 && needed < scenario.posts.length) {
        const spare = `v_${position}_${s}`;
        objective.push(`${fmt(rotationPenalty)} ${spare}`);
        rows.push(`rot_${position}_${s}: ${[...terms, slack, spare].join(" + ")} >= ${needed + 1}`);
        coverRows.push({ columns: terms, slacks: [slack, spare], rhs: needed + 1, skills: need.length });
      }
    });
  });
  classes.forEach((k, c) => {
    if (byClass[c].length === 0) return;
    const free = k.guards.filter((g) => !(demand.unavailable.get(g) ?? []).some((u) => u.start < d.close! && d.open! < u.end)).length;
    rows.push(`day_${c}: ${byClass[c].join(" + ")} <= ${free}`);
    capacityRows.push({ columns: byClass[c], rhs: free });
  });
  const lp = ["Minimize", ` obj: ${objective.join(" + ")}`, "Subject To", ...rows.map((r) => ` ${r}`), "General", ` ${generals.join(" ")}`, "End", ""].join("\n");
  return { lp, column, columnCost, coverRows, capacityRows };
}

type HighsInstance = Awaited<ReturnType<typeof loadHighs>>;

/** LP relaxation, rounded and thinned; a short MIP run only when rounding costs more than 1% over the LP. */
function solveDay(highs: HighsInstance, model: DayModel, timeLimit: number): { counts: Map<string, number>; status: string; objective: number } {
  const relaxed = highs.solve(model.lp.replace(/General\n.*\n/, ""), { output_flag: false });
  const rounded = roundCover(relaxed.Columns, model);
  let counts = rounded.counts;
  let status = `LP ${relaxed.Status}, rounded`;
  let objective = rounded.cost + (relaxed.ObjectiveValue - rounded.lpColumnCost);
  if (!rounded.feasible || rounded.cost > rounded.lpColumnCost * 1.01 + 1) {
    // A node limit, not only a time limit, keeps the answer the same on a busy or a quiet machine.
    const mip = highs.solve(model.lp, { time_limit: timeLimit, mip_max_nodes: 100, mip_rel_gap: 0.01, presolve: "off", output_flag: false });
    if (Object.values(mip.Columns).some((c) => c.Primal !== undefined) && (!rounded.feasible || mip.ObjectiveValue < objective)) {
      counts = new Map([...model.column.keys()].map((name) => [name, Math.round(mip.Columns[name]?.Primal ?? 0)]));
      status = `MIP ${mip.Status}`;
      objective = mip.ObjectiveValue;
    }
  }
  return { counts, status, objective };
}

/** Rounds the LP answer two ways (up, and down plus greedy repair), thins each, keeps the cheaper one that respects guard numbers. */
function roundCover(
  values: Record<string, { Primal?: number }>,
  model: DayModel,
): { counts: Map<string, number>; cost: number; lpColumnCost: number; feasible: boolean } {
  const { column, columnCost, coverRows, capacityRows } = model;
  const capacityOf = new Map<string, number>();
  capacityRows.forEach((row, r) => row.columns.forEach((c) => capacityOf.set(c, r)));
  const counts = new Map<string, number>();
  let lpColumnCost = 0;
  for (const name of column.keys()) {
    const v = values[name]?.Primal ?? 0;
    lpColumnCost += v * columnCost.get(name)!;
    counts.set(name, Math.ceil(v - 1e-6));
  }
  const rowsOf = new Map<string, number[]>();
  coverRows.forEach((row, r) => {
    for (const c of row.columns) rowsOf.set(c, [...(rowsOf.get(c) ?? []), r]);
  });
  const slackOf = coverRows.map((row) => row.slacks.reduce((sum, s) => sum + Math.ceil((values[s]?.Primal ?? 0) - 1e-6), 0));
  const thin = (start: Map<string, number>) => {
    const surplus = coverRows.map((row, r) => row.columns.reduce((sum, c) => sum + start.get(c)!, 0) + slackOf[r] - row.rhs);
    // Repair deficits greedily (most rows helped per unit cost), the most demanding skill sets first.
    const phases = [...new Set(coverRows.map((r) => r.skills))].sort((a, b) => b - a);
    for (const phase of phases) {
      for (;;) {
        let best: string | null = null;
        let bestScore = 0;
        const used = capacityRows.map((row) => row.columns.reduce((sum, c) => sum + start.get(c)!, 0));
        for (const name of column.keys()) {
          const cap = capacityOf.get(name);
          if (cap !== undefined && used[cap] >= capacityRows[cap].rhs) continue;
          const helped = (rowsOf.get(name) ?? []).reduce((n, r) => n + (surplus[r] < 0 && coverRows[r].skills === phase ? 1 : 0), 0);
          // Among equal helpers, the class with most guards to spare.
          const spare = cap === undefined ? 0 : capacityRows[cap].rhs - used[cap];
          const score = (helped / columnCost.get(name)!) * (1 + 1e-6 * spare);
          if (score > bestScore) [best, bestScore] = [name, score];
        }
        if (!best) break;
        start.set(best, start.get(best)! + 1);
        for (const r of rowsOf.get(best) ?? []) surplus[r]++;
      }
    }
    const order = [...column.keys()].filter((n) => start.get(n)! > 0).sort((a, b) => columnCost.get(b)! - columnCost.get(a)! || (a < b ? -1 : 1));
    for (const name of order) {
      const rows = rowsOf.get(name) ?? [];
      while (start.get(name)! > 0 && rows.every((r) => surplus[r] >= 1)) {
        start.set(name, start.get(name)! - 1);
        for (const r of rows) surplus[r]--;
      }
    }
    let cost = 0;
    for (const [name, n] of start) cost += n * columnCost.get(name)!;
    const feasible = surplus.every((x) => x >= 0) && capacityRows.every((row) => row.columns.reduce((sum, c) => sum + start.get(c)!, 0) <= row.rhs);
    return { counts: start, cost, feasible };
  };
  const fromCeil = thin(counts);
  const fromFloor = thin(new Map([...column.keys()].map((name) => [name, Math.floor((values[name]?.Primal ?? 0) + 1e-6)])));
  const rank = (x: { cost: number; feasible: boolean }) => (x.feasible ? x.cost : x.cost + 1e12);
  const best = rank(fromFloor) < rank(fromCeil) ? fromFloor : fromCeil;
  return { counts: best.counts, cost: best.cost, lpColumnCost, feasible: best.feasible };
}

function fmt(value: number): string {
  return Number.isInteger(value) ? String(value) : value.toFixed(6).replace(/0+$/, "");
}
