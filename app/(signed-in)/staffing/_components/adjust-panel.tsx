"use client";
// The change to one segment, as a form: the keyboard way to move it (day, start, end, guard), and
// what a drag or resize opens. The browser runs the engine's rule checks on every change of the
// form; the server checks again when it is saved.
import { useEffect, useMemo, useRef, useState } from "react";
import { useSiteFormat } from "@/components/site-format";
import { wallClock } from "@/components/calendar/wall-clock";
import { formatShortDay } from "@/lib/format";
import { checkAdjust, overridable, RULES_NEVER_OVERRIDDEN, type EditCheck, type EditCheckContext } from "@/lib/rosters/edit-check";
import { addLocalDays, localToInstant } from "@/lib/scheduling/time";
import type { RosterView } from "./roster-types";
import type { SegmentRef } from "./week-builder-events";

export interface ProposedChange {
  segment: SegmentRef;
  start: string;
  end: string;
  toGuardId: number;
}

const NOTE_LIMIT = 500;

function clockOptions(slotMinutes: number): string[] {
  const out: string[] = [];
  for (let m = 0; m <= 24 * 60; m += slotMinutes) out.push(`${String(Math.floor(m / 60)).padStart(2, "0")}:${String(m % 60).padStart(2, "0")}`);
  return out;
}

/** Day and clock of the form as instants in the site's zone; an end at or before the start is the next day. */
function instantsOf(zone: string, day: string, from: string, to: string): { start: string; end: string } {
  const start = localToInstant(zone, day, from);
  let end = localToInstant(zone, day, to);
  if (end <= start) end = localToInstant(zone, addLocalDays(zone, day, 1), to);
  return { start: new Date(start).toISOString(), end: new Date(end).toISOString() };
}

export function AdjustPanel({
  roster,
  edit,
  proposal,
  busy,
  serverError,
  onSave,
  onCancel,
}: {
  roster: RosterView;
  edit: EditCheckContext | null;
  proposal: ProposedChange;
  busy: boolean;
  serverError: string | null;
  onSave: (change: ProposedChange, overrideNote?: string) => void;
  onCancel: () => void;
}) {
  const f = { ...useSiteFormat(), timeZone: roster.timeZone };
  const zone = roster.timeZone;
  const headingRef = useRef<HTMLHeadingElement>(null);
  const slotMinutes = edit?.scenario.rules.slotMinutes ?? 60;
  const [day, setDay] = useState(wallClock(proposal.start, zone).slice(0, 10));
  const [from, setFrom] = useState(wallClock(proposal.start, zone).slice(11, 16));
  const [to, setTo] = useState(() => {
    const clock = wallClock(proposal.end, zone).slice(11, 16);
    return clock === "00:00" ? "24:00" : clock;
  });
  const [guardId, setGuardId] = useState(proposal.toGuardId);
  const [note, setNote] = useState("");
  useEffect(() => headingRef.current?.focus(), []);

  const times = useMemo(() => instantsOf(zone, day, from, to === "24:00" ? "00:00" : to), [zone, day, from, to]);
  const change: ProposedChange = { segment: proposal.segment, start: times.start, end: times.end, toGuardId: guardId };
  const s = proposal.segment;
  const check: EditCheck | null = useMemo(
    () => (edit ? checkAdjust(edit, { from: { guardId: s.guardId, post: s.post, start: s.start }, start: times.start, end: times.end, toGuardId: guardId }) : null),
    [edit, s.guardId, s.post, s.start, times.start, times.end, guardId],
  );
  const unchanged = guardId === s.guardId && Date.parse(times.start) === Date.parse(s.start) && Date.parse(times.end) === Date.parse(s.end);
  const canOverride = check !== null && !check.ok && check.code === "breaks-rule" && overridable(check.violations);
  const rules = check && !check.ok && check.violations ? [...new Set(check.violations.map((v) => v.rule))] : [];
  const noteProblem = note.trim().length > NOTE_LIMIT ? `Keep the note under ${NOTE_LIMIT} characters.` : null;

  return (
    <section role="dialog" aria-modal="false" aria-labelledby="adjust-heading" className="rounded-md border border-ink-600 bg-white p-4 shadow-card" data-testid="adjust-panel">
      <h4 id="adjust-heading" ref={headingRef} tabIndex={-1} className="font-semibold">
        Change {s.guardName} at {s.postLabel}
      </h4>
      <form
        aria-labelledby="adjust-heading"
        className="mt-3 space-y-3"
        onSubmit={(event) => {
          event.preventDefault();
          if (!check) return;
          if (check.ok) onSave(change);
          else if (canOverride && note.trim() && !noteProblem) onSave(change, note.trim());
        }}
      >
        <div className="grid gap-3 sm:grid-cols-4">
          <label className="block text-sm">
            <span className="font-semibold">Day</span>
            <select className="field-input mt-1 w-full" value={day} onChange={(e) => setDay(e.target.value)}>
              {roster.days.map((d) => (
                <option key={d.date} value={d.date}>{formatShortDay(f, d.date)}{d.opening ? "" : " (closed)"}</option>
              ))}
            </select>
          </label>
          <label className="block text-sm">
            <span className="font-semibold">Starts</span>
            <select className="field-input mt-1 w-full" value={from} onChange={(e) => setFrom(e.target.value)}>
              {clockOptions(slotMinutes).slice(0, -1).map((c) => <option key={c} value={c}>{c}</option>)}
            </select>
          </label>
          <label className="block text-sm">
            <span className="font-semibold">Ends</span>
            <select className="field-input mt-1 w-full" value={to} onChange={(e) => setTo(e.target.value)}>
              {clockOptions(slotMinutes).slice(1).map((c) => <option key={c} value={c}>{c}</option>)}
            </select>
          </label>
          <label className="block text-sm">
            <span className="font-semibold">Guard</span>
            <select className="field-input mt-1 w-full" value={guardId} onChange={(e) => setGuardId(Number(e.target.value))}>
              {roster.guards.map((g) => <option key={g.id} value={g.id}>{g.name}{g.id === s.guardId ? " (now)" : ""}</option>)}
            </select>
          </label>
        </div>

        <div role="status" aria-live="polite" data-testid="adjust-check">
          {!check ? (
            <p className="text-sm text-stone-700">Loading the rules…</p>
          ) : unchanged ? (
            <p className="text-sm text-stone-700">Set another day, other times or another guard; the change is checked as you go.</p>
          ) : check.ok ? (
            <p className="text-sm font-semibold text-ok-700">This change keeps every rule.</p>
          ) : (
            <div className="rounded-md border border-alert-200 bg-alert-50 p-2 text-sm">
              <p className="font-semibold text-alert-700">{rules.length ? `Breaks ${rules.length === 1 ? "the rule" : "the rules"}: ${rules.join(", ")}` : "Cannot be made"}</p>
              <p>{check.message}</p>
              {check.code === "breaks-rule" && !canOverride && (
                <p className="mt-1">A note cannot keep a change against rule {rules.filter((r) => RULES_NEVER_OVERRIDDEN.includes(r)).join(", ")}.</p>
              )}
            </div>
          )}
        </div>

        {canOverride && (
          <label className="block text-sm">
            <span className="font-semibold">Keep it anyway: say why (kept with your name and the time)</span>
            <textarea className="field-input mt-1 w-full" rows={2} maxLength={NOTE_LIMIT + 50} value={note} onChange={(e) => setNote(e.target.value)} aria-describedby="override-note-help" />
            <span id="override-note-help" className={noteProblem ? "text-alert-700" : "text-stone-700"}>{noteProblem ?? `Up to ${NOTE_LIMIT} characters.`}</span>
          </label>
        )}
        {serverError && <p role="alert" className="text-sm text-alert-700" data-testid="adjust-error">{serverError}</p>}
        <div className="flex flex-wrap gap-2">
          {check?.ok !== false || unchanged ? (
            <button type="submit" className="button" disabled={busy || !check?.ok || unchanged}>Save change</button>
          ) : canOverride ? (
            <button type="submit" className="button" disabled={busy || !note.trim() || noteProblem !== null}>Keep with this note</button>
          ) : null}
          <button type="button" className="button-quiet" onClick={onCancel}>Cancel</button>
        </div>
      </form>
    </section>
  );
}
