// With PostgreSQL out of reach, pages say "database unavailable" and API routes answer 503 JSON,
// never a stack trace. A second copy of the built app is started for this, pointed at a closed port.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed/accounts";
import { launchBrowser, newContext, signInThroughForm } from "./support/browser";
import { signedIn } from "./support/http";
import { freePort, startSecondApp, type SecondApp } from "./support/second-app";

let app: SecondApp;
let appUrl: string;
let browser: Browser;

beforeAll(async () => {
  // Nothing listens on this port: every query fails to connect, as when PostgreSQL is down.
  app = await startSecondApp({ DATABASE_URL: `postgres://sightward@127.0.0.1:${await freePort()}/sightward` });
  appUrl = app.url;
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await app?.stop();
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
