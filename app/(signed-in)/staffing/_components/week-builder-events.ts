// The draft as calendar blocks: one per guard's segment (coloured per post or per guard), and one
// per run of unfilled hours at a post with its reason. Pure, so the mapping is easy to follow.
import type { EventInput } from "@fullcalendar/core";
import { wallClock } from "@/components/calendar/wall-clock";
import type { Roster } from "@/lib/scheduling/roster";
import { guardKey } from "@/lib/rosters/scenario";
import type { RosterView } from "./roster-types";

export type BuilderView = "post" | "guard";

/** A guard's segment as the week builder addresses it (the adjust API's `from`). */
export interface SegmentRef {
  guardId: number;
  guardName: string;
  post: string;
  postLabel: string;
  start: string;
  end: string;
}

export interface UnfilledRun {
  post: string;
  postLabel: string;
  start: string;
  end: string;
  reason: string;
}

export type BuilderBlock = { kind: "segment"; segment: SegmentRef } | { kind: "unfilled"; run: UnfilledRun };

export const segmentId = (s: { guardId: number; post: string; start: string }) => `seg|${s.guardId}|${s.post}|${new Date(s.start).toISOString()}`;

// More posts than the palette tokens hold: hues spread round the colour wheel, light fill, dark edge.
function hueOf(index: number): number {
  return Math.round((index * 137.508) % 360);
}
export function colourOf(index: number): { backgroundColor: string; borderColor: string } {
  const hue = hueOf(index);
  return { backgroundColor: `hsl(${hue} 60% 92%)`, borderColor: `hsl(${hue} 55% 32%)` };
}

/** Touching unfilled slots of one post with one reason, joined into runs. */
export function unfilledRuns(roster: RosterView): UnfilledRun[] {
  const sorted = [...roster.unfilled].sort((a, b) => (a.post < b.post ? -1 : a.post > b.post ? 1 : Date.parse(a.start) - Date.parse(b.start)));
  const runs: UnfilledRun[] = [];
  for (const u of sorted) {
    const last = runs[runs.length - 1];
    if (last && last.post === u.post && last.reason === u.reason && Date.parse(last.end) === Date.parse(u.start)) last.end = u.end;
    else runs.push({ post: u.post, postLabel: u.label, start: u.start, end: u.end, reason: u.reason });
  }
  return runs;
}

export function builderBlocks(roster: RosterView): Map<string, BuilderBlock> {
  const labels = new Map(roster.posts.map((p) => [p.id, p.label]));
  const blocks = new Map<string, BuilderBlock>();
  for (const shift of roster.shifts)
    for (const s of shift.segments) {
      const segment: SegmentRef = { guardId: shift.guardId, guardName: shift.guardName, post: s.post, postLabel: labels.get(s.post) ?? s.post, start: s.start, end: s.end };
      blocks.set(segmentId(segment), { kind: "segment", segment });
    }
  for (const run of unfilledRuns(roster)) blocks.set(`gap|${run.post}|${run.start}`, { kind: "unfilled", run });
  return blocks;
}

export function builderEvents(roster: RosterView, blocks: Map<string, BuilderBlock>, view: BuilderView, filter: string, editable: boolean): EventInput[] {
  const postIndex = new Map(roster.posts.map((p, i) => [p.id, i]));
  const guardIndex = new Map(roster.guards.map((g, i) => [g.id, i]));
  const zone = roster.timeZone;
  const events: EventInput[] = [];
  for (const [id, block] of blocks) {
    if (block.kind === "segment") {
      const s = block.segment;
      if (filter && (view === "post" ? s.post !== filter : String(s.guardId) !== filter)) continue;
      events.push({
        id,
        title: view === "post" ? `${s.postLabel}: ${s.guardName}` : `${s.guardName}: ${s.postLabel}`,
        start: wallClock(s.start, zone),
        end: wallClock(s.end, zone),
        editable,
        ...colourOf(view === "post" ? (postIndex.get(s.post) ?? 0) : (guardIndex.get(s.guardId) ?? 0)),
      });
    } else {
      const r = block.run;
      // Unfilled hours belong to a post: in a guard's lane they would only crowd it.
      if (filter && (view === "guard" || r.post !== filter)) continue;
      events.push({ id, title: `Unfilled: ${r.postLabel}`, start: wallClock(r.start, zone), end: wallClock(r.end, zone), editable: false, classNames: ["is-unfilled"] });
    }
  }
  return events;
}

/** The engine's roster from the roster view, for the browser's own rule checks. */
export function engineRosterOf(roster: RosterView): Roster {
  return {
    shifts: roster.shifts.map((s) => ({
      guard: guardKey(s.guardId),
      start: Date.parse(s.start),
      end: Date.parse(s.end),
      segments: s.segments.map((x) => ({ post: x.post, start: Date.parse(x.start), end: Date.parse(x.end) })),
      breaks: s.breaks.map((b) => ({ start: Date.parse(b.start), end: Date.parse(b.end) })),
    })),
    unfilled: roster.unfilled.map((u) => ({ post: u.post, start: Date.parse(u.start), end: Date.parse(u.end), reason: u.reason })),
  };
}
