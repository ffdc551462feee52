import type { Metadata } from "next";
import { db } from "@/db";
import { requirePageUser } from "@/lib/auth/session";
import { mainSite } from "../_queries/site";
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
  const guards = site ? await guardsForPeople(db, site.id) : [];
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
