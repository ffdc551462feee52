// The outbox: what the product sent, to whom, with what result. Rows are inserted as "queued",
// then marked sent or failed after each attempt; a resend is another attempt on the same row.
import { sql, type Kysely } from "kysely";
import type { Database, OutboxAttachment, OutboxKind, OutboxStatus } from "../schema";

export interface NewOutboxMail {
  kind: OutboxKind;
  sender: string;
  recipient: string;
  subject: string;
  body: string;
  attachments?: OutboxAttachment[];
  userId?: number | null;
  guardId?: number | null;
  rosterId?: number | null;
}

const COLUMNS = [
  "id",
  "kind",
  "sender",
  "recipient",
  "subject",
  "status",
  "attempts",
  "last_error",
  "user_id",
  "guard_id",
  "roster_id",
  "created_at",
  "updated_at",
  "sent_at",
] as const;

export async function insertOutboxMail(db: Kysely<Database>, mail: NewOutboxMail): Promise<number> {
  const row = await db
    .insertInto("outbox")
    .values({
      kind: mail.kind,
      sender: mail.sender,
      recipient: mail.recipient,
      subject: mail.subject,
      body: mail.body,
      attachments: JSON.stringify(mail.attachments ?? []),
      user_id: mail.userId ?? null,
      guard_id: mail.guardId ?? null,
      roster_id: mail.rosterId ?? null,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

/** A roster mail to this guard not yet sent (an earlier attempt of the same job): it is tried again, not added twice. */
export async function unsentRosterMail(db: Kysely<Database>, rosterId: number, guardId: number): Promise<number | null> {
  const row = await db
    .selectFrom("outbox")
    .select("id")
    .where("roster_id", "=", rosterId)
    .where("guard_id", "=", guardId)
    .where("status", "<>", "sent")
    .orderBy("id", "desc")
    .executeTakeFirst();
  return row?.id ?? null;
}

/** Replaces what a row will send (a resent set-password mail carries a new link). */
export async function rewriteOutboxMail(db: Kysely<Database>, id: number, change: { subject: string; body: string; sender: string }): Promise<void> {
  await db.updateTable("outbox").set({ ...change, updated_at: sql<Date>`now()` }).where("id", "=", id).execute();
}

/** Records one attempt: sent (with the server's message id) or failed (with the reason). */
export async function recordOutboxAttempt(
  db: Kysely<Database>,
  id: number,
  result: { status: Exclude<OutboxStatus, "queued">; error?: string | null; messageId?: string | null },
): Promise<void> {
  await db
    .updateTable("outbox")
    .set({
      status: result.status,
      attempts: sql<number>`attempts + 1`,
      last_error: result.status === "failed" ? (result.error ?? "the mail server did not take the message").slice(0, 1000) : null,
      message_id: result.messageId ?? null,
      sent_at: result.status === "sent" ? sql<Date>`now()` : null,
      updated_at: sql<Date>`now()`,
    })
    .where("id", "=", id)
    .execute();
}

export async function outboxMail(db: Kysely<Database>, id: number) {
  return db.selectFrom("outbox").select([...COLUMNS, "body", "attachments", "message_id"]).where("id", "=", id).executeTakeFirst();
}

export interface OutboxFilter {
  kind?: OutboxKind;
  status?: OutboxStatus;
  /** Part of the recipient's address, case-insensitive. */
  recipient?: string;
  limit?: number;
}

/** Newest first, with the size of each message's attachments (not their content). */
export async function listOutbox(db: Kysely<Database>, filter: OutboxFilter = {}) {
  let query = db
    .selectFrom("outbox")
    .select([...COLUMNS, sql<number>`jsonb_array_length(attachments)`.as("attachment_count")])
    .orderBy("created_at", "desc")
    .orderBy("id", "desc")
    .limit(filter.limit ?? 200);
  if (filter.kind) query = query.where("kind", "=", filter.kind);
  if (filter.status) query = query.where("status", "=", filter.status);
  if (filter.recipient) query = query.where(sql<boolean>`strpos(lower(recipient), ${filter.recipient.toLowerCase()}) > 0`);
  return query.execute();
}

export type OutboxSummary = Awaited<ReturnType<typeof listOutbox>>[number];

/** The From address of a site's mail (none given: the main site, the first by id); null = the app's default. */
export async function siteMailSender(db: Kysely<Database>, siteId?: number | null): Promise<string | null> {
  let query = db.selectFrom("sites").select("mail_sender").orderBy("id").limit(1);
  if (siteId != null) query = query.where("id", "=", siteId);
  return (await query.executeTakeFirst())?.mail_sender ?? null;
}
