// The built app plans off its request thread: a second copy of the app with one planning thread and
// no waiting queue ends the job of a preview whose request is aborted (the editor moved on or its
// tab closed), keeps answering GET /api/health while a large hall's preview plans, and SIGTERM stops
// it while the planner is still busy (planning in worker threads leaves the server's thread free).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import { signedIn, type Caller } from "./support/http";
import { startSecondApp, type SecondApp } from "./support/second-app";
import { polygonOf, sawHall } from "../support/halls";

let app: SecondApp;
let curator: Caller;

beforeAll(async () => {
  app = await startSecondApp({ SIGHTWARD_PLAN_WORKERS: "1", SIGHTWARD_PLAN_QUEUE: "0" });
  const account = DEMO_ACCOUNTS.find((a) => a.role === "curator")!;
  curator = (await signedIn(account.email, DEMO_PASSWORD)).who;
}, 90_000);

afterAll(async () => {
  await app?.stop();
});

const PREVIEW = "/api/post-plans/preview";
const small = { type: "Polygon", coordinates: [[[0, 0], [10, 0], [10, 10], [5, 4], [0, 10]]] };

function post(body: unknown, signal?: AbortSignal): Promise<Response> {
  return fetch(app.url + PREVIEW, {
    method: "POST",
    headers: { cookie: curator.jar.header(), "content-type": "application/json" },
    body: JSON.stringify(body),
    signal,
  });
}

describe("planning in the built app", () => {
  it("ends the job of an aborted preview, so the only planning thread is free again", async () => {
    const controller = new AbortController();
    const running = post({ room: polygonOf(sawHall(300, 5, 20)), timeLimit: 10 }, controller.signal).catch(() => null);
    await new Promise((resolve) => setTimeout(resolve, 2000));
    // The thread is busy and nothing may wait: another preview is refused meanwhile.
    const refused = await post({ room: small });
    expect(refused.status).toBe(503);
    expect(refused.headers.get("retry-after")).toMatch(/^\d+$/);
    controller.abort();
    await running;
    // The aborted job ends within moments (it would otherwise plan for 10 s more).
    let status = 0;
    for (let attempt = 0; attempt < 20 && status !== 200; attempt++) {
      await new Promise((resolve) => setTimeout(resolve, 200));
      status = (await post({ room: small, timeLimit: 1 })).status;
    }
    expect(status).toBe(200);
  }, 60_000);

  it("answers health checks during a large preview, and stops on SIGTERM while planning", async () => {
    let settled = false;
    const preview = post({ room: polygonOf(sawHall(300, 5, 20)), timeLimit: 10 })
      .then((response) => response.status)
      .catch(() => "connection closed")
      .finally(() => {
        settled = true;
      });
    // Give the planning thread time to start and take the job.
    await new Promise((resolve) => setTimeout(resolve, 2000));
    const health = await fetch(app.url + "/api/health");
    expect(health.status).toBe(200);
    expect(await health.json()).toEqual({ status: "ok", database: "up" });
    expect(settled).toBe(false);

    const exited = new Promise<string>((resolve) => app.child.once("exit", (code, signal) => resolve(`${code ?? signal}`)));
    app.child.kill("SIGTERM");
    const outcome = await Promise.race([exited, new Promise<string>((resolve) => setTimeout(() => resolve("still running"), 10_000))]);
    expect(outcome).not.toBe("still running");
    await preview;
  }, 60_000);
});
