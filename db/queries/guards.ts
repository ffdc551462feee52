// Guards as People manages them: their contract, limits, skills, whether they are still on the staff,
// and the account they sign in with.
import type { Kysely, Transaction } from "kysely";
import type { Database } from "../schema";

type Handle = Kysely<Database> | Transaction<Database>;

export interface GuardFields {
  name: string;
  email: string;
  contractHours: number;
  maxHours: number;
  acceptedExtraHours: number | null;
  skills: string[];
}

export async function guardsForPeople(handle: Handle, siteId: number) {
  const rows = await handle
    .selectFrom("guards")
    .leftJoin("users", "users.id", "guards.user_id")
    .select(["guards.id", "guards.name", "guards.email", "guards.contract_hours", "guards.max_hours", "guards.accepted_extra_hours", "guards.skills", "guards.active", "users.last_sign_in_at"])
    .where("guards.site_id", "=", siteId)
    .orderBy("guards.name")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    email: r.email,
    contractHours: Number(r.contract_hours),
    maxHours: Number(r.max_hours),
    acceptedExtraHours: r.accepted_extra_hours === null ? null : Number(r.accepted_extra_hours),
    skills: r.skills,
    active: r.active,
    lastSignInAt: r.last_sign_in_at ? r.last_sign_in_at.toISOString() : null,
  }));
}

export async function guardEmailTaken(handle: Handle, siteId: number, email: string, exceptId?: number): Promise<boolean> {
  let query = handle.selectFrom("guards").select("id").where("site_id", "=", siteId).where("email", "=", email);
  if (exceptId !== undefined) query = query.where("id", "!=", exceptId);
  return (await query.executeTakeFirst()) !== undefined;
}

export async function insertGuard(handle: Handle, guard: GuardFields & { siteId: number; userId: number | null }) {
  return handle
    .insertInto("guards")
    .values({
      site_id: guard.siteId,
      user_id: guard.userId,
      name: guard.name,
      email: guard.email,
      contract_hours: guard.contractHours,
      max_hours: guard.maxHours,
      accepted_extra_hours: guard.acceptedExtraHours,
      skills: guard.skills,
    })
    .returning(["id", "name", "email"])
    .executeTakeFirstOrThrow();
}

export async function guardById(handle: Handle, id: number) {
  return handle.selectFrom("guards").select(["id", "site_id", "user_id", "email", "name"]).where("id", "=", id).executeTakeFirst();
}

export async function updateGuard(handle: Handle, id: number, guard: GuardFields & { active: boolean }) {
  return handle
    .updateTable("guards")
    .set({
      name: guard.name,
      email: guard.email,
      contract_hours: guard.contractHours,
      max_hours: guard.maxHours,
      accepted_extra_hours: guard.acceptedExtraHours,
      skills: guard.skills,
      active: guard.active,
    })
    .where("id", "=", id)
    .returning(["id", "name", "email", "active"])
    .executeTakeFirst();
}
