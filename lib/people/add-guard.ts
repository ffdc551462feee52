// Adding a guard with the account they sign in with, shared by People's form (POST /api/guards)
// and the CSV import: an existing guard account with the address is linked, any other role's is
// refused, otherwise an invited account is made. The invitation goes out after the transaction.
import type { Kysely, Transaction } from "kysely";
import type { Database } from "@/db/schema";
import { createInvitedUser, userByEmailAddress } from "@/db/queries/accounts";
import { guardEmailTaken, insertGuard, type GuardFields } from "@/db/queries/guards";
import { sendAccountLink, type SentLink } from "@/lib/auth/account-links";

export type GuardAddition =
  | { ok: true; guard: { id: number; name: string; email: string }; user: { id: number; email: string; name: string }; invite: boolean }
  | { ok: false; message: string };

/** Why the address cannot join the site's staff, or null when it can. */
export async function guardAddressProblem(handle: Kysely<Database> | Transaction<Database>, siteId: number, email: string): Promise<string | null> {
  if (await guardEmailTaken(handle, siteId, email)) return `${email} is already on the staff`;
  const existing = await userByEmailAddress(handle, email);
  return existing && existing.role !== "guard" ? `${email} belongs to a ${existing.role} account` : null;
}

export async function addGuardWithAccount(trx: Transaction<Database>, siteId: number, fields: GuardFields): Promise<GuardAddition> {
  const problem = await guardAddressProblem(trx, siteId, fields.email);
  if (problem) return { ok: false, message: problem };
  const existing = await userByEmailAddress(trx, fields.email);
  const user = existing ?? (await createInvitedUser(trx, { email: fields.email, name: fields.name, role: "guard" }));
  const guard = await insertGuard(trx, { ...fields, siteId, userId: user.id });
  return { ok: true, guard, user, invite: !existing };
}

/** Mails the invitation of a guard whose account was just made; null when none was. */
export async function inviteNewGuard(db: Kysely<Database>, added: Extract<GuardAddition, { ok: true }>, invitedBy: number): Promise<SentLink | null> {
  return added.invite ? sendAccountLink(db, added.user, "invite", invitedBy) : null;
}
