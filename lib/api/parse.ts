// zod is the one description of API input: these helpers parse it or answer 4xx naming the field.
// Before zod sees a body it must be JSON by its content-type (415 otherwise: a cross-site form can
// only send text/plain, urlencoded or multipart), fit the size limit (413, read with a streaming
// cap so a 50 MB body is never held whole), and hold no NUL character anywhere (400: PostgreSQL
// text cannot store it).
import type { z } from "zod";
import { ApiProblem } from "@/lib/api/problem";

export { MAX_ID, bodyId, counter, idParam } from "@/lib/api/ids";

export interface FieldIssue {
  field: string;
  reason: string;
}

/** The body size limit of every JSON route unless it names its own (README: "Limits"). */
export const DEFAULT_BODY_LIMIT = 1024 * 1024;
/** Room outlines (PUT /api/rooms/[roomId], the plan preview): 50,000 corners as JSON fit in 4 MB. */
export const ROOM_BODY_LIMIT = 4 * 1024 * 1024;

function fieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({
    field: issue.path.length ? issue.path.map(String).join(".") : "(body)",
    reason: issue.message,
  }));
}

function invalid(status: 400 | 422, code: string, what: string, error: z.ZodError): ApiProblem {
  const issues = fieldIssues(error);
  const first = issues[0];
  const message = first ? `${what}: ${first.field}: ${first.reason}` : `${what} is not valid`;
  return new ApiProblem(status, code, message, { issues, field: first?.field });
}

function megabytes(bytes: number): string {
  return `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MB`;
}

function tooLarge(limit: number): ApiProblem {
  return new ApiProblem(413, "body-too-large", `The request body is larger than ${megabytes(limit)}; send less at once.`, { limitBytes: limit });
}

/** True for application/json and any application/…+json type, with or without parameters. */
export function isJsonContentType(value: string | null): boolean {
  if (!value) return false;
  const type = value.split(";")[0].trim().toLowerCase();
  return type === "application/json" || (type.startsWith("application/") && type.endsWith("+json"));
}

/** Reads the body as text, stopping (413) as soon as it passes `limit` bytes. */
export async function readTextCapped(request: Request, limit: number): Promise<string> {
  const declared = Number(request.headers.get("content-length"));
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit);
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(limit);
    }
    chunks.push(value);
  }
  const all = new Uint8Array(size);
  let at = 0;
  for (const chunk of chunks) {
    all.set(chunk, at);
    at += chunk.byteLength;
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(all);
  } catch {
    throw new ApiProblem(400, "invalid-encoding", "The request body must be UTF-8 text.");
  }
}

/** The path of the first string (or key) holding a NUL character, or null. */
export function nulPath(value: unknown, path: string[] = []): string | null {
  if (typeof value === "string") return value.includes("\u0000") ? path.join(".") || "(body)" : null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = nulPath(value[i], [...path, String(i)]);
      if (found !== null) return found;
    }
    return null;
  }
  if (value && typeof value === "object") {
    for (const [key, item] of Object.entries(value)) {
      if (key.includes("\u0000")) return [...path, key.replace(/\u0000/g, "\\0")].join(".");
      const found = nulPath(item, [...path, key]);
      if (found !== null) return found;
    }
  }
  return null;
}

function refuseNul(value: unknown): void {
  const field = nulPath(value);
  if (field !== null) {
    throw new ApiProblem(400, "nul-character", `${field}: text may not contain the NUL character (\\u0000); remove it and send again.`, { field });
  }
}

export interface BodyOptions {
  /** Bytes; DEFAULT_BODY_LIMIT (1 MB) unless the route documents its own. */
  limit?: number;
}

/**
 * Reads a JSON body without a schema (for routes whose engine validates it): 415 when the
 * content-type is not JSON, 413 past the limit, 400 when it is not JSON or holds a NUL character.
 */
export async function readJsonBody(request: Request, options: BodyOptions = {}): Promise<unknown> {
  if (!isJsonContentType(request.headers.get("content-type"))) {
    throw new ApiProblem(415, "unsupported-media-type", "Send the body as JSON with the header content-type: application/json.");
  }
  const text = await readTextCapped(request, options.limit ?? DEFAULT_BODY_LIMIT);
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new ApiProblem(400, "invalid-json", "The request body must be JSON, e.g. {\"role\": \"curator\"}");
  }
  refuseNul(body);
  return body;
}

/** Reads a JSON body (readJsonBody's checks), then 422 when it breaks the schema. */
export async function parseBody<S extends z.ZodType>(request: Request, schema: S, options: BodyOptions = {}): Promise<z.output<S>> {
  const body = await readJsonBody(request, options);
  const result = schema.safeParse(body);
  if (!result.success) throw invalid(422, "invalid-input", "Invalid input", result.error);
  return result.data;
}

/** Reads query parameters (each as a string): 400 when they hold a NUL or break the schema. */
export function parseQuery<S extends z.ZodType>(url: string | URL, schema: S): z.output<S> {
  const params = Object.fromEntries(new URL(url).searchParams.entries());
  refuseNul(params);
  const result = schema.safeParse(params);
  if (!result.success) throw invalid(400, "invalid-query", "Invalid query", result.error);
  return result.data;
}

/** Reads dynamic route segments such as [id]: 400 when they break the schema. */
export function parseParams<S extends z.ZodType>(params: unknown, schema: S): z.output<S> {
  refuseNul(params);
  const result = schema.safeParse(params);
  if (!result.success) throw invalid(400, "invalid-path", "Invalid address", result.error);
  return result.data;
}
