// PostgreSQL going away under a running app and coming back: a second copy of the built app
// reaches the database through a TCP relay this test controls. Cutting the relay (every open
// connection dropped, new ones refused, as when the server stops) turns the health check to 503
// and API routes to 503 JSON; opening it again brings both back without restarting the app, and a
// signed-in guard reads their shifts again.
import { createConnection, createServer, type Server, type Socket } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/accounts";
import { signedIn, type Caller } from "./support/http";
import { freePort, startSecondApp, type SecondApp } from "./support/second-app";

let app: SecondApp;
let relayPort: number;
let relay: Server | null = null;
const open = new Set<Socket>();
let target: { host: string; port: number };

function startRelay(): Promise<void> {
  return new Promise((resolve, reject) => {
    const server = createServer((client) => {
      const upstream = createConnection(target.port, target.host);
      open.add(client).add(upstream);
      const drop = () => {
        client.destroy();
        upstream.destroy();
        open.delete(client);
        open.delete(upstream);
      };
      client.on("error", drop).on("close", drop);
      upstream.on("error", drop).on("close", drop);
      client.pipe(upstream).pipe(client);
    });
    server.once("error", reject);
    server.listen(relayPort, "127.0.0.1", () => {
      relay = server;
      resolve();
    });
  });
}

async function stopRelay(): Promise<void> {
  const server = relay;
  relay = null;
  for (const socket of open) socket.destroy();
  open.clear();
  if (server) await new Promise((resolve) => server.close(resolve));
}

async function health(): Promise<number> {
  return (await fetch(`${app.url}/api/health`, { signal: AbortSignal.timeout(10_000) })).status;
}

async function waitFor(check: () => Promise<boolean>, what: string, seconds = 30): Promise<void> {
  const deadline = Date.now() + seconds * 1000;
  while (!(await check().catch(() => false))) {
    if (Date.now() > deadline) throw new Error(`${what} within ${seconds} s; the app said:\n${app.output().slice(-2000)}`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

/** A guard signed in on the second app (its own session cookie). */
async function guardOnSecondApp(): Promise<Caller> {
  const { who, status } = await signedIn("guard@example.org", DEMO_PASSWORD, app.url);
  if (status !== 200) throw new Error(`sign-in on the second app answered ${status}`);
  return who;
}

beforeAll(async () => {
  const url = new URL(process.env.DATABASE_URL!);
  target = { host: url.hostname, port: Number(url.port || 5432) };
  relayPort = await freePort();
  await startRelay();
  url.hostname = "127.0.0.1";
  url.port = String(relayPort);
  app = await startSecondApp({ DATABASE_URL: url.toString(), SIGHTWARD_JOB_WORKER: "off" });
});

afterAll(async () => {
  await app?.stop();
  await stopRelay();
});

describe("PostgreSQL stopped and started under the running app", () => {
  it("answers 503 while it is away and recovers by itself when it is back", async () => {
    expect(await health()).toBe(200);
    const guard = await guardOnSecondApp();
    const range = "from=2026-01-05&to=2026-02-01";
    expect((await guard.request(`/api/me/shifts?${range}`)).status).toBe(200);

    await stopRelay();
    await waitFor(async () => (await health()) === 503, "the health check did not turn 503");
    const away = await guard.request(`/api/me/shifts?${range}`);
    expect(away.status).toBe(503);
    const body = (await away.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("database-unavailable");
    expect(JSON.stringify(body)).not.toMatch(/at .*\.(js|ts):\d+/);

    await startRelay();
    await waitFor(async () => (await health()) === 200, "the health check did not recover");
    expect((await guard.request(`/api/me/shifts?${range}`)).status).toBe(200);
    expect(app.child.exitCode).toBeNull();
  }, 120_000);
});
