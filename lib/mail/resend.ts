// Sending a recorded message again from the outbox. A roster mail goes again as stored; a
// set-password mail gets a new link (its stored text is masked, and the new link retires the old).
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { outboxMail } from "@/db/queries/outbox";
import { NO_PASSWORD, accountForLink } from "@/db/queries/accounts";
import { sendAccountLink } from "@/lib/auth/account-links";
import { MailNotSent, sendStoredAgain } from "./outbox";

export type ResendResult =
  | { ok: true }
  | { ok: false; reason: "unknown" | "no-account" | "disabled" | "password-set" | "not-sent"; message: string };

export async function resendOutboxMail(db: Kysely<Database>, id: number, by: number): Promise<ResendResult> {
  const row = await outboxMail(db, id);
  if (!row) return { ok: false, reason: "unknown", message: `No message ${id} in the outbox; reload the list.` };
  if (row.kind === "invitation" || row.kind === "reset") {
    const user = row.user_id == null ? undefined : await accountForLink(db, row.user_id);
    if (!user) return { ok: false, reason: "no-account", message: "The account this mail was for no longer exists; nothing was sent." };
    if (user.disabled_at) return { ok: false, reason: "disabled", message: `${user.name}'s account is disabled; enable it on Users before sending a link.` };
    if (row.kind === "invitation" && user.password_hash !== NO_PASSWORD) {
      return { ok: false, reason: "password-set", message: `${user.name} has already chosen a password; send a password reset from Users if they need a new one.` };
    }
    const sent = await sendAccountLink(db, { id: user.id, email: user.email, name: user.name }, row.kind === "invitation" ? "invite" : "reset", by, row.id);
    return sent.mailed ? { ok: true } : { ok: false, reason: "not-sent", message: `The mail server did not take the message (${sent.mailError}); try again shortly.` };
  }
  try {
    await sendStoredAgain(db, id);
    return { ok: true };
  } catch (error) {
    if (error instanceof MailNotSent) return { ok: false, reason: "not-sent", message: `The mail server did not take the message (${error.message}); try again shortly.` };
    throw error;
  }
}
