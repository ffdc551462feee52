import type { Metadata } from "next";
import { db } from "@/db";
import { listAuditEvents } from "@/db/queries/audit";
import { requirePageUser } from "@/lib/auth/session";
import { AuditTable } from "./_components/audit-table";

export const metadata: Metadata = { title: "Audit trail" };
export const dynamic = "force-dynamic";

export default async function AuditPage() {
  await requirePageUser("audit:read");
  const events = await listAuditEvents(db, { limit: 1000 });
  return (
    <div className="space-y-4">
      <div>
        <h1>Audit trail</h1>
        <p className="text-stone-700">
          Who changed rooms, post plans and approvals, rosters, people, roles and settings, when, and what changed. The latest 1,000 changes;
          entries are never changed or removed.
        </p>
      </div>
      <div className="card">
        <AuditTable
          rows={events.map((e) => ({
            id: e.id,
            at: e.at.toISOString(),
            actorId: e.actor_id,
            actorName: e.actor_name,
            actorRole: e.actor_role,
            area: e.action.split(".")[0]!,
            action: e.action,
            subject: e.subject_label,
            summary: e.summary,
            changes: e.changes,
          }))}
        />
      </div>
    </div>
  );
}
