// Links that set a password: an invitation to a new account, or a reset. The token is 32 random
// bytes (base64url); only its SHA-256 is stored, so a database copy holds no working link. An
// invitation lasts 7 days, a reset 24 hours (common practice); each works once, and a newer link
// for the same account retires the older one.
import { createHash, randomBytes } from "node:crypto";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { insertAccountLink } from "@/db/queries/accounts";
import { siteFormatOf } from "@/db/queries/sites";
import { formatDateTime } from "@/lib/format";
import { MailNotSent, sendAgainOnRow, sendRecorded } from "@/lib/mail/outbox";

export const LINK_HOURS = { invite: 7 * 24, reset: 24 } as const;

export function tokenHash(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

function appUrl(): string {
  return (process.env.NEXTAUTH_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
}

export interface SentLink {
  expiresAt: Date;
  /** False when the mail server did not take the message: the link exists, send it again. */
  mailed: boolean;
  mailError?: string;
}

/** Creates a link for the account and mails it; the link is stored before the mail goes. */
export async function sendAccountLink(
  db: Kysely<Database>,
  user: { id: number; email: string; name: string },
  purpose: "invite" | "reset",
  createdBy: number | null,
  /** A resend from the outbox: the new link's mail replaces that row's, so the record stays one. */
  outboxId?: number,
): Promise<SentLink> {
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(Date.now() + LINK_HOURS[purpose] * 3_600_000);
  await insertAccountLink(db, { userId: user.id, tokenHash: tokenHash(token), purpose, expiresAt, createdBy });
  const link = `${appUrl()}/set-password?token=${token}`;
  // The main site's locale and zone: accounts belong to no one site, and the app shows that one.
  const shown = await siteFormatOf(db);
  const until = `${formatDateTime(shown, expiresAt)} (${shown.timeZone})`;
  const subject = purpose === "invite" ? "Your Sightward account" : "Set a new Sightward password";
  const text =
    purpose === "invite"
      ? `Hello ${user.name},\n\nan account on Sightward was made for you (${user.email}). Choose your password here:\n\n${link}\n\nThe link works once, until ${until}. If you did not expect this, ignore this mail.\n`
      : `Hello ${user.name},\n\nsomeone (an administrator, or you) asked to set a new password for ${user.email}. Choose it here:\n\n${link}\n\nThe link works once, until ${until}; your old password works until then. If you did not ask for this, ignore this mail.\n`;
  try {
    if (outboxId !== undefined) await sendAgainOnRow(db, outboxId, { to: user.email, subject, text });
    else await sendRecorded(db, { kind: purpose === "invite" ? "invitation" : "reset", to: user.email, subject, text, userId: user.id });
    return { expiresAt, mailed: true };
  } catch (error) {
    const reason = error instanceof MailNotSent ? error.message : error instanceof Error ? error.message : String(error);
    return { expiresAt, mailed: false, mailError: reason };
  }
}
