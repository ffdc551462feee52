import type { Metadata } from "next";
import { startOfWeek } from "date-fns";
import { requirePageUser } from "@/lib/auth/session";
import { siteTime } from "@/components/when";
import { mainSite } from "../_queries/site";
import { guardForUser, shiftsOfGuard } from "../_queries/shifts";
import { ShiftCalendar } from "./_components/shift-calendar";

export const metadata: Metadata = { title: "My shifts" };

export default async function MyShiftsPage() {
  const user = await requirePageUser("shifts:own");
  const [site, guard] = await Promise.all([mainSite(), guardForUser(user.id)]);
  // From the start of this week, so the calendar's current week shows shifts already worked too.
  const shifts = guard ? await shiftsOfGuard(guard.id, startOfWeek(new Date(), { weekStartsOn: 1 })) : [];
  const timeZone = site?.time_zone ?? "UTC";
  return (
    <div className="space-y-6">
      <div>
        <h1>My shifts</h1>
        <p className="text-stone-700">
          {guard ? `${guard.name}: your shifts from published rosters` : "Your account is not linked to a guard record yet; ask operations to link it."}
          {site ? ` (times in ${timeZone}).` : "."}
        </p>
      </div>
      <section aria-labelledby="shift-list" className="card">
        <h2 id="shift-list">Upcoming and this week</h2>
        {shifts.length === 0 ? (
          <p className="mt-2 text-lg font-semibold">None yet</p>
        ) : (
          <ol className="mt-2 divide-y divide-stone-200">
            {shifts.map((shift) => (
              <li key={shift.id} className="py-2">
                <p className="font-semibold">
                  {siteTime(shift.starts_at, timeZone)} – {siteTime(shift.ends_at, timeZone, "HH:mm")}
                </p>
                <p className="text-sm text-stone-700">
                  {shift.segments.map((segment) => `${segment.post} ${siteTime(segment.start, timeZone, "HH:mm")}–${siteTime(segment.end, timeZone, "HH:mm")}`).join(" · ") || "no posts listed"}
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
          shifts={shifts.map((shift) => ({
            id: String(shift.id),
            start: shift.starts_at.toISOString(),
            end: shift.ends_at.toISOString(),
            title: shift.segments.map((segment) => segment.post).filter((post, i, all) => all.indexOf(post) === i).join(", ") || "Shift",
          }))}
        />
      </section>
    </div>
  );
}
