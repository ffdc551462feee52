// Debian's Chromium driven by playwright-core: never a browser download, nothing leaves the machine.
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { baseUrl } from "./server";

const CHROMIUM = process.env.CHROMIUM_PATH || "/usr/bin/chromium";

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--no-first-run",
    ],
  });
}

export async function newContext(browser: Browser, options: { phone?: boolean } = {}): Promise<BrowserContext> {
  return browser.newContext({
    baseURL: baseUrl(),
    viewport: options.phone ? { width: 390, height: 844 } : { width: 1280, height: 900 },
  });
}

/** Fills our sign-in form and submits it; waits for the page that follows, or for the error. */
export async function signInThroughForm(page: Page, email: string, password: string): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** The next-auth session cookie, if the browser holds one. */
export async function sessionCookie(context: BrowserContext) {
  return (await context.cookies()).find((cookie) => cookie.name.endsWith("next-auth.session-token"));
}
