// Where a request's time goes, without HTTP: the guard's shifts route handler called in-process,
// one call after another, against its own parts (the role check, each query) and the health
// handler as the peer, measured in the same run. Needs DATABASE_URL and the demo seed; run with
// NODE_OPTIONS=--conditions=react-server so `server-only` modules load outside Next.js:
//   NODE_OPTIONS=--conditions=react-server npm run bench -- handlers
import { NextRequest } from "next/server";
import { encode } from "next-auth/jwt";
import { createDb } from "../../db";

export default async function handlersBench(): Promise<string> {
  process.env.NEXTAUTH_SECRET ??= "handlers-bench-secret-not-for-production";
  const db = createDb(process.env.DATABASE_URL, { max: 2 });
  const user = await db.selectFrom("users").select(["id", "email", "name", "role"]).where("email", "=", "guard@example.org").executeTakeFirstOrThrow();
  const token = await encode({ token: { uid: user.id, role: user.role, email: user.email, name: user.name, signedInAt: Math.floor(Date.now() / 1000) }, secret: process.env.NEXTAUTH_SECRET });
  const { GET: shifts } = await import("../../app/api/me/shifts/route");
  const { GET: health } = await import("../../app/api/health/route");
  const { requireRole } = await import("../../lib/api/require-role");
  const { guardByUserId, siteById } = await import("../../db/queries/rosters");
  const { publishedShiftsOfGuardBetween } = await import("../../db/queries/guard-shifts");
  const request = (path: string) => new NextRequest(`http://127.0.0.1${path}`, { headers: { cookie: `next-auth.session-token=${token}` } });
  const none = { params: Promise.resolve({}) } as never;
  const guard = (await guardByUserId(db, user.id))!;
  const rows: string[] = ["| step | ms per call (median of 5 runs of 200) |", "| --- | ---: |"];
  const time = async (name: string, fn: () => Promise<unknown>) => {
    for (let i = 0; i < 30; i++) await fn();
    const runs: number[] = [];
    for (let r = 0; r < 5; r++) {
      const t = performance.now();
      for (let i = 0; i < 200; i++) await fn();
      runs.push((performance.now() - t) / 200);
    }
    rows.push(`| ${name} | ${runs.sort((a, b) => a - b)[2]!.toFixed(3)} |`);
  };
  await time("health handler (peer)", () => health());
  await time("GET /api/me/shifts handler, 4 weeks", () => shifts(request("/api/me/shifts?from=2026-12-01&to=2026-12-28"), none));
  await time("  role check (token + user row)", () => requireRole(request("/api/me/shifts"), "shifts:own"));
  await time("  guard of the user", () => guardByUserId(db, user.id));
  await time("  the guard's site", () => siteById(db, guard.site_id));
  await time("  published shifts in range", () => publishedShiftsOfGuardBetween(db, guard.id, new Date("2026-12-01"), new Date("2026-12-29")));
  await db.destroy();
  return rows.join("\n");
}
