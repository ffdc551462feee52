// A manual edit of a draft: one segment (or one unfilled post-slot) goes to another guard. The
// edit itself only reshapes shifts; whether the result is allowed is for the engine's rule checks.
import type { Roster, Shift } from "@/lib/scheduling/roster";

export type ReassignSource =
  | { kind: "segment"; guard: string; post: string; start: number }
  | { kind: "unfilled"; post: string; start: number };

export type ReassignOutcome = { ok: true; roster: Roster } | { ok: false; message: string };

function cloneShift(shift: Shift): Shift {
  return { ...shift, segments: shift.segments.map((s) => ({ ...s })), breaks: shift.breaks.map((b) => ({ ...b })) };
}

/** Joins touching breaks, and touching segments at the same post, so the shift reads as a person would say it. */
function tidy(shift: Shift): Shift {
  const segments = [...shift.segments].sort((a, b) => a.start - b.start);
  const mergedSegments: Shift["segments"] = [];
  for (const s of segments) {
    const last = mergedSegments[mergedSegments.length - 1];
    if (last && last.post === s.post && last.end === s.start) last.end = s.end;
    else mergedSegments.push({ ...s });
  }
  const breaks = [...shift.breaks].filter((b) => b.end > b.start).sort((a, b) => a.start - b.start);
  const mergedBreaks: Shift["breaks"] = [];
  for (const b of breaks) {
    const last = mergedBreaks[mergedBreaks.length - 1];
    if (last && last.end === b.start) last.end = b.end;
    else mergedBreaks.push({ ...b });
  }
  return { ...shift, segments: mergedSegments, breaks: mergedBreaks };
}

/** Takes [start, end) out of a shift: trims an end, or leaves a break in the middle; null when nothing is left. */
function withoutStretch(shift: Shift, start: number, end: number): Shift | null {
  const segments = shift.segments.filter((s) => !(s.start === start && s.end === end));
  if (segments.length === 0) return null;
  const firstWork = Math.min(...segments.map((s) => s.start));
  const lastWork = Math.max(...segments.map((s) => s.end));
  // A shift starts and ends at a post: breaks outside the remaining work go with the stretch.
  const breaks = shift.breaks
    .filter((b) => b.end > firstWork && b.start < lastWork)
    .map((b) => ({ start: Math.max(b.start, firstWork), end: Math.min(b.end, lastWork) }));
  if (start > firstWork && end < lastWork) breaks.push({ start, end });
  return tidy({ ...shift, start: firstWork, end: lastWork, segments, breaks });
}

/** Puts [start, end) at `post` into the guard's day: on a break, next to a shift, or as a new shift. */
function withStretch(shifts: Shift[], guard: string, post: string, start: number, end: number, sameDayGapMs: number): { ok: true; shifts: Shift[] } | { ok: false; message: string } {
  const own = shifts.filter((s) => s.guard === guard);
  const busy = own.find((s) => s.segments.some((x) => x.start < end && start < x.end));
  if (busy) {
    const at = busy.segments.find((x) => x.start < end && start < x.end)!;
    return { ok: false, message: `${guard} is already at post ${at.post} then` };
  }
  const near = own
    .filter((s) => s.start - end <= sameDayGapMs && start - s.end <= sameDayGapMs)
    .sort((a, b) => Math.abs(a.start - start) - Math.abs(b.start - start))[0];
  if (!near) return { ok: true, shifts: [...shifts, { guard, start, end, segments: [{ post, start, end }], breaks: [] }] };
  const changed = cloneShift(near);
  // Time taken from a break is work now; a gap between the shift and the stretch becomes a break.
  changed.breaks = changed.breaks.flatMap((b) => {
    if (b.end <= start || end <= b.start) return [b];
    return [
      ...(b.start < start ? [{ start: b.start, end: start }] : []),
      ...(end < b.end ? [{ start: end, end: b.end }] : []),
    ];
  });
  if (end < changed.start) changed.breaks.push({ start: end, end: changed.start });
  if (start > changed.end) changed.breaks.push({ start: changed.end, end: start });
  changed.segments.push({ post, start, end });
  changed.start = Math.min(changed.start, start);
  changed.end = Math.max(changed.end, end);
  return { ok: true, shifts: shifts.map((s) => (s === near ? tidy(changed) : s)) };
}

/**
 * Gives one segment of a guard's shift, or one unfilled post-slot, to `toGuard`. A stretch within
 * `sameDayGapHours` of one of the new guard's shifts joins that shift (the gap becomes a break);
 * otherwise it makes a new shift.
 */
export function reassign(roster: Roster, source: ReassignSource, toGuard: string, sameDayGapHours: number): ReassignOutcome {
  let shifts = roster.shifts.map(cloneShift);
  let unfilled = roster.unfilled.map((u) => ({ ...u }));
  let stretch: { post: string; start: number; end: number };
  if (source.kind === "segment") {
    if (source.guard === toGuard) return { ok: false, message: "the segment already belongs to this guard" };
    const shift = shifts.find((s) => s.guard === source.guard && s.segments.some((x) => x.post === source.post && x.start === source.start));
    if (!shift) return { ok: false, message: `no segment of ${source.guard} at post ${source.post} starts then; reload the roster` };
    const segment = shift.segments.find((x) => x.post === source.post && x.start === source.start)!;
    stretch = { ...segment };
    const rest = withoutStretch(shift, segment.start, segment.end);
    shifts = shifts.flatMap((s) => (s === shift ? (rest ? [rest] : []) : [s]));
  } else {
    const slot = unfilled.find((u) => u.post === source.post && u.start === source.start);
    if (!slot) return { ok: false, message: `post ${source.post} is not unfilled then; reload the roster` };
    stretch = { post: slot.post, start: slot.start, end: slot.end };
    unfilled = unfilled.filter((u) => u !== slot);
  }
  const placed = withStretch(shifts, toGuard, stretch.post, stretch.start, stretch.end, sameDayGapHours * 3_600_000);
  if (!placed.ok) return placed;
  placed.shifts.sort((a, b) => a.start - b.start || (a.guard < b.guard ? -1 : a.guard > b.guard ? 1 : 0));
  return { ok: true, roster: { shifts: placed.shifts, unfilled } };
}

/** A guard's segment moved in time and/or given to another guard (the week builder's drag, resize or form). */
export interface Adjustment {
  guard: string;
  post: string;
  start: number;
  newStart: number;
  newEnd: number;
  toGuard: string;
}

/**
 * Moves one segment to [newStart, newEnd) and/or to another guard. The post-slots it leaves become
 * unfilled with `vacatedReason`; unfilled slots of the post it now covers are filled.
 */
export function adjust(roster: Roster, change: Adjustment, sameDayGapHours: number, slots: readonly { start: number; end: number }[], vacatedReason: string): ReassignOutcome {
  if (!(change.newEnd > change.newStart)) return { ok: false, message: "the new end must come after the new start" };
  let shifts = roster.shifts.map(cloneShift);
  const shift = shifts.find((s) => s.guard === change.guard && s.segments.some((x) => x.post === change.post && x.start === change.start));
  if (!shift) return { ok: false, message: `no segment of ${change.guard} at post ${change.post} starts then; reload the roster` };
  const segment = shift.segments.find((x) => x.post === change.post && x.start === change.start)!;
  if (change.toGuard === change.guard && segment.start === change.newStart && segment.end === change.newEnd) return { ok: false, message: "nothing changes: pick other times or another guard" };
  const rest = withoutStretch(shift, segment.start, segment.end);
  shifts = shifts.flatMap((s) => (s === shift ? (rest ? [rest] : []) : [s]));
  const placed = withStretch(shifts, change.toGuard, change.post, change.newStart, change.newEnd, sameDayGapHours * 3_600_000);
  if (!placed.ok) return placed;
  placed.shifts.sort((a, b) => a.start - b.start || (a.guard < b.guard ? -1 : a.guard > b.guard ? 1 : 0));
  // Slots the segment covered and no longer does are open again; a slot the segment now covers is no longer unfilled.
  const vacated = slots
    .filter((slot) => slot.start < segment.end && segment.start < slot.end && !(slot.start < change.newEnd && change.newStart < slot.end))
    .map((slot) => ({ post: change.post, start: slot.start, end: slot.end, reason: vacatedReason }));
  const unfilled = [
    ...roster.unfilled.filter((u) => !(u.post === change.post && u.start < change.newEnd && change.newStart < u.end)).map((u) => ({ ...u })),
    ...vacated.filter((v) => !roster.unfilled.some((u) => u.post === v.post && u.start === v.start)),
  ].sort((a, b) => a.start - b.start || (a.post < b.post ? -1 : a.post > b.post ? 1 : 0));
  return { ok: true, roster: { shifts: placed.shifts, unfilled } };
}
