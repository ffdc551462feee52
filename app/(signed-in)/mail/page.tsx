import type { Metadata } from "next";
import Link from "next/link";
import { listCaughtMail } from "@/lib/mail/caught";
import { requirePageUser } from "@/lib/auth/session";
import { siteTime } from "@/components/when";
import { mainSite } from "../_queries/site";

export const metadata: Metadata = { title: "Mail" };
export const dynamic = "force-dynamic";

export default async function MailPage() {
  await requirePageUser("mail:read");
  const [messages, site] = await Promise.all([listCaughtMail({ limit: 200 }), mainSite()]);
  const timeZone = site?.time_zone ?? "UTC";
  return (
    <div className="space-y-4">
      <div>
        <h1>Caught mail</h1>
        <p className="text-stone-700">
          Every message Sightward sends goes to the local mail fake and stays on this machine. Newest first.
        </p>
      </div>
      <div className="card overflow-x-auto">
        {messages.length === 0 ? (
          <p>No messages caught yet.</p>
        ) : (
          <table className="data-table">
            <caption className="sr-only">Caught messages</caption>
            <thead>
              <tr>
                <th scope="col">Received</th>
                <th scope="col">Subject</th>
                <th scope="col">To</th>
                <th scope="col">Attachments</th>
              </tr>
            </thead>
            <tbody>
              {messages.map((message) => (
                <tr key={message.id}>
                  <td className="whitespace-nowrap">{siteTime(message.receivedAt, timeZone)}</td>
                  <td>
                    <Link href={`/mail/${message.id}`}>{message.subject || "(no subject)"}</Link>
                  </td>
                  <td>{message.to.join(", ")}</td>
                  <td>{message.attachmentCount}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </div>
    </div>
  );
}
