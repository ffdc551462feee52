import type { Metadata } from "next";
import { db } from "@/db";
import { listOutbox } from "@/db/queries/outbox";
import { requirePageUser } from "@/lib/auth/session";
import { OutboxTable } from "./_components/outbox-table";

export const metadata: Metadata = { title: "Mail" };
export const dynamic = "force-dynamic";

export default async function MailPage() {
  await requirePageUser("mail:read");
  const rows = await listOutbox(db, { limit: 500 });
  const failed = rows.filter((row) => row.status === "failed").length;
  return (
    <div className="space-y-4">
      <div>
        <h1>Mail</h1>
        <p className="text-stone-700">
          Everything Sightward sent: roster mails, invitations and password resets, with whether each went out. Links that would open
          someone&apos;s account or calendar are masked here. A failed message can be sent again; a set-password mail then carries a new link
          and the old one stops working.
        </p>
        {failed > 0 && (
          <p role="status" className="mt-2 font-semibold text-alert-700">
            {failed === 1 ? "1 message did not go out." : `${failed} messages did not go out.`} Check the reason, then resend.
          </p>
        )}
      </div>
      <div className="card">
        <OutboxTable
          rows={rows.map((row) => ({
            id: row.id,
            kind: row.kind,
            recipient: row.recipient,
            subject: row.subject,
            status: row.status,
            attempts: row.attempts,
            last_error: row.last_error,
            created_at: row.created_at.toISOString(),
            sent_at: row.sent_at?.toISOString() ?? null,
            attachment_count: Number(row.attachment_count),
          }))}
        />
      </div>
    </div>
  );
}
