import type { Metadata } from "next";
import { db } from "@/db";
import { requirePageUser } from "@/lib/auth/session";
import { mainSite, siteDay } from "../_queries/site";
import { rosterView, weekOverview } from "@/lib/rosters/view";
import { mondayOf } from "@/lib/rosters/scenario";
import { GuardsTable } from "./_components/guards-table";
import { GuardEditor } from "./_components/guard-form";
import { StaffImport } from "./_components/staff-import";
import { guardsForPeople } from "@/db/queries/guards";
import { can } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  const user = await requirePageUser("people:view");
  const editable = can(user.role, "people:edit");
  const site = await mainSite();
  const people = site ? await guardsForPeople(db, site.id) : [];
  // Hours this week and overtime, from the week's published roster (the one guards go by).
  const today = site ? siteDay(site).date : "";
  const week = site ? await weekOverview(db, site.id, mondayOf(today)) : null;
  const roster = week?.status.current ? await rosterView(db, week.status.current.id) : null;
  const hours = new Map((roster?.guardWeeks ?? []).map((g) => [g.guardId, { planned: g.plannedHours, overtime: g.overtimeHours }]));
  const guards = people.map((g) => ({ ...g, weekHours: roster ? (hours.get(g.id)?.planned ?? 0) : null, weekOvertime: roster ? (hours.get(g.id)?.overtime ?? 0) : null }));
  return (
    <div className="space-y-4">
      <div>
        <h1>People</h1>
        <p className="text-stone-700">
          {guards.length} guards{site ? ` at ${site.name}` : ""}. Sort by a column heading; filter by name or skill.
        </p>
      </div>
      {site && editable && (
        <section aria-label="Add guards" className="card space-y-4">
          <GuardEditor siteId={site.id} guard={null} />
          <StaffImport siteId={site.id} />
        </section>
      )}
      <GuardsTable guards={guards} siteId={site?.id ?? null} editable={editable} />
    </div>
  );
}
