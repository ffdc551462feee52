import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { maskedMail, readCaughtMail } from "@/lib/mail/caught";
import { requirePageUser } from "@/lib/auth/session";
import { siteTime } from "@/components/when";
import { mainSite } from "../../_queries/site";

export const metadata: Metadata = { title: "Message" };

export default async function MailMessagePage({ params }: { params: Promise<{ id: string }> }) {
  await requirePageUser("mail:read");
  const { id } = await params;
  const [caught, site] = await Promise.all([readCaughtMail(id), mainSite()]);
  if (!caught) notFound();
  // Links that would sign in as someone else or read their calendar are masked.
  const message = maskedMail(caught);
  const timeZone = site?.time_zone ?? "UTC";
  return (
    <div className="space-y-4">
      <p>
        <Link href="/mail">← All caught mail</Link>
      </p>
      <article className="card" aria-labelledby="subject">
        <h1 id="subject" className="mb-3 break-words">{message.subject || "(no subject)"}</h1>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="font-semibold">From</dt>
          <dd className="break-all">{message.from}</dd>
          <dt className="font-semibold">To</dt>
          <dd className="break-all">{message.to.join(", ")}</dd>
          <dt className="font-semibold">Received</dt>
          <dd>{siteTime(message.receivedAt, timeZone, "EEE d MMM yyyy, HH:mm:ss")}</dd>
        </dl>
        {message.attachments.length > 0 && (
          <section aria-labelledby="attachments" className="mt-4">
            <h2 id="attachments" className="text-base">Attachments</h2>
            <ul className="mt-1 text-sm">
              {message.attachments.map((attachment, i) => (
                <li key={i}>
                  {attachment.filename ?? "(unnamed)"} · {attachment.contentType} · {attachment.size} bytes
                </li>
              ))}
            </ul>
          </section>
        )}
        <section aria-labelledby="text-body" className="mt-4">
          <h2 id="text-body" className="text-base">Text</h2>
          <pre className="mt-1 whitespace-pre-wrap break-words rounded-md bg-stone-100 p-3 font-sans text-sm">{message.text || "(no text part)"}</pre>
        </section>
        {message.html && (
          <section aria-labelledby="html-body" className="mt-4">
            <h2 id="html-body" className="text-base">HTML</h2>
            {/* An empty sandbox: the message's HTML shows but runs no script and loads nothing with our cookies. */}
            <iframe title={`HTML of ${message.subject}`} sandbox="" srcDoc={message.html} className="mt-1 h-96 w-full rounded-md border border-stone-300 bg-white" />
          </section>
        )}
      </article>
    </div>
  );
}
