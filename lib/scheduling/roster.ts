// The roster inside the engine: every time is a real instant (ms since epoch); output.ts turns it into wall-clock text.

/** A stretch of a shift at one post. */
export interface Segment {
  post: string;
  start: number;
  end: number;
}

/** A stretch of a shift off post (relief covers the post meanwhile). */
export interface ShiftBreak {
  start: number;
  end: number;
}

/** One guard's continuous working period: the unbroken union of its segments and breaks. */
export interface Shift {
  guard: string;
  start: number;
  end: number;
  segments: Segment[];
  breaks: ShiftBreak[];
}

/** A post-slot nobody staffs, with a reason a manager can act on. */
export interface UnfilledSlot {
  post: string;
  start: number;
  end: number;
  reason: string;
}

export interface Roster {
  shifts: Shift[];
  unfilled: UnfilledSlot[];
}

/** A broken hard rule: which rule, whose shift, when, and what to do about it. */
export interface Violation {
  rule: string;
  guard?: string;
  post?: string;
  start?: number;
  end?: number;
  message: string;
}

/** Paid time of a shift: segments always, breaks only when the rule set pays them. */
export function paidMs(shift: Shift, paidBreaks: boolean): number {
  const work = shift.segments.reduce((sum, s) => sum + (s.end - s.start), 0);
  const rest = shift.breaks.reduce((sum, b) => sum + (b.end - b.start), 0);
  return paidBreaks ? work + rest : work;
}

/** Stable order for output and comparisons: by start, then guard, then end. */
export function compareShifts(a: Shift, b: Shift): number {
  return a.start - b.start || (a.guard < b.guard ? -1 : a.guard > b.guard ? 1 : 0) || a.end - b.end;
}
