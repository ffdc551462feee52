import type { Metadata } from "next";
import { startOfWeek } from "date-fns";
import { db } from "@/db";
import { currentShiftsOfGuard, guardByUserId, timeOffOfGuard } from "@/db/queries/rosters";
import { requirePageUser } from "@/lib/auth/session";
import { postLabel, roomsOfScenario } from "@/lib/rosters/shift-events";
import { siteTime } from "@/components/when";
import { mainSite } from "../_queries/site";
import { ShiftCalendar } from "./_components/shift-calendar";
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
                  {siteTime(shift.starts_at, timeZone)} – {siteTime(shift.ends_at, timeZone, "HH:mm")}
                  <span className="ml-2 tag">version {shift.roster_version}</span>
                </p>
                <p className="text-sm text-stone-700">
                  {shift.segments.map((segment) => `${postLabel(segment.post, rooms)} ${siteTime(segment.start, timeZone, "HH:mm")}–${siteTime(segment.end, timeZone, "HH:mm")}`).join(" · ") || "no posts listed"}
                  {shift.breaks.length > 0 && ` · breaks: ${shift.breaks.map((b) => `${siteTime(b.start, timeZone, "HH:mm")}–${siteTime(b.end, timeZone, "HH:mm")}`).join(", ")}`}
                </p>
              </li>
            ))}
          </ol>
        )}
      </section>
      <section aria-labelledby="week-view" className="card">
        <h2 id="week-view" className="mb-3">Week view</h2>
        <ShiftCalendar
          timeZone={timeZone}
          shifts={shifts.map((shift) => ({
            id: String(shift.id),
            start: shift.starts_at.toISOString(),
            end: shift.ends_at.toISOString(),
            title: [...new Set(shift.segments.map((segment) => rooms.get(segment.post) || segment.post))].join(", ") || "Shift",
          }))}
        />
      </section>
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
