"use client";
// The chosen shift in full below the calendar: when, where, each post and break, and the other
// guards on the same floor meanwhile (worked out on the server from the published rosters).
import type { Ref } from "react";
import { formatDay, formatSpan, formatTimeRange, siteDate, type SiteFormat } from "@/lib/format";
import type { CalendarShift } from "../calendar-shifts";
import { PostLabel } from "./shift-card";

interface ShiftDetailsProps {
  shift: CalendarShift;
  format: SiteFormat;
  onClose: () => void;
  headingRef?: Ref<HTMLHeadingElement>;
}

export function ShiftDetails({ shift, format, onClose, headingRef }: ShiftDetailsProps) {
  const sameDay = siteDate(format, shift.start) === siteDate(format, shift.end);
  return (
    <section aria-labelledby="shift-details-title" className="space-y-4 rounded-card border border-l-4 border-stone-200 border-l-brass-500 bg-stone-50 p-gutter" data-testid="shift-details">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h3 id="shift-details-title" ref={headingRef} tabIndex={-1}>
            Shift on {formatDay(format, shift.start)}
          </h3>
          <p className="text-stone-700">Roster version {shift.rosterVersion}</p>
        </div>
        <button type="button" className="button-quiet" onClick={onClose}>
          Close details
        </button>
      </div>
      <dl className="flex flex-wrap gap-x-10 gap-y-2">
        <div>
          <dt className="text-sm font-semibold text-stone-700">Time</dt>
          <dd className="text-lg font-semibold tabular-nums text-ink-900">{sameDay ? formatTimeRange(format, shift.start, shift.end) : formatSpan(format, shift.start, shift.end)}</dd>
        </div>
        <div>
          <dt className="text-sm font-semibold text-stone-700">{shift.rooms.length === 1 ? "Room" : "Rooms"}</dt>
          <dd className="text-lg font-semibold tabular-nums text-ink-900">{shift.rooms.join(", ") || "No room listed"}</dd>
        </div>
      </dl>
      <div className="grid gap-4 md:grid-cols-3">
        <div>
          <h4 className="mb-1 font-semibold text-ink-800">Posts</h4>
          {shift.posts.length === 0 ? (
            <p className="text-stone-700">No posts listed.</p>
          ) : (
            <ul className="space-y-1">
              {shift.posts.map((post) => (
                <li key={`${post.start}-${post.label}`}>
                  <span className="font-semibold tabular-nums">{formatTimeRange(format, post.start, post.end)}</span> <PostLabel label={post.label} />
                </li>
              ))}
            </ul>
          )}
        </div>
        <div>
          <h4 className="mb-1 font-semibold text-ink-800">Breaks</h4>
          {shift.breaks.length === 0 ? (
            <p className="text-stone-700">No breaks planned.</p>
          ) : (
            <ul className="space-y-1" data-testid="shift-breaks">
              {shift.breaks.map((b) => (
                <li key={b.start}>
                  <span className="font-semibold tabular-nums">{formatTimeRange(format, b.start, b.end)}</span> break
                </li>
              ))}
            </ul>
          )}
        </div>
        <div>
          <h4 className="mb-1 font-semibold text-ink-800">Also on the floor</h4>
          {shift.colleagues.length === 0 ? (
            <p className="text-stone-700">Nobody else is rostered on your floor during this shift.</p>
          ) : (
            <ul className="space-y-1" data-testid="also-on-floor">
              {shift.colleagues.map((colleague, index) => (
                <li key={`${index}-${colleague.name}`}>
                  <span className="font-semibold">{colleague.name}</span>
                  <span className="text-stone-700"> · {colleague.floors.join(", ")}</span>
                  <ul>
                    {colleague.stretches.map((stretch) => (
                      <li key={`${stretch.start}-${stretch.label}`} className="text-sm">
                        <span className="font-semibold tabular-nums">{formatTimeRange(format, stretch.start, stretch.end)}</span> <PostLabel label={stretch.label} />
                      </li>
                    ))}
                  </ul>
                </li>
              ))}
            </ul>
          )}
        </div>
      </div>
    </section>
  );
}
