import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db";
import type { Weekday } from "@/db/schema";
import { rostersOfSite, timeOffOfSite } from "@/db/queries/rosters";
import { approvalStates } from "@/db/queries/post-plans";
import { staleApprovalDetail } from "@/lib/galleries/approval";
import { rosterWeeks } from "@/lib/rosters/weeks";
import { requirePageUser } from "@/lib/auth/session";
import { addLocalDays, weekdayIndex } from "@/lib/scheduling/time";
import { isMonday } from "@/lib/rosters/scenario";
import { formatDate, formatDateTime, formatMoney, formatNumber, siteFormat } from "@/lib/format";
import { describeOpening, mainSite, siteDay } from "../_queries/site";
import { RosterWorkbench } from "./_components/roster-workbench";
import { TimeOffDecisions } from "./_components/time-off-decisions";

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

/** The Monday of the site's coming week (today when today is a Monday). */
function comingMonday(timeZone: string, today: string): string {
  const weekday = weekdayIndex(timeZone, today);
  return weekday === 0 ? today : addLocalDays(timeZone, today, 7 - weekday);
}

export default async function StaffingPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageUser("staffing:view");
  const site = await mainSite();
  if (!site) return <h1>Staffing</h1>;
  const params = await searchParams;
  const asked = params.week;
  const week = typeof asked === "string" && isMonday(asked) ? asked : comingMonday(site.time_zone, siteDay(site).date);
  const askedRoster = typeof params.roster === "string" && /^\d{1,9}$/.test(params.roster) ? Number(params.roster) : null;
  const [capacity, rosters, timeOff, approvals] = await Promise.all([
    db
      .selectFrom("guards")
      .select((eb) => [eb.fn.countAll<string>().as("guards"), eb.fn.sum<number>("contract_hours").as("hours")])
      .where("site_id", "=", site.id)
      .executeTakeFirstOrThrow(),
    rostersOfSite(db, site.id),
    timeOffOfSite(db, site.id),
    approvalStates(db, { siteId: site.id, onDate: siteDay(site).date }),
  ]);
  const stale = approvals.filter((a) => a.stale);
  const weeks = rosterWeeks(rosters);
  const weekly = site.opening_hours.weekly;
  const openHours = WEEK.reduce((sum, { day }) => sum + spanHours(weekly[day]), 0);
  const exceptions = Object.entries(site.opening_hours.dates ?? {}).sort(([a], [b]) => a.localeCompare(b));
  const f = siteFormat(site);

  return (
    <div className="space-y-6">
      <div>
        <h1>Staffing</h1>
        <p className="text-stone-700">Opening hours decide how many hours each post is staffed; contracts decide who can staff them.</p>
      </div>
      {stale.length > 0 && (
        <section aria-labelledby="stale-approvals" className="card border-l-4 border-alert-600" data-testid="stale-approvals">
          <h2 id="stale-approvals">Approvals out of date</h2>
          <ul className="mt-2 space-y-1 text-sm">
            {stale.map((a) => (
              <li key={`${a.exhibitionId}-${a.roomId}`}>
                <span className="tag-high">approval stale</span> <Link href={`/galleries/${a.roomId}`}>{a.roomName}</Link>: {staleApprovalDetail(a)}
              </li>
            ))}
          </ul>
        </section>
      )}
      <RosterWorkbench key={`${week}-${askedRoster ?? ""}`} initialWeek={week} initialRosterId={askedRoster} />
      <section aria-labelledby="time-off" className="card">
        <h2 id="time-off">Time off</h2>
        <p className="text-sm text-stone-700">Approved time off is unavailability in the next roster build; rebuild a week after approving.</p>
        <TimeOffDecisions
          requests={timeOff.map((r) => ({ id: r.id, guardName: r.guard_name, startsOn: r.starts_on, endsOn: r.ends_on, note: r.note, status: r.status }))}
        />
      </section>
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
                  <td>{describeOpening(weekly[day], f)}</td>
                  <td>{formatNumber(f, spanHours(weekly[day]), 2)}</td>
                </tr>
              ))}
            </tbody>
            <tfoot>
              <tr>
                <th scope="row">Week</th>
                <td />
                <td className="font-semibold">{formatNumber(f, openHours, 2)}</td>
              </tr>
            </tfoot>
          </table>
          {exceptions.length > 0 && (
            <>
              <h3 className="mt-4">Special days</h3>
              <ul className="mt-1 text-sm">
                {exceptions.map(([date, span]) => (
                  <li key={date}>
                    {formatDate(f, date)}: {describeOpening(span, f)}
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
            <dd className="font-semibold">{formatNumber(f, Number(capacity.hours ?? 0))}</dd>
            <dt className="text-stone-700">Hourly rate</dt>
            <dd className="font-semibold">{formatMoney(f, site.hourly_rate)}</dd>
            <dt className="text-stone-700">Guard-hours per post a week</dt>
            <dd className="font-semibold">{formatNumber(f, openHours, 2)}</dd>
          </dl>
          <p className="mt-3 text-sm text-stone-700">
            One post staffed through every opening hour needs {formatNumber(f, openHours, 2)} post-hours a week; at the hourly rate that is{" "}
            {formatMoney(f, openHours * site.hourly_rate)} before breaks, relief and overtime.
          </p>
        </section>
      </div>
      <section aria-labelledby="rosters" className="card">
        <h2 id="rosters">Rosters</h2>
        {weeks.length === 0 ? (
          <p className="mt-2">No rosters yet.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="data-table mt-2" data-testid="roster-list">
              <caption className="sr-only">One row per week, its draft and published versions beneath it</caption>
              <thead>
                <tr>
                  <th scope="col">Week of</th>
                  <th scope="col">Version</th>
                  <th scope="col">Shifts</th>
                  <th scope="col">Published</th>
                  <th scope="col">Note</th>
                </tr>
              </thead>
              {weeks.map((w) => (
                <tbody key={w.startsOn} data-testid={`roster-week-${w.startsOn}`}>
                  <tr className="bg-stone-100">
                    <th scope="rowgroup" colSpan={5} className="text-left">
                      <a href={`/staffing?week=${w.startsOn}`}>Week of {formatDate(f, w.startsOn)}</a>
                      <span className="ml-2 font-normal text-stone-700">
                        {w.current ? `version ${w.current.version} is current` : "not published yet"}
                        {w.draftIsNewer && w.current ? "; a newer draft is not published" : ""}
                      </span>
                    </th>
                  </tr>
                  {w.rows.map((roster) => (
                    <tr key={roster.id}>
                      <td className="pl-6">
                        <a href={`/staffing?week=${w.startsOn}&roster=${roster.id}`}>
                          {roster.status === "draft" ? `Draft, revision ${roster.revision}` : `Version ${roster.version}`}
                        </a>
                      </td>
                      <td>
                        {roster.status === "draft"
                          ? w.draftIsNewer
                            ? "draft, not published"
                            : "draft, same as the current version"
                          : roster.id === w.current?.id
                            ? "current"
                            : "superseded"}
                      </td>
                      <td>{Number(roster.shifts)}</td>
                      <td>{roster.published_at ? formatDateTime(f, roster.published_at) : "—"}</td>
                      <td className="max-w-xs text-sm">{roster.publish_note ?? ""}</td>
                    </tr>
                  ))}
                </tbody>
              ))}
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
