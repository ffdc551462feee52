import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db";
import { guardByUserId } from "@/db/queries/rosters";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { requirePageUser } from "@/lib/auth/session";
import { formatDate, formatNumber, formatSpan, siteFormat, type SiteFormat } from "@/lib/format";
import { currentExhibition, exhibitionsWithRooms, floorsWithRooms, mainSite, siteDay } from "./_queries/site";
import { nextShiftOfGuard } from "./_queries/shifts";
import { TodayPanel } from "./_components/today-panel";
import { ExhibitionPanel } from "./_components/exhibition-panel";

export const metadata: Metadata = { title: "Home" };

const HEADINGS = {
  admin: "Administration",
  operations: "Operations overview",
  curator: "Curator's desk",
  guard: "My next shift",
} as const;

export default async function HomePage() {
  const user = await requirePageUser();
  const site = await mainSite();
  if (!site) {
    return (
      <>
        <h1>{HEADINGS[user.role]}</h1>
        <p className="mt-4">No site is set up yet. An administrator adds one (the demo seed does this for you).</p>
      </>
    );
  }
  const day = siteDay(site);
  const [floors, exhibitions] = await Promise.all([floorsWithRooms(site.id), exhibitionsWithRooms(site.id)]);
  const exhibition = currentExhibition(exhibitions, day.date);
  const f = siteFormat(site);

  return (
    <div className="space-y-6">
      <div>
        <p className="text-sm font-semibold uppercase tracking-widest text-brass-700">{site.name}</p>
        <h1>{HEADINGS[user.role]}</h1>
        <p className="text-stone-700">
          Signed in as {user.name} ({ROLE_LABELS[user.role]}).
        </p>
      </div>
      {user.role === "guard" && <GuardNextShift userId={user.id} format={f} />}
      {user.role === "admin" && <AdminSummary />}
      {user.role === "operations" && <OperationsSummary siteId={site.id} format={f} />}
      <div className="grid gap-6 lg:grid-cols-2">
        <TodayPanel siteName={site.name} day={day} floors={floors} format={f} />
        <ExhibitionPanel current={exhibition} format={f} />
      </div>
    </div>
  );
}

async function GuardNextShift({ userId, format }: { userId: number; format: SiteFormat }) {
  const guard = await guardByUserId(db, userId);
  const shift = guard ? await nextShiftOfGuard(guard.id) : null;
  return (
    <section aria-labelledby="next-shift" className="card border-l-4 border-l-brass-500">
      <h2 id="next-shift">Next shift</h2>
      {!guard ? (
        <p className="mt-2">Your account is not linked to a guard record yet; ask operations to link it.</p>
      ) : shift ? (
        <div className="mt-2">
          <p className="text-lg font-semibold">
            {formatSpan(format, shift.starts_at, shift.ends_at)}
          </p>
          <p className="text-sm text-stone-700">
            {shift.segments.length} {shift.segments.length === 1 ? "post stretch" : "post stretches"}, {shift.breaks.length}{" "}
            {shift.breaks.length === 1 ? "break" : "breaks"}.
          </p>
        </div>
      ) : (
        <p className="mt-2 text-lg font-semibold">None yet</p>
      )}
      <p className="mt-3">
        <Link href="/my-shifts">See all my shifts</Link>
      </p>
    </section>
  );
}

async function AdminSummary() {
  const counts = await db.selectFrom("users").select((eb) => ["role", eb.fn.countAll<string>().as("count")]).groupBy("role").orderBy("role").execute();
  return (
    <section aria-labelledby="accounts" className="card">
      <h2 id="accounts">Accounts</h2>
      <ul className="mt-2 flex flex-wrap gap-3">
        {counts.map((row) => (
          <li key={row.role} className="tag">
            {ROLE_LABELS[row.role]}: {Number(row.count)}
          </li>
        ))}
      </ul>
      <p className="mt-3 flex gap-4">
        <Link href="/users">Manage users</Link>
        <Link href="/mail">Caught mail</Link>
        <Link href="/settings">Site settings</Link>
      </p>
    </section>
  );
}

async function OperationsSummary({ siteId, format }: { siteId: number; format: SiteFormat }) {
  const [guards, rosters] = await Promise.all([
    db
      .selectFrom("guards")
      .select((eb) => [eb.fn.countAll<string>().as("count"), eb.fn.sum<number>("contract_hours").as("hours")])
      .where("site_id", "=", siteId)
      .executeTakeFirstOrThrow(),
    db.selectFrom("rosters").select(["id", "starts_on", "status", "version"]).where("site_id", "=", siteId).orderBy("starts_on", "desc").limit(3).execute(),
  ]);
  return (
    <section aria-labelledby="staff" className="card">
      <h2 id="staff">Staff and rosters</h2>
      <p className="mt-2">
        {Number(guards.count)} guards with {formatNumber(format, Number(guards.hours ?? 0))} contract hours a week. <Link href="/people">People</Link>
      </p>
      <p className="mt-1">
        {rosters.length === 0
          ? "No rosters yet."
          : "Latest rosters: " + rosters.map((r) => `week of ${formatDate(format, r.starts_on)} (${r.status}, v${r.version})`).join("; ") + "."}{" "}
        <Link href="/staffing">Staffing</Link>
      </p>
    </section>
  );
}
