// The built app plans off its request thread: a second copy of the app with one planning thread
// keeps answering GET /api/health while a large hall's preview plans, and SIGTERM stops it while
// the planner is still busy (planning in worker threads leaves the server's own thread free).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import { signedIn, type Caller } from "./support/http";
import { startSecondApp, type SecondApp } from "./support/second-app";
import { polygonOf, sawHall } from "../support/halls";

let app: SecondApp;
let curator: Caller;

beforeAll(async () => {
  app = await startSecondApp({ SIGHTWARD_PLAN_WORKERS: "1" });
  const account = DEMO_ACCOUNTS.find((a) => a.role === "curator")!;
  curator = (await signedIn(account.email, DEMO_PASSWORD)).who;
}, 90_000);

afterAll(async () => {
  await app?.stop();
});

describe("planning in the built app", () => {
  it("answers health checks during a large preview, and stops on SIGTERM while planning", async () => {
    let settled = false;
    const preview = fetch(app.url + "/api/post-plans/preview", {
      method: "POST",
      headers: { cookie: curator.jar.header(), "content-type": "application/json" },
      body: JSON.stringify({ room: polygonOf(sawHall(300, 5, 20)), timeLimit: 10 }),
    })
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
