// Accounts: invited, disabled and re-enabled, reset; the links that set a password are single-use,
// expire, and are found by the SHA-256 of their token (the token itself is never stored).
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database, Role } from "../schema";

type Handle = Kysely<Database> | Transaction<Database>;

/** A password hash no password matches: the account waits for its invitation to be used. */
export const NO_PASSWORD = "!no-password-set";

export async function listUsers(handle: Handle) {
  return handle
    .selectFrom("users")
    .select(["id", "email", "name", "role", "disabled_at", "last_sign_in_at", "password_hash"])
    .orderBy("role")
    .orderBy("name")
    .execute()
    .then((rows) => rows.map(({ password_hash, ...row }) => ({ ...row, invited: password_hash === NO_PASSWORD })));
}

export async function userByEmailAddress(handle: Handle, email: string) {
  return handle.selectFrom("users").select(["id", "email", "name", "role"]).where("email", "=", email).executeTakeFirst();
}

/** What sending a set-password link needs to know of an account. */
export async function accountForLink(handle: Handle, id: number) {
  return handle.selectFrom("users").select(["id", "email", "name", "password_hash", "disabled_at"]).where("id", "=", id).executeTakeFirst();
}

export async function createInvitedUser(handle: Handle, user: { email: string; name: string; role: Role }) {
  return handle
    .insertInto("users")
    .values({ email: user.email, name: user.name, role: user.role, password_hash: NO_PASSWORD })
    .returning(["id", "email", "name", "role"])
    .executeTakeFirstOrThrow();
}

export async function insertAccountLink(handle: Handle, link: { userId: number; tokenHash: string; purpose: "invite" | "reset"; expiresAt: Date; createdBy: number | null }) {
  // A new link replaces any earlier unused one of the same account: only the latest mail works.
  await handle.updateTable("account_links").set({ used_at: sql<Date>`now()` }).where("user_id", "=", link.userId).where("used_at", "is", null).execute();
  return handle
    .insertInto("account_links")
    .values({ user_id: link.userId, token_hash: link.tokenHash, purpose: link.purpose, expires_at: link.expiresAt, created_by: link.createdBy })
    .returning(["id", "expires_at"])
    .executeTakeFirstOrThrow();
}

export type LinkUse = { ok: true; userId: number; email: string } | { ok: false; reason: "unknown" | "used" | "expired" | "disabled" };

/** Uses a link once: sets the password hash, marks the link used; refuses unknown, used, expired links. */
export async function useAccountLink(db: Kysely<Database>, tokenHash: string, passwordHash: string): Promise<LinkUse> {
  return db.transaction().execute(async (trx) => {
    const link = await trx
      .selectFrom("account_links")
      .innerJoin("users", "users.id", "account_links.user_id")
      .select(["account_links.id", "account_links.user_id", "account_links.used_at", "account_links.expires_at", "users.email", "users.disabled_at"])
      .where("account_links.token_hash", "=", tokenHash)
      .forUpdate()
      .executeTakeFirst();
    if (!link) return { ok: false, reason: "unknown" };
    if (link.used_at) return { ok: false, reason: "used" };
    if (link.expires_at.getTime() <= Date.now()) return { ok: false, reason: "expired" };
    if (link.disabled_at) return { ok: false, reason: "disabled" };
    await trx.updateTable("account_links").set({ used_at: sql<Date>`now()` }).where("id", "=", link.id).execute();
    await trx.updateTable("users").set({ password_hash: passwordHash }).where("id", "=", link.user_id).execute();
    return { ok: true, userId: link.user_id, email: link.email };
  });
}

export async function setUserDisabled(handle: Handle, userId: number, disabled: boolean) {
  return handle
    .updateTable("users")
    .set({ disabled_at: disabled ? sql<Date>`now()` : null })
    .where("id", "=", userId)
    .returning(["id", "email", "name", "role", "disabled_at"])
    .executeTakeFirst();
}

/** Administrators who can still sign in. */
export async function activeAdminCount(handle: Handle): Promise<number> {
  const row = await handle.selectFrom("users").select((eb) => eb.fn.countAll<string>().as("n")).where("role", "=", "admin").where("disabled_at", "is", null).executeTakeFirstOrThrow();
  return Number(row.n);
}

export async function recordSignIn(handle: Handle, userId: number): Promise<void> {
  await handle.updateTable("users").set({ last_sign_in_at: sql<Date>`now()` }).where("id", "=", userId).execute();
}
