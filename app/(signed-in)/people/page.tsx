import type { Metadata } from "next";
import { db } from "@/db";
import { requirePageUser } from "@/lib/auth/session";
import { mainSite } from "../_queries/site";
import { GuardsTable } from "./_components/guards-table";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  await requirePageUser("people:view");
  const site = await mainSite();
  const guards = site
    ? await db
        .selectFrom("guards")
        .select(["id", "name", "email", "contract_hours", "max_hours", "skills"])
        .where("site_id", "=", site.id)
        .orderBy("name")
        .execute()
    : [];
  return (
    <div className="space-y-4">
      <div>
        <h1>People</h1>
        <p className="text-stone-700">
          {guards.length} guards{site ? ` at ${site.name}` : ""}. Sort by a column heading; filter by name or skill.
        </p>
      </div>
      <GuardsTable guards={guards} />
    </div>
  );
}
