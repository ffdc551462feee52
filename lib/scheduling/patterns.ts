// Candidate shift patterns of one opening day: start at a slot boundary, a legal length, breaks placed so no work stretch is too long.
import type { Demand } from "./demand";
import type { Rules } from "./scenario";
import { HOUR, MINUTE } from "./time";

export interface ShiftPattern {
  day: number;
  /** Position of the first slot within the day's slots. */
  first: number;
  /** Number of slots the shift spans (work and breaks). */
  length: number;
  /** Offsets (0-based within the shift) of break slots. */
  breakOffsets: number[];
  start: number;
  end: number;
  workMs: number;
  breakMs: number;
}

/** Whether a slot offset of the pattern is work (not a break). */
export function worksAt(pattern: ShiftPattern, offset: number): boolean {
  return offset >= 0 && offset < pattern.length && !pattern.breakOffsets.includes(offset);
}

export function paidHoursOf(pattern: ShiftPattern, rules: Rules): number {
  return (pattern.workMs + (rules.paidBreaks ? pattern.breakMs : 0)) / HOUR;
}

/**
 * Every pattern of a day. With 30-minute slots, lengths and break positions step in whole hours
 * (starts stay on every slot) so the covering model stays small.
 */
export function dayPatterns(demand: Demand, day: number, rules: Rules): ShiftPattern[] {
  const slots = demand.days[day].slots.map((i) => demand.slots[i]);
  const n = slots.length;
  const slotMinutes = rules.slotMinutes;
  const step = slotMinutes === 30 ? 2 : 1;
  const breakSlots = Math.max(1, Math.ceil(rules.breakMinutes / slotMinutes));
  const patterns: ShiftPattern[] = [];
  for (let first = 0; first < n; first++) {
    for (let length = 1; first + length <= n; length++) {
      const start = slots[first].start;
      const end = slots[first + length - 1].end;
      const ms = end - start;
      if (ms > rules.maxShiftHours * HOUR + 1000) break;
      if (ms < rules.minShiftHours * HOUR - 1000) continue;
      // Lengths on the hour grid (30-min slots) unless the shift runs to closing.
      if (step === 2 && length % 2 !== 0 && first + length !== n) continue;
      for (const breakOffsets of breakPlacements(length, breakSlots, rules, slotMinutes, step, ms)) {
        const breakMs = breakOffsets.reduce((sum, o) => sum + (slots[first + o].end - slots[first + o].start), 0);
        patterns.push({ day, first, length, breakOffsets, start, end, workMs: ms - breakMs, breakMs });
      }
    }
  }
  return patterns;
}

/** Break placements for a shift of `length` slots; [] when it needs none. */
function breakPlacements(length: number, breakSlots: number, rules: Rules, slotMinutes: number, step: number, ms: number): number[][] {
  const maxStretch = Math.floor((rules.breakAfterHours * 60) / slotMinutes);
  if (ms <= rules.breakAfterHours * HOUR + 1000) return [[]];
  if (rules.breakMinutes * MINUTE <= 0) return length <= maxStretch ? [[]] : [];
  const placements: number[][] = [];
  // One break: work k slots, break, then the rest.
  for (let k = step; k + breakSlots < length; k += step) {
    const after = length - k - breakSlots;
    if (k <= maxStretch && after <= maxStretch && after >= 1) placements.push(range(k, breakSlots));
  }
  // The three most central placements: enough freedom for relief cover, a third of the columns.
  if (placements.length > 3) {
    const middle = (placements.length - 1) / 2;
    return placements
      .map((p, i) => ({ p, d: Math.abs(i - middle) }))
      .sort((a, b) => a.d - b.d || a.p[0] - b.p[0])
      .slice(0, 3)
      .map((x) => x.p)
      .sort((a, b) => a[0] - b[0]);
  }
  if (placements.length > 0) return placements;
  // Two breaks for long shifts with short stretches: split the work in three near-equal runs.
  const work = length - 2 * breakSlots;
  const a = Math.ceil(work / 3);
  const b = Math.ceil((work - a) / 2);
  const c = work - a - b;
  if (a <= maxStretch && b <= maxStretch && c >= 1 && c <= maxStretch) return [[...range(a, breakSlots), ...range(a + breakSlots + b, breakSlots)]];
  return [];
}

function range(from: number, count: number): number[] {
  return Array.from({ length: count }, (_, i) => from + i);
}
