// GET: one post plan (anyone who may see galleries).
import { NextResponse, type NextRequest } from "next/server";
import { db } from "@/db";
import { postPlanById } from "@/db/queries/post-plans";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { planIdParams } from "@/lib/api/plan-input";

type Context = { params: Promise<{ planId: string }> };

export const dynamic = "force-dynamic";

export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "galleries:view");
  const { planId } = parseParams(await context.params, planIdParams);
  const plan = await postPlanById(planId, db);
  if (!plan) throw new ApiProblem(404, "not-found", `There is no post plan ${planId}.`);
  return NextResponse.json({ plan });
});
