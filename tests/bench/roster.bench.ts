// Roster engine targets: a week of 60 posts x 12 h x 140 guards under 10 s within 5% of its lower bound,
// a week of 6 posts x 16 guards under 2 s within 3%. Peer measured in the same run: a greedy two-shift baseline
// (each post split into an early and a late shift, guards rotating cyclically, least-loaded legal guard first).
import { blockerFor, commitShift, newLoads, shiftKind } from "@/lib/scheduling/assign";
import { buildDemand, hasSkills } from "@/lib/scheduling/demand";
import { buildRoster } from "@/lib/scheduling/engine";
import { generateScenario, type GeneratedOptions } from "@/lib/scheduling/generate";
import { loadHighs } from "@/lib/solver/highs";
import type { Roster, Shift } from "@/lib/scheduling/roster";
import { checkRoster } from "@/lib/scheduling/rules";
import type { Scenario } from "@/lib/scheduling/scenario";
import { computeTotals } from "@/lib/scheduling/totals";

/** The peer: per day, each post gets an early and a late shift (half the opening each); posts rotate every maxHoursAtOnePost. */
function greedyRoster(scenario: Scenario): Roster {
  const demand = buildDemand(scenario);
  const loads = newLoads(scenario, Math.ceil(scenario.days / 7));
  const shifts: Shift[] = [];
  const unfilled: Roster["unfilled"] = [];
  const rotateEvery = Math.max(1, Math.floor((scenario.rules.maxHoursAtOnePost * 60) / scenario.rules.slotMinutes));
  for (const day of demand.days) {
    if (day.open === null) continue;
    const slots = day.slots.map((i) => demand.slots[i]);
    const halves = [slots.slice(0, Math.ceil(slots.length / 2)), slots.slice(Math.ceil(slots.length / 2))].filter((h) => h.length > 0);
    for (const half of halves) {
      const start = half[0].start;
      const end = half[half.length - 1].end;
      const crew: string[] = [];
      for (const post of scenario.posts) {
        const ranked = [...loads.values()]
          .filter((l) => !crew.includes(l.guard.id) && hasSkills(l.guard.skills, post.skills) && !blockerFor(scenario, demand, l, start, end, end - start))
          .sort((a, b) => a.weekMs.reduce((x, y) => x + y, 0) - b.weekMs.reduce((x, y) => x + y, 0) || (a.guard.id < b.guard.id ? -1 : 1));
        const pick = ranked[0];
        if (!pick) {
          for (const slot of half) unfilled.push({ post: post.id, start: slot.start, end: slot.end, reason: "greedy found no legal guard" });
          crew.push("");
          continue;
        }
        crew.push(pick.guard.id);
        commitShift(pick, Math.floor(day.day / 7), start, end, end - start, shiftKind(scenario, demand, start, end, day.day));
      }
      crew.forEach((guard, k) => {
        if (!guard) return;
        const segments: Shift["segments"] = [];
        half.forEach((slot, i) => {
          const post = scenario.posts[(k + Math.floor(i / rotateEvery)) % scenario.posts.length].id;
          const last = segments[segments.length - 1];
          if (last && last.post === post && last.end === slot.start) last.end = slot.end;
          else segments.push({ post, start: slot.start, end: slot.end });
        });
        shifts.push({ guard, start, end, segments, breaks: [] });
      });
    }
  }
  return { shifts, unfilled };
}

const cases: { name: string; options: GeneratedOptions; target: string }[] = [
  { name: "60 posts x 12 h x 7 d, 140 guards", options: { posts: 60, guards: 140 }, target: "< 10 s, gap <= 5%" },
  { name: "same, breaks paid", options: { posts: 60, guards: 140, paidBreaks: true }, target: "< 10 s, gap <= 5%" },
  { name: "same, 8 high-value posts, 30 qualified guards", options: { posts: 60, guards: 140, skilledPosts: 8, skilledGuards: 30 }, target: "< 10 s, gap <= 5%" },
  { name: "same, 8 high-value posts, 30 qualified, every 5th guard a day on leave", options: { posts: 60, guards: 140, skilledPosts: 8, skilledGuards: 30, leaveEvery: 5 }, target: "< 10 s, gap <= 5%" },
  { name: "6 posts x 12 h x 7 d, 16 guards", options: { posts: 6, guards: 16 }, target: "< 2 s, gap <= 3%" },
  { name: "6 posts, 1 high-value, 4 qualified of 16", options: { posts: 6, guards: 16, skilledPosts: 1, skilledGuards: 4 }, target: "< 2 s, gap <= 3%" },
  { name: "6 posts, 30-minute slots, breaks paid", options: { posts: 6, guards: 16, slotMinutes: 30, paidBreaks: true }, target: "< 2 s, gap <= 3%" },
];

export default async function rosterBench(): Promise<string> {
  const loadStart = performance.now();
  await loadHighs();
  const loadMs = performance.now() - loadStart;
  const rows: string[] = [
    "| case | post-hours | engine s | unfilled h | rule breaks | cost | lower bound | gap | target | greedy s | greedy unfilled h | greedy rule breaks | greedy cost | engine / greedy time |",
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- | ---: | ---: | ---: | ---: | ---: |",
  ];
  for (const c of cases) {
    const scenario = generateScenario(c.options);
    const t0 = performance.now();
    const result = await buildRoster(scenario);
    const engineMs = performance.now() - t0;
    const t1 = performance.now();
    const greedy = greedyRoster(scenario);
    const greedyMs = performance.now() - t1;
    const greedyBreaks = checkRoster(scenario, greedy).length;
    const greedyTotals = computeTotals(scenario, buildDemand(scenario), greedy);
    const t = result.totals;
    rows.push(
      `| ${c.name} | ${t.postHours} | ${(engineMs / 1000).toFixed(2)} | ${t.unfilledPostHours} | ${result.violations.length} | ${t.cost} | ${t.lowerBoundCost} | ${(100 * t.gap).toFixed(2)}% | ${c.target} | ${(greedyMs / 1000).toFixed(2)} | ${greedyTotals.unfilledPostHours} | ${greedyBreaks} | ${greedyTotals.cost} | ${(engineMs / Math.max(1, greedyMs)).toFixed(1)}x |`,
    );
    console.error(`roster bench: ${c.name}: ${JSON.stringify(result.stats.ms, (_, v) => (typeof v === "number" ? Math.round(v) : v))} ${result.stats.coverStatus}`);
  }
  rows.push("", `HiGHS WebAssembly load (once per process, not in the engine times): ${Math.round(loadMs)} ms. Machine: ${(await import("node:os")).cpus().length} cores, load average ${(await import("node:os")).loadavg()[0].toFixed(1)} at the end of the run.`);
  return rows.join("\n");
}
