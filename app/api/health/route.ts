// GET /api/health: 200 {"status":"ok","database":"up"}, or 503 {"status":"degraded",
// "database":"down"} when PostgreSQL does not answer within 2 s. No sign-in needed.
import { NextResponse } from "next/server";
import { db } from "@/db";
import { checkHealth } from "@/lib/health";

export const dynamic = "force-dynamic";
export const runtime = "nodejs";

export async function GET(): Promise<NextResponse> {
  const { httpStatus, body } = await checkHealth(db, 2000);
  return NextResponse.json(body, { status: httpStatus, headers: { "cache-control": "no-store" } });
}
