"use client";
// One day of a roster as a grid: a row per post, a column per opening hour, the guard in each cell.
// On a draft, choosing a cell lets operations give that stretch to another guard; the server checks
// the change against the rules and refuses it with the rule's message.
import { TZDate } from "@date-fns/tz";
import { useMemo, useState } from "react";
import { useSiteFormat } from "@/components/site-format";
import { formatDate, formatShortDay, formatTime } from "@/lib/format";
import type { RosterView } from "./roster-types";
import { ReassignPanel } from "./reassign-panel";

export interface Cell {
  guardId: number | null;
  guardName: string | null;
  /** The segment (or unfilled slot) this hour belongs to. */
  segmentStart: string;
  reason?: string;
}

export interface Selection {
  post: string;
  postLabel: string;
  cell: Cell;
  when: string;
}

function hourSlots(date: string, opening: [string, string] | null, zone: string): number[] {
  if (!opening) return [];
  const [y, m, d] = date.split("-").map(Number);
  const [oh, om] = opening[0].split(":").map(Number);
  const [ch, cm] = opening[1].split(":").map(Number);
  const open = new TZDate(y!, m! - 1, d!, oh!, om!, zone).getTime();
  let close = new TZDate(y!, m! - 1, d!, ch!, cm!, zone).getTime();
  if (close <= open) close += 24 * 3_600_000;
  const slots: number[] = [];
  for (let t = open; t < close; t += 3_600_000) slots.push(t);
  return slots;
}

export function RosterGrid({ roster, onChanged }: { roster: RosterView; onChanged: () => void }) {
  const openDays = roster.days.filter((day) => day.opening !== null);
  const [dayIndex, setDayIndex] = useState(0);
  const [selection, setSelection] = useState<Selection | null>(null);
  const day = openDays[Math.min(dayIndex, openDays.length - 1)];
  const zone = roster.timeZone;
  const site = useSiteFormat();
  const shown = useMemo(() => ({ ...site, timeZone: zone }), [site, zone]);
  const slots = useMemo(() => (day ? hourSlots(day.date, day.opening, zone) : []), [day, zone]);

  // post -> slot start -> who stands there
  const cells = useMemo(() => {
    const map = new Map<string, Map<number, Cell>>();
    const put = (post: string, start: number, end: number, cell: Cell) => {
      const row = map.get(post) ?? new Map<number, Cell>();
      for (const slot of slots) if (slot >= start && slot < end) row.set(slot, cell);
      map.set(post, row);
    };
    for (const shift of roster.shifts)
      for (const segment of shift.segments)
        put(segment.post, Date.parse(segment.start), Date.parse(segment.end), { guardId: shift.guardId, guardName: shift.guardName, segmentStart: segment.start });
    for (const u of roster.unfilled) put(u.post, Date.parse(u.start), Date.parse(u.end), { guardId: null, guardName: null, segmentStart: u.start, reason: u.reason });
    return map;
  }, [roster, slots]);

  if (openDays.length === 0) return <p>The site is closed all week.</p>;
  const editable = roster.status === "draft";
  const hour = (t: number | string) => formatTime(shown, t);

  return (
    <div className="space-y-3">
      <div role="tablist" aria-label="Day" className="flex flex-wrap gap-2">
        {openDays.map((d, i) => (
          <button
            key={d.date}
            role="tab"
            type="button"
            aria-selected={d.date === day!.date}
            className={d.date === day!.date ? "button" : "button-quiet"}
            onClick={() => {
              setDayIndex(i);
              setSelection(null);
            }}
          >
            {formatShortDay(shown, d.date)}
          </button>
        ))}
      </div>
      {selection && editable && (
        <ReassignPanel roster={roster} selection={selection} onDone={() => { setSelection(null); onChanged(); }} onCancel={() => setSelection(null)} />
      )}
      <div className="overflow-x-auto">
        <table className="data-table" data-testid="roster-grid">
          <caption className="sr-only">Who stands at each post, hour by hour, on {formatDate(shown, day!.date)} ({zone})</caption>
          <thead>
            <tr>
              <th scope="col">Post</th>
              {slots.map((slot) => (
                <th key={slot} scope="col" className="whitespace-nowrap text-center">{hour(slot)}</th>
              ))}
            </tr>
          </thead>
          <tbody>
            {roster.posts.map((post) => (
              <tr key={post.id}>
                <th scope="row" className="whitespace-nowrap font-normal">
                  {post.label}
                  {post.skills.map((skill) => (
                    <span key={skill} className="ml-1 tag">{skill}</span>
                  ))}
                </th>
                {slots.map((slot) => {
                  const cell = cells.get(post.id)?.get(slot);
                  const text = cell?.guardName ? cell.guardName.split(" ")[0] : "unfilled";
                  const title = cell?.reason ? `unfilled: ${cell.reason}` : cell?.guardName ?? "";
                  const className = cell?.guardId === null ? "bg-alert-50 text-alert-700" : "";
                  return (
                    <td key={slot} className={`whitespace-nowrap p-0 text-center text-xs ${className}`} title={title}>
                      {editable && cell ? (
                        <button
                          type="button"
                          className="h-full w-full px-2 py-2 hover:bg-ink-50"
                          aria-label={`${post.label} at ${hour(slot)}: ${cell.guardName ?? "unfilled"}. Reassign`}
                          onClick={() => setSelection({ post: post.id, postLabel: post.label, cell, when: `${formatShortDay(shown, slot)} from ${hour(cell.segmentStart)}` })}
                        >
                          {text}
                        </button>
                      ) : (
                        <span className="block px-2 py-2">{cell ? text : ""}</span>
                      )}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
