// PUT /api/users/[id]/access { disabled }: an admin disables or re-enables an account. A disabled
// account cannot sign in and its sessions end at the next request; the last active administrator
// and the admin's own account cannot be disabled.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { activeAdminCount, setUserDisabled } from "@/db/queries/accounts";
import { accessSchema } from "@/lib/api/accounts";
import { ApiProblem } from "@/lib/api/problem";
import { parseBody, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { userIdSchema } from "@/lib/api/user-role";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ id: string }> };

export const PUT = route<Context>(async (request: NextRequest, context) => {
  const admin = await requireRole(request, "users:manage");
  const { id } = parseParams(await context.params, userIdSchema);
  const { disabled } = await parseBody(request, accessSchema);
  if (disabled && id === admin.id) throw new ApiProblem(409, "own-account", "You cannot disable your own account; ask another administrator.", { field: "disabled" });
  const user = await db.transaction().execute(async (trx) => {
    const target = await trx.selectFrom("users").select(["id", "role", "disabled_at"]).where("id", "=", id).forUpdate().executeTakeFirst();
    if (!target) throw new ApiProblem(404, "not-found", `No user with id ${id}.`);
    if (disabled && target.role === "admin" && !target.disabled_at && (await activeAdminCount(trx)) <= 1) {
      throw new ApiProblem(409, "last-admin", "This is the only active administrator; make another user admin first.", { field: "disabled" });
    }
    const changed = await setUserDisabled(trx, id, disabled);
    if (Boolean(target.disabled_at) !== disabled) {
      await recordAudit(trx, admin, { action: disabled ? "user.disable" : "user.enable", subject: { type: "user", id, label: changed?.email }, summary: `${disabled ? "disabled" : "enabled"} the account of ${changed?.name ?? `user ${id}`}`, changes: { disabled: { from: Boolean(target.disabled_at), to: disabled } } });
    }
    return changed;
  });
  return NextResponse.json({ user });
});
