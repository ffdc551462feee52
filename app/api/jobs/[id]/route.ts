import { NextResponse, type NextRequest } from "next/server";
import { z } from "zod";
import { db } from "@/db";
import { jobById } from "@/db/queries/jobs";
import { ApiProblem } from "@/lib/api/problem";
import { idParam, parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";

type Context = { params: Promise<{ id: string }> };
const jobIdSchema = z.object({ id: idParam("id") });

/** GET /api/jobs/[id]: a background job's status and progress, for pages to poll (operations). */
export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "staffing:view");
  const { id } = parseParams(await context.params, jobIdSchema);
  const job = await jobById(db, id);
  if (!job) throw new ApiProblem(404, "not-found", `No job with id ${id}.`);
  return NextResponse.json({
    job: {
      id: job.id,
      kind: job.kind,
      status: job.status,
      progress: job.progress,
      message: job.message,
      result: job.result,
      attempts: job.attempts,
      createdAt: job.created_at,
      finishedAt: job.finished_at,
    },
  });
});
