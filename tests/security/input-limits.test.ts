// The request reader every JSON route uses (lib/api/parse.ts) and the one id schema
// (lib/api/ids.ts), checked without a server: content-type, size cap read from a stream, NUL
// characters, ids beyond PostgreSQL's integer, dates outside the roster side's range.
import { describe, expect, it, vi } from "vitest";
import { z } from "zod";

vi.mock("server-only", () => ({}));

const { DEFAULT_BODY_LIMIT, MAX_ID, bodyId, idParam, isJsonContentType, nulPath, parseBody, parseParams, parseQuery, readJsonBody } = await import("@/lib/api/parse");
const { ApiProblem } = await import("@/lib/api/problem");
const { buildRequestSchema, timeOffRequestSchema, weekQuerySchema } = await import("@/lib/rosters/schemas");

async function problemOf(promise: Promise<unknown> | (() => unknown)): Promise<InstanceType<typeof ApiProblem>> {
  try {
    await (typeof promise === "function" ? promise() : promise);
  } catch (error) {
    if (error instanceof ApiProblem) return error;
    throw error;
  }
  throw new Error("expected an ApiProblem, got an answer");
}

function jsonRequest(body: BodyInit, headers: Record<string, string> = { "content-type": "application/json" }) {
  return new Request("http://127.0.0.1/api/x", { method: "POST", body, headers, duplex: "half" } as RequestInit);
}

describe("ids (PostgreSQL manual, Numeric Types: integer is -2147483648 to +2147483647)", () => {
  const schema = z.object({ id: idParam("id") });
  it("accepts 1 and 2147483647 and answers numbers", () => {
    expect(MAX_ID).toBe(2 ** 31 - 1);
    expect(parseParams({ id: "1" }, schema)).toEqual({ id: 1 });
    expect(parseParams({ id: "2147483647" }, schema)).toEqual({ id: 2147483647 });
  });
  it.each(["2147483648", "99999999999", "0", "-1", "1e3", "0x10", " 7", "+7", "1.0", "", "NaN", "Infinity", "12abc", "9".repeat(400)])(
    "refuses %j with a 400 naming the field",
    async (id) => {
      const problem = await problemOf(() => parseParams({ id }, schema));
      expect(problem.status).toBe(400);
      expect(problem.details?.field).toBe("id");
      expect(problem.message).toMatch(/^Invalid address: id: /);
    },
  );
  it("bounds ids in bodies the same way", () => {
    expect(bodyId("guardId").safeParse(2147483647).success).toBe(true);
    expect(bodyId("guardId").safeParse(2147483648).success).toBe(false);
    expect(bodyId("guardId").safeParse(1e308).success).toBe(false);
    expect(bodyId("guardId").safeParse(Number.NaN).success).toBe(false);
  });
});

describe("JSON bodies", () => {
  const schema = z.object({ name: z.string() });

  it("knows JSON content-types (RFC 8259 section 11: application/json; RFC 6839: +json suffix)", () => {
    expect(isJsonContentType("application/json")).toBe(true);
    expect(isJsonContentType("application/json; charset=utf-8")).toBe(true);
    expect(isJsonContentType("application/geo+json")).toBe(true);
    for (const type of ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x", "text/json", null, ""]) {
      expect(isJsonContentType(type)).toBe(false);
    }
  });

  it.each(["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=b"])("refuses content-type %s with 415", async (type) => {
    const problem = await problemOf(parseBody(jsonRequest('{"name":"x"}', { "content-type": type }), schema));
    expect(problem.status).toBe(415);
    expect(problem.message).toMatch(/content-type: application\/json/);
  });

  it("refuses a missing content-type with 415", async () => {
    const request = new Request("http://127.0.0.1/api/x", { method: "POST", body: new Blob(['{"name":"x"}']) });
    expect((await problemOf(parseBody(request, schema))).status).toBe(415);
  });

  it("stops reading a stream past the limit (413) instead of holding 50 MB", async () => {
    let pulled = 0;
    const chunk = new Uint8Array(64 * 1024).fill(0x20);
    const fifty = (50 * 1024 * 1024) / chunk.byteLength;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled++;
        if (pulled > fifty) controller.close();
        else controller.enqueue(chunk);
      },
    });
    const problem = await problemOf(readJsonBody(jsonRequest(stream)));
    expect(problem.status).toBe(413);
    expect(problem.details?.limitBytes).toBe(DEFAULT_BODY_LIMIT);
    // 1 MB / 64 KB = 16 chunks fit; the reader gave up on the 17th plus at most the stream's read-ahead.
    expect(pulled).toBeLessThan(24);
  });

  it("refuses a declared content-length past the limit before reading", async () => {
    const request = jsonRequest('{"name":"x"}', { "content-type": "application/json", "content-length": String(DEFAULT_BODY_LIMIT + 1) });
    expect((await problemOf(readJsonBody(request))).status).toBe(413);
  });

  it("takes a body just under the limit and honours a route's own limit", async () => {
    const name = "a".repeat(DEFAULT_BODY_LIMIT - 20);
    expect(await parseBody(jsonRequest(JSON.stringify({ name })), schema)).toEqual({ name });
    expect((await problemOf(readJsonBody(jsonRequest(JSON.stringify({ name })), { limit: 1000 }))).status).toBe(413);
  });

  it.each([
    ['{"name":"a\\u0000b"}', "name"],
    ['{"list":["ok","\\u0000"]}', "list.1"],
    ['{"a\\u0000":1}', "a\\0"],
    ['"\\u0000"', "(body)"],
  ])("refuses NUL characters in %s (400 naming %s)", async (text, field) => {
    const problem = await problemOf(readJsonBody(jsonRequest(text)));
    expect(problem.status).toBe(400);
    expect(problem.code).toBe("nul-character");
    expect(problem.details?.field).toBe(field);
  });

  it("refuses NUL in query strings and path segments", async () => {
    expect((await problemOf(() => parseQuery("http://x/api?to=a%00b", z.object({ to: z.string() })))).status).toBe(400);
    expect((await problemOf(() => parseParams({ id: "1\u0000" }, z.object({ id: idParam("id") })))).status).toBe(400);
    expect(nulPath({ a: [{ b: "fine" }] })).toBeNull();
  });

  it("refuses bytes that are not UTF-8 (RFC 8259 section 8.1) and text that is not JSON", async () => {
    expect((await problemOf(readJsonBody(jsonRequest(new Uint8Array([0x22, 0xff, 0xfe, 0x22]))))).code).toBe("invalid-encoding");
    expect((await problemOf(readJsonBody(jsonRequest("{name:")))).code).toBe("invalid-json");
    expect((await problemOf(readJsonBody(jsonRequest("")))).code).toBe("invalid-json");
  });
});

describe("dates of the roster side stay within 2000-2100", () => {
  it.each(["0000-01-01", "1970-01-05", "1999-12-27", "2101-01-03", "9999-12-27"])("refuses %s for time off and builds", (date) => {
    expect(timeOffRequestSchema.safeParse({ startsOn: date, endsOn: date }).success).toBe(false);
    expect(buildRequestSchema.safeParse({ startsOn: date }).success).toBe(false);
    expect(weekQuerySchema.safeParse({ startsOn: date }).success).toBe(false);
  });
  it("accepts Mondays inside the range (2000-01-03 and 2100-12-27 are Mondays)", () => {
    expect(buildRequestSchema.safeParse({ startsOn: "2000-01-03" }).success).toBe(true);
    expect(buildRequestSchema.safeParse({ startsOn: "2100-12-27" }).success).toBe(true);
    expect(timeOffRequestSchema.safeParse({ startsOn: "2100-12-30", endsOn: "2100-12-31" }).success).toBe(true);
  });
});
