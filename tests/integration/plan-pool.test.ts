// Planning off the request thread: the plan preview route in-process against the real PostgreSQL
// (sign-in) with the server's planning pool. The server keeps answering (GET /api/health) while a
// large preview plans; a job past its hard deadline has its thread ended and answers the best plan
// found so far (the guaranteed plan, floor((n + 2h) / 3) posts at most: O'Rourke 1987, Hoffmann,
// Kaufmann & Kriegel 1991 for rooms with obstacles) and why it stopped; a full pool answers 503
// with Retry-After; a cancelled request frees its thread for the next room.
import { vi } from "vitest";
// `server-only` refuses to load outside a React server build; here it only marks the modules.
vi.mock("server-only", () => ({}));

import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { NextRequest } from "next/server";
import type { Kysely } from "kysely";
import { createDb } from "@/db";
import type { Database } from "@/db/schema";
import { POST as preview } from "@/app/api/post-plans/preview/route";
import { GET as health } from "@/app/api/health/route";
import { closePlanPool, planPool } from "@/lib/guarding/plan-pool";
import { polygonOf, sawHall } from "../support/halls";
import { requireDatabaseUrl } from "./support/database";
import { signedRequest, userByEmail, type SignedUser } from "./support/signed-request";

const big = sawHall(300, 5, 20);
const polygon = polygonOf;
const small = { type: "Polygon", coordinates: [[[0, 0], [10, 0], [10, 10], [5, 4], [0, 10]]] };

const ENV = ["SIGHTWARD_PLAN_WORKERS", "SIGHTWARD_PLAN_QUEUE", "SIGHTWARD_PLAN_GRACE_SECONDS", "SIGHTWARD_PLAN_OVERHEAD_SECONDS"] as const;
const saved = Object.fromEntries(ENV.map((name) => [name, process.env[name]]));
let db: Kysely<Database>;
let curator: SignedUser;

beforeAll(async () => {
  db = createDb(requireDatabaseUrl(), { max: 2 });
  curator = await userByEmail(db, "curator@example.org");
});
afterEach(async () => {
  await closePlanPool();
  for (const name of ENV) {
    if (saved[name] === undefined) delete process.env[name];
    else process.env[name] = saved[name];
  }
});
afterAll(async () => {
  await db.destroy();
});

async function ask(body: unknown, signal?: AbortSignal) {
  const signed = await signedRequest(curator, "http://127.0.0.1/api/post-plans/preview", body);
  const request = new NextRequest(signed.url, { method: "POST", headers: signed.headers, body: JSON.stringify(body), signal });
  const response = await preview(request, { params: Promise.resolve({}) });
  return { status: response.status, headers: response.headers, body: (await response.json()) as Record<string, any> };
}

describe("the planning pool behind the plan preview", () => {
  it("keeps answering health checks while a large room plans, and ends a cancelled job", async () => {
    process.env.SIGHTWARD_PLAN_WORKERS = "1";
    const controller = new AbortController();
    let settled = false;
    const running = ask({ room: polygon(big), timeLimit: 10 }, controller.signal).finally(() => {
      settled = true;
    });
    // Wait until the thread has the job, then ask for health: it answers while the job runs.
    await vi.waitFor(() => expect(planPool().stats().busy).toBe(1), { timeout: 10_000 });
    const answer = await health();
    expect(answer.status).toBe(200);
    expect(await answer.json()).toEqual({ status: "ok", database: "up" });
    expect(settled).toBe(false);
    // Closing the editor tab aborts the request: the job ends and its thread is free again.
    controller.abort();
    const cancelled = await running;
    expect(cancelled.status).toBe(499);
    expect(cancelled.body.error.code).toBe("cancelled");
    expect(planPool().stats()).toMatchObject({ busy: 0, queued: 0 });
    const next = await ask({ room: small, timeLimit: 2 });
    expect(next.status).toBe(200);
    expect(next.body.room.fewest.posts).toHaveLength(1);
  }, 60_000);

  it("ends a job at its hard deadline and answers the guaranteed plan with the reason", async () => {
    process.env.SIGHTWARD_PLAN_WORKERS = "1";
    process.env.SIGHTWARD_PLAN_OVERHEAD_SECONDS = "0";
    process.env.SIGHTWARD_PLAN_GRACE_SECONDS = "0.2";
    const answer = await ask({ room: polygon(big), timeLimit: 0.2 });
    expect(answer.status).toBe(200);
    const room = answer.body.room;
    expect(room.stoppedBecause).toBe("deadline");
    expect(room.fewest).toBeUndefined();
    expect(room.vertices).toBe(big.outline.length + big.obstacles.length * 4);
    expect(room.obstacles).toBe(big.obstacles.length);
    // floor((n + 2h) / 3) with n all corners and h obstacles (Hoffmann, Kaufmann & Kriegel 1991).
    expect(room.bound).toBe(Math.floor((room.vertices + 2 * room.obstacles) / 3));
    expect(room.guaranteed.posts.length).toBeLessThanOrEqual(room.bound);
    expect(room.best.posts.length).toBeGreaterThan(0);
    expect(room.best.posts.length).toBeLessThanOrEqual(room.bound);
    // No sight range and every corner allowed: the theorem covers the guaranteed plan's posts.
    expect(room.best).toMatchObject({ method: "guaranteed", covered: 1, coveredBy: "theorem" });
    expect(planPool().stats()).toMatchObject({ busy: 0, queued: 0 });
  }, 60_000);

  it("answers 503 with Retry-After when every planner is busy and the queue is full", async () => {
    process.env.SIGHTWARD_PLAN_WORKERS = "1";
    process.env.SIGHTWARD_PLAN_QUEUE = "0";
    const controller = new AbortController();
    const running = ask({ room: polygon(big), timeLimit: 10 }, controller.signal);
    await vi.waitFor(() => expect(planPool().stats().busy).toBe(1), { timeout: 10_000 });
    const refused = await ask({ room: small });
    expect(refused.status).toBe(503);
    expect(refused.body.error.code).toBe("planner-busy");
    expect(refused.body.error.message).toMatch(/try again in \d+ s/);
    const retryAfter = Number(refused.headers.get("retry-after"));
    expect(Number.isInteger(retryAfter) && retryAfter >= 1).toBe(true);
    expect(refused.body.error.retryAfterSeconds).toBe(retryAfter);
    controller.abort();
    expect((await running).status).toBe(499);
  }, 60_000);

  it("still answers bad input with 422 before anything is queued", async () => {
    process.env.SIGHTWARD_PLAN_WORKERS = "1";
    process.env.SIGHTWARD_PLAN_QUEUE = "0";
    const answer = await ask({ room: { type: "Polygon", coordinates: "nope" } });
    expect(answer.status).toBe(422);
    expect(answer.body.error.code).toBe("invalid-input");
    expect(planPool().stats()).toMatchObject({ busy: 0, queued: 0 });
  });
});
