import type { Metadata } from "next";
import Link from "next/link";
import { ownPostsOfShifts } from "@/lib/galleries/own-posts";
import { startOfWeek } from "date-fns";
import { db } from "@/db";
import { colleaguesOnFloor, currentShiftsOfGuard, guardByUserId, timeOffOfGuard } from "@/db/queries/rosters";
import { requirePageUser } from "@/lib/auth/session";
import { postLabel, roomsOfScenario } from "@/lib/rosters/shift-events";
import { formatSpan, formatTimeRange, siteFormat } from "@/lib/format";
import { mainSite } from "../_queries/site";
import { ShiftCalendar } from "./_components/shift-calendar";
import { calendarShifts, openingDate } from "./calendar-shifts";
import { CalendarFeed } from "./_components/calendar-feed";
import { TimeOffForm, type OwnTimeOff } from "./_components/time-off-form";

export const metadata: Metadata = { title: "My shifts" };

export default async function MyShiftsPage() {
  const user = await requirePageUser("shifts:own");
  const [site, guard] = await Promise.all([mainSite(), guardByUserId(db, user.id)]);
  // Only the latest published version of each week counts; from the start of this week, so the
  // calendar's current week shows shifts already worked too.
  const shifts = guard ? await currentShiftsOfGuard(db, guard.id, startOfWeek(new Date(), { weekStartsOn: 1 })) : [];
  const timeOff = guard ? await timeOffOfGuard(db, guard.id) : [];
  const rosterIds = [...new Set(shifts.map((s) => s.roster_id))];
  const scenarios = rosterIds.length ? await db.selectFrom("rosters").select(["scenario"]).where("id", "in", rosterIds).execute() : [];
  const rooms = new Map<string, string>();
  for (const row of scenarios) for (const [post, room] of roomsOfScenario(row.scenario)) rooms.set(post, room);
  const timeZone = site?.time_zone ?? "UTC";
  const shown = siteFormat(site);
  // The other guards on the same floor during each shift, for the calendar's shift details.
  const colleagues = guard ? await colleaguesOnFloor(db, guard.id, shifts.map((s) => s.id)) : [];
  // Floors where the guard stands now or soon: their maps, with the guard's own posts marked.
  const own = await ownPostsOfShifts(db, shifts);

  return (
    <div className="space-y-6">
      <div>
        <h1>My shifts</h1>
        <p className="text-stone-700">
          {guard ? `${guard.name}: your shifts from the latest published rosters` : "Your account is not linked to a guard record yet; ask operations to link it."}
          {site ? ` (times in ${timeZone}).` : "."}
        </p>
      </div>
      <section aria-labelledby="shift-list" className="card">
        <h2 id="shift-list">Upcoming and this week</h2>
        {shifts.length === 0 ? (
          <p className="mt-2 text-lg font-semibold">None yet</p>
        ) : (
          <ol className="mt-2 divide-y divide-stone-200" data-testid="my-shifts">
            {shifts.map((shift) => (
              <li key={shift.id} className="py-2">
                <p className="font-semibold">
                  {formatSpan(shown, shift.starts_at, shift.ends_at)}
                  <span className="ml-2 tag">version {shift.roster_version}</span>
                </p>
                <p className="text-sm text-stone-700">
                  {shift.segments.map((segment) => `${postLabel(segment.post, rooms)} ${formatTimeRange(shown, segment.start, segment.end)}`).join(" · ") || "no posts listed"}
                  {shift.breaks.length > 0 && ` · breaks: ${shift.breaks.map((b) => formatTimeRange(shown, b.start, b.end)).join(", ")}`}
                </p>
              </li>
            ))}
          </ol>
        )}
      </section>
      <section aria-labelledby="week-view" className="card">
        <h2 id="week-view" className="mb-3">Week view</h2>
        <ShiftCalendar timeZone={timeZone} initialDate={openingDate(shifts, timeZone)} shifts={calendarShifts(shifts, rooms, colleagues)} />
      </section>
      {own.floors.length > 0 && (
        <section aria-labelledby="floor-maps" className="card space-y-2">
          <h2 id="floor-maps">Floor maps</h2>
          <p className="text-sm text-stone-700">The floors of your coming shifts, with your posts marked; print one for the briefing.</p>
          <ul className="flex flex-wrap gap-2">
            {own.floors.map((floor) => (
              <li key={floor.id}>
                <Link className="button-quiet" href={`/my-floors/${floor.id}`}>{floor.name}</Link>
              </li>
            ))}
          </ul>
        </section>
      )}
      {guard && (
        <section aria-labelledby="feed" className="card space-y-2">
          <h2 id="feed">Calendar feed</h2>
          <p className="text-sm text-stone-700">
            Subscribe to this address in your calendar app: it always shows the latest published shifts. Keep it to yourself; reset it if someone else got it.
          </p>
          <CalendarFeed initialPath={`/api/calendar/${guard.calendar_token}`} />
        </section>
      )}
      {guard && (
        <section aria-labelledby="time-off" className="card space-y-3">
          <h2 id="time-off">Time off</h2>
          <TimeOffForm
            requests={timeOff.map(
              (r): OwnTimeOff => ({ id: r.id, startsOn: r.starts_on, endsOn: r.ends_on, note: r.note, status: r.status }),
            )}
          />
        </section>
      )}
    </div>
  );
}
