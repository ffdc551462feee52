// Every route handler that changes something records it in the audit trail: for each entry of the
// role matrix with a changing method (POST, PUT, PATCH, DELETE), the route file must call
// recordAudit. Exempt, with the reason: sign-in itself (next-auth) and the plan preview, which
// computes without storing anything. A new changing route without a record fails here.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ROUTE_MATRIX } from "@/lib/auth/route-matrix";

const EXEMPT = new Set(["POST /api/auth/[...nextauth]", "POST /api/post-plans/preview"]);

describe("audit coverage", () => {
  it("every changing route handler calls recordAudit", () => {
    const changing = Object.keys(ROUTE_MATRIX).filter((key) => /^(POST|PUT|PATCH|DELETE) /.test(key) && !EXEMPT.has(key));
    expect(changing.length).toBeGreaterThan(25);
    const missing = changing.filter((key) => {
      const [method, route] = key.split(" ") as [string, string];
      const source = readFileSync(path.resolve("app", route.slice(1), "route.ts"), "utf8");
      // The handler's own text: from its export to the next export (or the end of the file).
      const start = source.indexOf(`export const ${method} `);
      if (start < 0) return true;
      const next = source.indexOf("\nexport const ", start + 1);
      return !source.slice(start, next < 0 ? undefined : next).includes("recordAudit(");
    });
    expect(missing).toEqual([]);
  });
});
