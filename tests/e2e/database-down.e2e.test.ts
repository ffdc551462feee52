// With PostgreSQL out of reach, pages say "database unavailable" and API routes answer 503 JSON,
// never a stack trace. A second copy of the built app is started for this, pointed at a closed port.
import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn } from "./support/http";

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

async function waitUntilServing(url: string, child: ChildProcess, log: () => string): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`the second app exited (${child.exitCode}):\n${log()}`);
    try {
      await fetch(url + "/sign-in", { redirect: "manual" });
      return;
    } catch {
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
  }
  throw new Error(`the second app did not start within 60 s:\n${log()}`);
}

let app: ChildProcess;
let appUrl: string;
let output = "";
let browser: Browser;

beforeAll(async () => {
  const [appPort, deadPort] = [await freePort(), await freePort()];
  appUrl = `http://127.0.0.1:${appPort}`;
  app = spawn(process.execPath, [path.resolve("node_modules/next/dist/bin/next"), "start", "-H", "127.0.0.1", "-p", String(appPort)], {
    env: {
      ...process.env,
      // Nothing listens here: every query fails to connect, as when PostgreSQL is down.
      DATABASE_URL: `postgres://sightward@127.0.0.1:${deadPort}/sightward`,
      NEXTAUTH_URL: appUrl,
      NEXT_TELEMETRY_DISABLED: "1",
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  app.stdout?.on("data", (chunk) => (output += chunk));
  app.stderr?.on("data", (chunk) => (output += chunk));
  await waitUntilServing(appUrl, app, () => output);
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  if (app && app.exitCode === null) {
    app.kill("SIGTERM");
    await new Promise((resolve) => app.once("exit", resolve));
  }
});

describe("PostgreSQL unreachable", () => {
  it("a signed-in page shows \"Database unavailable\" inside the shell, without a stack trace", async () => {
    // Sign in on the healthy app; the session cookie belongs to the host, so it also reaches the second app.
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      const operations = DEMO_ACCOUNTS.find((a) => a.role === "operations")!;
      await signInThroughForm(page, operations.email, DEMO_PASSWORD);
      await page.waitForURL((url) => url.pathname === "/");
      await page.goto(appUrl + "/galleries");
      await page.getByRole("heading", { level: 1, name: "Database unavailable" }).waitFor({ timeout: 20_000 });
      await page.getByRole("navigation", { name: "Main" }).waitFor();
      const text = await page.locator("body").innerText();
      expect(text).not.toMatch(/ECONNREFUSED|\bat .+\.(js|ts):\d+|node_modules/);
    } finally {
      await context.close();
    }
  });

  it("an API route answers 503 database-unavailable as JSON", async () => {
    // A session from the healthy app, replayed against the second one.
    const admin = DEMO_ACCOUNTS.find((a) => a.role === "admin")!;
    const { who } = await signedIn(admin.email, DEMO_PASSWORD);
    const response = await fetch(appUrl + "/api/users", { headers: { cookie: who.jar.header() } });
    expect(response.status).toBe(503);
    const body = (await response.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("database-unavailable");
    expect(JSON.stringify(body)).not.toMatch(/ECONNREFUSED|\bat .+\.(js|ts):\d+/);
  });
});
