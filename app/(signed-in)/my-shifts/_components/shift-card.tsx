"use client";
// A shift as it reads inside the calendar grid: its times on their own line, then rooms, posts
// and breaks; the card cuts off what its height cannot show, the details panel has the rest.
import { formatTimeRange, type SiteFormat } from "@/lib/format";
import type { CalendarShift } from "../calendar-shifts";

/** "Textile Gallery · post 2" with "post 2" kept on one line, so a narrow column never strands the number. */
export function PostLabel({ label }: { label: string }) {
  const match = /^(.*) · (post \d+)$/.exec(label);
  if (!match) return <>{label}</>;
  return (
    <>
      {match[1]} · <span className="whitespace-nowrap">{match[2]}</span>
    </>
  );
}

export function ShiftCard({ shift, format }: { shift: CalendarShift; format: SiteFormat }) {
  const labels = [...new Set(shift.posts.map((post) => post.label))];
  // With one room the room line already names it, so its posts read "Post 1, post 2".
  const posts = shift.rooms.length <= 1 ? [labels.map((label) => label.split(" · ").pop()!).join(", ").replace(/^p/, "P")] : labels;
  return (
    <div className="shift-card" data-testid="shift-card">
      <p className="shift-card-time">{formatTimeRange(format, shift.start, shift.end)}</p>
      <p className="shift-card-rooms">{shift.rooms.join(", ") || "No room listed"}</p>
      {labels.length > 0 &&
        posts.map((post) => (
          <p key={post} className="shift-card-line">
            <PostLabel label={post} />
          </p>
        ))}
      {shift.breaks.map((b) => (
        <p key={b.start} className="shift-card-line">
          Break {formatTimeRange(format, b.start, b.end)}
        </p>
      ))}
    </div>
  );
}

/** What a screen reader hears on the calendar's event: the day too, which the grid shows only by column. */
export function shiftCardLabel(shift: CalendarShift, day: string, format: SiteFormat): string {
  const breaks = shift.breaks.length === 1 ? "1 break" : `${shift.breaks.length} breaks`;
  return `Shift ${day}, ${formatTimeRange(format, shift.start, shift.end)}, ${shift.rooms.join(", ") || "no room listed"}, ${breaks}. Show details`;
}
