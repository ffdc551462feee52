// POST (operations): approve a post plan. Only a plan computed for the room's current walls and
// covering the whole floor can be approved; otherwise 409 / 422 with what to do, and nothing changes.
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { approvePostPlan } from "@/db/queries/post-plans";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { planIdParams } from "@/lib/api/plan-input";
import { recordAudit } from "@/lib/audit/record";

type Context = { params: Promise<{ planId: string }> };

export const dynamic = "force-dynamic";

export const POST = route<Context>(async (request: NextRequest, context) => {
  const user = await requireRole(request, "plans:approve");
  const { planId } = parseParams(await context.params, planIdParams);
  const approval = await approvePostPlan(planId, user.id, db);
  if (!approval.ok) {
    if (approval.reason === "not-found") throw new ApiProblem(404, "not-found", approval.message);
    if (approval.reason === "stale") {
      throw new ApiProblem(409, "stale-plan", approval.message, { roomVersion: approval.roomVersion, planRoomVersion: approval.planRoomVersion });
    }
    throw new ApiProblem(422, "plan-not-covering", approval.message, { covered: approval.covered });
  }
  if (!approval.alreadyApproved) {
    await recordAudit(db, user, { action: "post-plan.approve", subject: { type: "post-plan", id: planId }, summary: `approved post plan ${planId}`, changes: { planId } });
  }
  return NextResponse.json({ plan: approval.plan, alreadyApproved: approval.alreadyApproved });
});
