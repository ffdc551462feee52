// Where the built app under test runs, and a database handle to check what it shows and writes.
import { createDb } from "@/db";

export function baseUrl(): string {
  const url = process.env.E2E_BASE_URL;
  if (!url) throw new Error("E2E_BASE_URL is not set: start the built app (npm test does) and point E2E_BASE_URL at it");
  return url.replace(/\/$/, "");
}

/** A small pool on the same database the app uses (DATABASE_URL); destroy() it in afterAll. */
export function testDb() {
  return createDb(process.env.DATABASE_URL, { max: 2 });
}
