// Every message the product sends goes through here: it is recorded in the outbox first, then
// handed to the mail server, and the row says whether it went (or why not). The local mail fake is
// the mail server in development and tests.
import type { Kysely } from "kysely";
import type { Database, OutboxAttachment, OutboxKind } from "@/db/schema";
import { insertOutboxMail, outboxMail, recordOutboxAttempt, rewriteOutboxMail, siteMailSender, unsentRosterMail } from "@/db/queries/outbox";
import { DEFAULT_FROM, sendMail, type SentMail } from "./transport";
import { maskSecrets } from "./mask";

export interface OutgoingMail {
  kind: OutboxKind;
  to: string;
  subject: string;
  text: string;
  attachments?: OutboxAttachment[];
  /** The site the mail is about (its sender setting is used); none: the main site's. */
  siteId?: number | null;
  userId?: number | null;
  guardId?: number | null;
  rosterId?: number | null;
}

/** The failure of a recorded send: the outbox row holds the reason; `cause` is the mail server's error. */
export class MailNotSent extends Error {
  constructor(
    readonly outboxId: number,
    readonly cause: unknown,
  ) {
    super(cause instanceof Error ? cause.message : String(cause));
    this.name = "MailNotSent";
  }
}

export async function senderFor(db: Kysely<Database>, siteId?: number | null): Promise<string> {
  return (await siteMailSender(db, siteId)) ?? DEFAULT_FROM;
}

async function attempt(db: Kysely<Database>, id: number, mail: { from: string; to: string; subject: string; text: string; attachments: OutboxAttachment[] }): Promise<SentMail> {
  try {
    const sent = await sendMail({
      from: mail.from,
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      attachments: mail.attachments.map((a) => ({ filename: a.filename, content: a.content, contentType: a.contentType })),
    });
    await recordOutboxAttempt(db, id, { status: "sent", messageId: sent.messageId });
    return sent;
  } catch (error) {
    await recordOutboxAttempt(db, id, { status: "failed", error: error instanceof Error ? error.message : String(error) });
    throw new MailNotSent(id, error);
  }
}

/**
 * Records the message, then sends it. Set-password links are stored masked (the sent message
 * carries the real link). A roster mail to a guard that an earlier attempt of the job could not
 * send is tried again on the same row. Throws MailNotSent after recording a failure.
 */
export async function sendRecorded(db: Kysely<Database>, mail: OutgoingMail): Promise<{ outboxId: number; sent: SentMail }> {
  const from = await senderFor(db, mail.siteId);
  const stored = mail.kind === "invitation" || mail.kind === "reset" ? maskSecrets(mail.text) : mail.text;
  const attachments = mail.attachments ?? [];
  let id = mail.kind === "roster" && mail.rosterId != null && mail.guardId != null ? await unsentRosterMail(db, mail.rosterId, mail.guardId) : null;
  if (id === null) {
    id = await insertOutboxMail(db, {
      kind: mail.kind,
      sender: from,
      recipient: mail.to,
      subject: mail.subject,
      body: stored,
      attachments,
      userId: mail.userId,
      guardId: mail.guardId,
      rosterId: mail.rosterId,
    });
  } else {
    await rewriteOutboxMail(db, id, { subject: mail.subject, body: stored, sender: from });
  }
  const sent = await attempt(db, id, { from, to: mail.to, subject: mail.subject, text: mail.text, attachments });
  return { outboxId: id, sent };
}

/**
 * Sends a recorded message again as it was stored. Not for set-password mails: their stored text
 * is masked, so lib/mail/resend.ts issues a new link instead.
 */
export async function sendStoredAgain(db: Kysely<Database>, id: number): Promise<SentMail> {
  const row = await outboxMail(db, id);
  if (!row) throw new Error(`no outbox message ${id}`);
  if (row.kind === "invitation" || row.kind === "reset") throw new Error("a set-password mail is resent with a new link");
  return attempt(db, id, { from: row.sender, to: row.recipient, subject: row.subject, text: row.body, attachments: row.attachments });
}

/** Rewrites a set-password row with the new link's mail, then sends it (lib/auth/account-links.ts). */
export async function sendAgainOnRow(db: Kysely<Database>, id: number, mail: { to: string; subject: string; text: string }): Promise<SentMail> {
  const from = await senderFor(db);
  await rewriteOutboxMail(db, id, { subject: mail.subject, body: maskSecrets(mail.text), sender: from });
  return attempt(db, id, { from, to: mail.to, subject: mail.subject, text: mail.text, attachments: [] });
}

/** One message as an administrator reads it: links masked, attachments by name and size only. */
export async function readOutboxMail(db: Kysely<Database>, id: number) {
  const row = await outboxMail(db, id);
  if (!row) return null;
  const { attachments, body, ...rest } = row;
  return {
    ...rest,
    body: maskSecrets(body),
    attachments: attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, size: Buffer.byteLength(a.content, "utf8") })),
  };
}
export type OutboxMessage = NonNullable<Awaited<ReturnType<typeof readOutboxMail>>>;
