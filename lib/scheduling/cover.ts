// Dantzig's set-covering model of shift scheduling (Dantzig 1954), aggregated by day, shift pattern and guard skill class, solved with HiGHS.
import type { Demand } from "./demand";
import { loadHighs } from "./highsSolver";
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
  /** How many shifts of each pattern and class: counts[day][pattern][class]. */
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

/** Builds and solves the covering program; the answer says how many guards of each class work each pattern. */
export async function solveCover(scenario: Scenario, demand: Demand, options: { timeLimit?: number } = {}): Promise<CoverPlan> {
  const began = performance.now();
  const rules = scenario.rules;
  const classes = skillClasses(scenario);
  const sets = postSkillSets(scenario);
  const patterns = demand.days.map((d) => (d.open === null ? [] : dayPatterns(demand, d.day, rules)));
  const slotHours = rules.slotMinutes / 60;
  const unfilledPenalty = rules.hourlyRate * (rules.maxShiftHours + 1) * 20 + 1000;
  const rotationPenalty = rules.hourlyRate * slotHours * 2 + 1;
  const rotationMatters = rules.maxHoursAtOnePost < rules.maxShiftHours;

  const objective: string[] = [];
  const rows: string[] = [];
  const generals: string[] = [];
  const bounds: string[] = [];
  const column = new Map<string, { day: number; pattern: ShiftPattern; skillClass: SkillClass }>();
  // Columns per day and slot position, per class, for coverage rows.
  const bySlot: string[][][][] = demand.days.map((d) => d.slots.map(() => classes.map(() => [] as string[])));
  const byDayClass: string[][] = demand.days.map(() => classes.map(() => []));
  const paidByWeekClass = new Map<string, string[]>();

  for (const d of demand.days) {
    patterns[d.day].forEach((pattern, p) => {
      classes.forEach((skillClass, c) => {
        const name = `x_${d.day}_${p}_${c}`;
        column.set(name, { day: d.day, pattern, skillClass });
        const paid = paidHoursOf(pattern, rules);
        // A hair of cost per shift prefers fewer, longer shifts among equal-cost covers.
        objective.push(`${fmt(paid * rules.hourlyRate + 0.01)} ${name}`);
        generals.push(name);
        for (let o = 0; o < pattern.length; o++) if (worksAt(pattern, o)) bySlot[d.day][pattern.first + o][c].push(name);
        byDayClass[d.day][c].push(name);
        const wk = `${Math.floor(d.day / 7)}_${c}`;
        const list = paidByWeekClass.get(wk) ?? [];
        list.push(`${fmt(paid)} ${name}`);
        paidByWeekClass.set(wk, list);
      });
    });
  }
  const guardById = new Map(scenario.guards.map((g) => [g.id, g]));
  for (const d of demand.days) {
    d.slots.forEach((slotIndex, position) => {
      const slot = demand.slots[slotIndex];
      const weight = (slot.end - slot.start) / HOUR;
      sets.forEach((need, s) => {
        const needed = scenario.posts.filter((p) => covers(p.skills, need)).length;
        if (needed === 0) return;
        const terms = classes.flatMap((k, c) => (covers(k.skills, need) ? bySlot[d.day][position][c] : []));
        const slack = `u_${slotIndex}_${s}`;
        objective.push(`${fmt(unfilledPenalty * weight)} ${slack}`);
        rows.push(`cov_${slotIndex}_${s}: ${[...terms, slack].join(" + ")} >= ${needed}`);
        // Rotation needs a spare qualified guard on duty when only a few posts ask for a skill.
        if (rotationMatters && s > 0 && needed < scenario.posts.length) {
          const spare = `v_${slotIndex}_${s}`;
          objective.push(`${fmt(rotationPenalty)} ${spare}`);
          rows.push(`rot_${slotIndex}_${s}: ${[...terms, slack, spare].join(" + ")} >= ${needed + 1}`);
        }
      });
    });
    classes.forEach((k, c) => {
      if (byDayClass[d.day][c].length === 0) return;
      const free = k.guards.filter((g) => !(demand.unavailable.get(g) ?? []).some((u) => d.open !== null && u.start < d.close! && d.open < u.end)).length;
      rows.push(`day_${d.day}_${c}: ${byDayClass[d.day][c].join(" + ")} <= ${free}`);
    });
  }
  for (const [wk, terms] of paidByWeekClass) {
    const c = Number(wk.split("_")[1]);
    const members = classes[c].guards.map((g) => guardById.get(g)!);
    const max = members.reduce((sum, g) => sum + g.maxHours, 0);
    const plain = members.reduce((sum, g) => sum + Math.min(g.maxHours, rules.overtimeAfterHours), 0);
    rows.push(`cap_${wk}: ${terms.join(" + ")} <= ${fmt(max)}`);
    const over = `o_${wk}`;
    objective.push(`${fmt(rules.hourlyRate * (rules.overtimeFactor - 1))} ${over}`);
    rows.push(`ot_${wk}: ${terms.join(" + ")} - ${over} <= ${fmt(plain)}`);
  }

  const shifts: CoverPlan["shifts"] = [];
  if (column.size === 0) return { patterns, classes, shifts, status: "no patterns", objective: 0, ms: performance.now() - began };
  const lp = [
    "Minimize",
    ` obj: ${objective.join(" + ")}`,
    "Subject To",
    ...rows.map((r) => ` ${r}`),
    "Bounds",
    ...bounds,
    "General",
    ` ${generals.join(" ")}`,
    "End",
    "",
  ].join("\n");
  const highs = await loadHighs();
  let solution = highs.solve(lp, { time_limit: options.timeLimit ?? 4, mip_rel_gap: 0.002, output_flag: false });
  let status = solution.Status;
  const hasPrimal = Object.values(solution.Columns).some((c) => c.Primal !== undefined);
  if (!hasPrimal) {
    // No integer answer in time: solve the LP relaxation and round up (still a cover, slightly dearer).
    solution = highs.solve(lp.replace(/General\n.*\n/, ""), { output_flag: false });
    status = `${status}; LP rounded up`;
  }
  for (const [name, info] of column) {
    const value = solution.Columns[name]?.Primal ?? 0;
    const count = hasPrimal ? Math.round(value) : Math.ceil(value - 1e-6);
    if (count > 0) shifts.push({ ...info, count });
  }
  return { patterns, classes, shifts, status, objective: solution.ObjectiveValue, ms: performance.now() - began };
}

function fmt(value: number): string {
  return Number.isInteger(value) ? String(value) : value.toFixed(6).replace(/0+$/, "");
}
