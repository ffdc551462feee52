import type { Metadata } from "next";
import { db } from "@/db";
import type { Weekday } from "@/db/schema";
import { requirePageUser } from "@/lib/auth/session";
import { calendarDate, siteTime } from "@/components/when";
import { describeOpening, mainSite } from "../_queries/site";

export const metadata: Metadata = { title: "Staffing" };

const WEEK: { day: Weekday; label: string }[] = [
  { day: "mon", label: "Monday" },
  { day: "tue", label: "Tuesday" },
  { day: "wed", label: "Wednesday" },
  { day: "thu", label: "Thursday" },
  { day: "fri", label: "Friday" },
  { day: "sat", label: "Saturday" },
  { day: "sun", label: "Sunday" },
];

function spanHours(span: [string, string] | null): number {
  if (!span) return 0;
  const minutes = (hhmm: string) => {
    const [h, m] = hhmm.split(":").map(Number);
    return h! * 60 + m!;
  };
  return (minutes(span[1]) - minutes(span[0])) / 60;
}

export default async function StaffingPage() {
  await requirePageUser("staffing:view");
  const site = await mainSite();
  if (!site) return <h1>Staffing</h1>;
  const [capacity, rosters] = await Promise.all([
    db
      .selectFrom("guards")
      .select((eb) => [eb.fn.countAll<string>().as("guards"), eb.fn.sum<number>("contract_hours").as("hours")])
      .where("site_id", "=", site.id)
      .executeTakeFirstOrThrow(),
    db
      .selectFrom("rosters")
      .leftJoin("shifts", "shifts.roster_id", "rosters.id")
      .select((eb) => ["rosters.id", "rosters.starts_on", "rosters.days", "rosters.status", "rosters.version", "rosters.published_at", eb.fn.count<string>("shifts.id").as("shifts")])
      .where("rosters.site_id", "=", site.id)
      .groupBy("rosters.id")
      .orderBy("rosters.starts_on", "desc")
      .execute(),
  ]);
  const weekly = site.opening_hours.weekly;
  const openHours = WEEK.reduce((sum, { day }) => sum + spanHours(weekly[day]), 0);
  const exceptions = Object.entries(site.opening_hours.dates ?? {}).sort(([a], [b]) => a.localeCompare(b));

  return (
    <div className="space-y-6">
      <div>
        <h1>Staffing</h1>
        <p className="text-stone-700">Opening hours decide how many hours each post is staffed; contracts decide who can staff them.</p>
      </div>
      <div className="grid gap-6 lg:grid-cols-2">
        <section aria-labelledby="week" className="card">
          <h2 id="week">Weekly opening at {site.name}</h2>
          <table className="data-table mt-2">
            <thead>
              <tr>
                <th scope="col">Day</th>
                <th scope="col">Open</th>
                <th scope="col">Hours</th>
              </tr>
            </thead>
            <tbody>
              {WEEK.map(({ day, label }) => (
                <tr key={day}>
                  <th scope="row" className="font-normal">{label}</th>
                  <td>{describeOpening(weekly[day])}</td>
                  <td>{spanHours(weekly[day])}</td>
                </tr>
              ))}
            </tbody>
            <tfoot>
              <tr>
                <th scope="row">Week</th>
                <td />
                <td className="font-semibold">{openHours}</td>
              </tr>
            </tfoot>
          </table>
          {exceptions.length > 0 && (
            <>
              <h3 className="mt-4">Special days</h3>
              <ul className="mt-1 text-sm">
                {exceptions.map(([date, span]) => (
                  <li key={date}>
                    {calendarDate(date)}: {describeOpening(span)}
                  </li>
                ))}
              </ul>
            </>
          )}
        </section>
        <section aria-labelledby="capacity" className="card">
          <h2 id="capacity">Guard capacity</h2>
          <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="text-stone-700">Guards</dt>
            <dd className="font-semibold">{Number(capacity.guards)}</dd>
            <dt className="text-stone-700">Contract hours a week</dt>
            <dd className="font-semibold">{Number(capacity.hours ?? 0)}</dd>
            <dt className="text-stone-700">Hourly rate</dt>
            <dd className="font-semibold">{site.hourly_rate.toFixed(2)}</dd>
            <dt className="text-stone-700">Guard-hours per post a week</dt>
            <dd className="font-semibold">{openHours}</dd>
          </dl>
          <p className="mt-3 text-sm text-stone-700">
            One post staffed through every opening hour needs {openHours} post-hours a week; at the hourly rate that is{" "}
            {(openHours * site.hourly_rate).toFixed(2)} before breaks, relief and overtime.
          </p>
        </section>
      </div>
      <section aria-labelledby="rosters" className="card">
        <h2 id="rosters">Rosters</h2>
        {rosters.length === 0 ? (
          <p className="mt-2">No rosters yet.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="data-table mt-2">
              <thead>
                <tr>
                  <th scope="col">Starts</th>
                  <th scope="col">Days</th>
                  <th scope="col">Status</th>
                  <th scope="col">Version</th>
                  <th scope="col">Shifts</th>
                  <th scope="col">Published</th>
                </tr>
              </thead>
              <tbody>
                {rosters.map((roster) => (
                  <tr key={roster.id}>
                    <td>{calendarDate(roster.starts_on)}</td>
                    <td>{roster.days}</td>
                    <td>{roster.status}</td>
                    <td>{roster.version}</td>
                    <td>{Number(roster.shifts)}</td>
                    <td>{roster.published_at ? siteTime(roster.published_at, site.time_zone) : "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
