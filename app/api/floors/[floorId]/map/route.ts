// GET /api/floors/[floorId]/map: the floor map as an SVG file to keep or print (rooms, approved
// posts numbered, what they see, unseen floor, legend, date, exhibition, scale bar).
import { type NextRequest } from "next/server";
import { db } from "@/db";
import { floorIdParams } from "@/lib/api/galleries";
import { ApiProblem } from "@/lib/api/problem";
import { parseParams } from "@/lib/api/parse";
import { requireRole } from "@/lib/api/require-role";
import { route } from "@/lib/api/route";
import { floorMapSheet } from "@/lib/galleries/floor-map-source";

type Context = { params: Promise<{ floorId: string }> };

export const dynamic = "force-dynamic";

export const GET = route<Context>(async (request: NextRequest, context) => {
  await requireRole(request, "galleries:view");
  const { floorId } = parseParams(await context.params, floorIdParams);
  const sheet = await floorMapSheet(db, floorId);
  if (!sheet) throw new ApiProblem(404, "not-found", `There is no floor ${floorId}; reload the galleries.`);
  return new Response(sheet.svg, {
    headers: { "content-type": "image/svg+xml; charset=utf-8", "content-disposition": `attachment; filename="${sheet.fileName}.svg"`, "cache-control": "no-store" },
  });
});
