import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { ApiProblem } from "@/lib/api/problem";
import { activeAdminCount } from "@/db/queries/accounts";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { roleChangeSchema, userIdSchema } from "@/lib/api/user-role";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ id: string }> };

/** PATCH /api/users/[id] { role }: an admin changes a user's role. */
export const PATCH = route<Context>(async (request: NextRequest, context) => {
  const admin = await requireRole(request, "users:manage");
  const { id } = parseParams(await context.params, userIdSchema);
  const { role } = await parseBody(request, roleChangeSchema);

  const updated = await db.transaction().execute(async (trx) => {
    const target = await trx.selectFrom("users").select(["id", "role"]).where("id", "=", id).forUpdate().executeTakeFirst();
    if (!target) throw new ApiProblem(404, "not-found", `No user with id ${id}.`);
    if (target.role === "admin" && role !== "admin") {
      // Someone must still be able to manage users afterwards.
      // Disabled administrators do not count: they cannot sign in.
      if ((await activeAdminCount(trx)) <= 1) {
        throw new ApiProblem(409, "last-admin", "This is the only active administrator; make another user admin (or enable one) first.", { field: "role" });
      }
    }
    const changed = await trx
      .updateTable("users")
      .set({ role })
      .where("id", "=", id)
      .returning(["id", "email", "name", "role"])
      .executeTakeFirstOrThrow();
    if (target.role !== role) {
      await recordAudit(trx, admin, { action: "user.role", subject: { type: "user", id, label: changed.email }, summary: `changed the role of ${changed.name} from ${target.role} to ${role}`, changes: { role: { from: target.role, to: role } } });
    }
    return changed;
  });
  return NextResponse.json({ user: updated });
});
