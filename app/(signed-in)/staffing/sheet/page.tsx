import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db";
import { requirePageUser } from "@/lib/auth/session";
import { rosterView, weekOverview } from "@/lib/rosters/view";
import { formatDay, formatTime, isCalendarDate, siteDate, siteFormat } from "@/lib/format";
import { addCalendarDays as shiftDate, mondayOf } from "@/lib/rosters/scenario";
import { mainSite, siteDay } from "../../_queries/site";

export const metadata: Metadata = { title: "Sign-in sheet" };
export const dynamic = "force-dynamic";

/**
 * The day's sign-in sheet for the front desk: every guard on the published roster that day with
 * their shift, posts and breaks, a line to sign in and out, and the rooms to close to visitors
 * because no guard can be there. Printable (A4, the page's own print styles).
 */
export default async function SignInSheetPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageUser("staffing:view");
  const site = await mainSite();
  if (!site) return <p>No site yet.</p>;
  const params = await searchParams;
  const asked = typeof params.date === "string" && isCalendarDate(params.date) ? params.date : null;
  const date = asked ?? siteDay(site).date;
  const zone = site.time_zone;
  const week = await weekOverview(db, site.id, mondayOf(date));
  const current = week.status.current;
  const roster = current ? await rosterView(db, current.id) : null;
  const f = siteFormat(site);
  const onDay = (iso: string) => siteDate(f, iso) === date;
  const clock = (iso: string) => formatTime(f, iso);
  const labels = new Map((roster?.posts ?? []).map((p) => [p.id, p.label]));
  const shifts = (roster?.shifts ?? []).filter((s) => onDay(s.start)).sort((a, b) => a.start.localeCompare(b.start) || a.guardName.localeCompare(b.guardName));
  const closed = (roster?.emptyRooms ?? []).filter((e) => onDay(e.start));
  const title = formatDay(f, date);
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-3 print:hidden">
        <Link className="button-quiet" href={`/staffing/sheet?date=${shiftDate(date, -1)}`}>Previous day</Link>
        <Link className="button-quiet" href={`/staffing/sheet?date=${shiftDate(date, 1)}`}>Next day</Link>
        <Link href={`/staffing?week=${mondayOf(date)}`}>The week's roster</Link>
        <span className="text-sm text-stone-700">Print this page (Ctrl-P) for the front desk.</span>
      </div>
      <div>
        <h1>Sign-in sheet · {title}</h1>
        <p className="text-stone-700">
          {site.name} ({zone}) · {current ? `published version ${current.version} of the week` : "no published roster for this week"}
        </p>
      </div>
      {closed.length > 0 && (
        <section aria-labelledby="closed-heading" className="rounded-md border-2 border-alert-600 p-3">
          <h2 id="closed-heading" className="text-base text-alert-700">Close to visitors: no guard can be there</h2>
          <ul className="mt-1 list-disc pl-5 text-sm">
            {closed.map((e, i) => (
              <li key={i}>
                <span className="font-semibold">{e.room}</span>
                {e.risk === "high" ? " (high risk)" : ""}: {clock(e.start)}–{clock(e.end)}
              </li>
            ))}
          </ul>
        </section>
      )}
      {roster && shifts.length === 0 && <p>Nobody is on the roster this day.</p>}
      {shifts.length > 0 && (
        <table className="data-table" data-testid="sign-in-sheet">
          <caption className="sr-only">Guards on duty on {title}, with posts and breaks, and lines to sign</caption>
          <thead>
            <tr>
              <th scope="col">Guard</th>
              <th scope="col">Shift</th>
              <th scope="col">Posts</th>
              <th scope="col">Breaks</th>
              <th scope="col">Signed in</th>
              <th scope="col">Signed out</th>
            </tr>
          </thead>
          <tbody>
            {shifts.map((s) => (
              <tr key={s.id}>
                <td className="font-semibold">{s.guardName}</td>
                <td className="whitespace-nowrap">
                  {clock(s.start)}–{clock(s.end)}
                </td>
                <td>
                  <ul>
                    {s.segments.map((seg, i) => (
                      <li key={i} className="whitespace-nowrap">
                        {clock(seg.start)}–{clock(seg.end)} {labels.get(seg.post) ?? seg.post}
                      </li>
                    ))}
                  </ul>
                </td>
                <td className="whitespace-nowrap">{s.breaks.map((b) => `${clock(b.start)}–${clock(b.end)}`).join(", ") || "none"}</td>
                <td className="min-w-[7rem] border-b border-stone-400" aria-label={`Signed in: ${s.guardName}`}></td>
                <td className="min-w-[7rem] border-b border-stone-400" aria-label={`Signed out: ${s.guardName}`}></td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <p className="text-xs text-stone-700">Posts never block exits or evacuation routes. Rosters follow the labour-rule defaults set in Sightward; local law governs.</p>
    </div>
  );
}
