// Load on loopback with autocannon: 50 keep-alive clients for LOAD_SECONDS (default 20) against a
// running app (LOAD_BASE_URL, default http://127.0.0.1:3000 from `npm start`; DATABASE_URL of the
// same database, to find the demo guard's feed address). Routes: the guard's shifts data, the
// calendar feed, the My shifts page, and the plan preview of a small room; the health check is
// the peer, measured in the same run. Latencies are every response's own time (p50/p95/p99).
import autocannon from "autocannon";
import { createDb } from "../../db";
import { DEMO_PASSWORD } from "../../db/seed/accounts";
import { signedIn } from "../e2e/support/http";

const BASE = (process.env.LOAD_BASE_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
const SECONDS = Number(process.env.LOAD_SECONDS ?? 20);
const CONNECTIONS = 50;
const PASSWORD = process.env.LOAD_PASSWORD ?? DEMO_PASSWORD;

/** The session cookie of a demo account, signed in the way the browser tests do. */
async function signIn(email: string): Promise<string> {
  const { who } = await signedIn(email, PASSWORD, BASE);
  if (!who.jar.has("session-token")) throw new Error(`could not sign in ${email} at ${BASE}; set LOAD_PASSWORD`);
  return who.jar.header();
}

interface Row {
  name: string;
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  errors: number;
  /** 503 planner-busy with Retry-After: the planning pool's back-pressure, by design. */
  busy: number;
  total: number;
}

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? NaN;

async function load(name: string, options: { path: string; method?: "GET" | "POST"; headers?: Record<string, string>; body?: string }): Promise<Row> {
  const times: number[] = [];
  let bad = 0;
  let busy = 0;
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon(
      { url: BASE + options.path, method: options.method ?? "GET", headers: options.headers, body: options.body, connections: CONNECTIONS, duration: SECONDS, timeout: 10 },
      (error, done) => (error ? reject(error) : resolve(done)),
    );
    instance.on("response", (_client, status, _bytes, time) => {
      times.push(time);
      if (status === 503 && options.path.startsWith("/api/post-plans")) busy++;
      else if (status < 200 || status >= 300) bad++;
    });
  });
  times.sort((a, b) => a - b);
  return { name, rps: result.requests.average, p50: percentile(times, 0.5), p95: percentile(times, 0.95), p99: percentile(times, 0.99), errors: bad + result.errors + result.timeouts, busy, total: times.length };
}

export default async function loadBench(): Promise<string> {
  try {
    await fetch(`${BASE}/api/health`);
  } catch {
    return `No app answers at ${BASE}: start one (npm start), or set LOAD_BASE_URL, then run \`npm run bench -- load\` again.`;
  }
  const db = createDb(process.env.DATABASE_URL, { max: 1 });
  const guard = await db.selectFrom("guards").innerJoin("users", "users.id", "guards.user_id").select(["guards.calendar_token"]).where("users.email", "=", "guard@example.org").executeTakeFirstOrThrow();
  await db.destroy();
  const guardCookie = await signIn("guard@example.org");
  const curatorCookie = await signIn("curator@example.org");
  const today = new Date();
  const from = today.toISOString().slice(0, 10);
  const to = new Date(today.getTime() + 27 * 86_400_000).toISOString().slice(0, 10);
  const lRoom = JSON.stringify({ type: "Feature", properties: { name: "L-shaped gallery" }, geometry: { type: "Polygon", coordinates: [[[0, 0], [12, 0], [12, 5], [5, 5], [5, 10], [0, 10], [0, 0]]] } });
  const rows = [
    await load("health check (peer)", { path: "/api/health" }),
    await load("guard's shifts data GET /api/me/shifts", { path: `/api/me/shifts?from=${from}&to=${to}`, headers: { cookie: guardCookie } }),
    await load("calendar feed GET /api/calendar/[token]", { path: `/api/calendar/${guard.calendar_token}` }),
    await load("My shifts page GET /my-shifts", { path: "/my-shifts", headers: { cookie: guardCookie } }),
    await load("plan preview of an L-shaped room", { path: "/api/post-plans/preview", method: "POST", headers: { cookie: curatorCookie, "content-type": "application/json", origin: BASE }, body: lRoom }),
  ];
  const out = [
    `${CONNECTIONS} keep-alive clients, ${SECONDS} s per route, ${BASE} (autocannon ${"8.0.0"}).`,
    "",
    "| route | req/s | p50 ms | p95 ms | p99 ms | errors / requests | planner busy (503) |",
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: |",
    ...rows.map((r) => `| ${r.name} | ${r.rps.toFixed(0)} | ${r.p50.toFixed(0)} | ${r.p95.toFixed(0)} | ${r.p99.toFixed(0)} | ${r.errors} / ${r.total} | ${r.busy} |`),
  ];
  return out.join("\n");
}
