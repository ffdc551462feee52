import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db";
import { readOutboxMail } from "@/lib/mail/outbox";
import { OUTBOX_KIND_LABELS as KIND_LABELS, outboxIdSchema } from "@/lib/api/outbox";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTime, siteFormat } from "@/lib/format";
import { mainSite } from "../../_queries/site";
import { ResendButton } from "../_components/resend-button";

export const metadata: Metadata = { title: "Message" };

export default async function MailMessagePage({ params }: { params: Promise<{ id: string }> }) {
  await requirePageUser("mail:read");
  const parsed = outboxIdSchema.safeParse(await params);
  if (!parsed.success) notFound();
  // Links that would sign in as someone else or read their calendar come masked.
  const [message, site] = await Promise.all([readOutboxMail(db, parsed.data.id), mainSite()]);
  if (!message) notFound();
  const format = siteFormat(site);
  return (
    <div className="space-y-4">
      <p>
        <Link href="/mail">← All mail</Link>
      </p>
      <article className="card" aria-labelledby="subject">
        <h1 id="subject" className="mb-3 break-words">{message.subject || "(no subject)"}</h1>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="font-semibold">Kind</dt>
          <dd>{KIND_LABELS[message.kind]}</dd>
          <dt className="font-semibold">From</dt>
          <dd className="break-all">{message.sender}</dd>
          <dt className="font-semibold">To</dt>
          <dd className="break-all">{message.recipient}</dd>
          <dt className="font-semibold">Written</dt>
          <dd>{formatDateTime(format, message.created_at)}</dd>
          <dt className="font-semibold">Status</dt>
          <dd>
            <span className={message.status === "sent" ? "tag-ok" : message.status === "failed" ? "tag-high" : "tag"}>{message.status}</span>
            {message.sent_at && <span className="ml-2">{formatDateTime(format, message.sent_at)}</span>}
            <span className="ml-2 text-stone-700">{message.attempts === 1 ? "1 attempt" : `${message.attempts} attempts`}</span>
          </dd>
          {message.last_error && (
            <>
              <dt className="font-semibold">Reason</dt>
              <dd className="text-alert-700">{message.last_error}</dd>
            </>
          )}
        </dl>
        <div className="mt-3">
          <ResendButton id={message.id} kind={message.kind} label={`this message to ${message.recipient}`} />
        </div>
        {message.attachments.length > 0 && (
          <section aria-labelledby="attachments" className="mt-4">
            <h2 id="attachments" className="text-base">Attachments</h2>
            <ul className="mt-1 text-sm">
              {message.attachments.map((attachment, i) => (
                <li key={i}>
                  {attachment.filename} · {attachment.contentType} · {attachment.size} bytes
                </li>
              ))}
            </ul>
          </section>
        )}
        <section aria-labelledby="text-body" className="mt-4">
          <h2 id="text-body" className="text-base">Text</h2>
          <pre className="mt-1 whitespace-pre-wrap break-words rounded-md bg-stone-100 p-3 font-sans text-sm">{message.body || "(no text)"}</pre>
        </section>
      </article>
    </div>
  );
}
