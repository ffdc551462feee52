// The one shape of an API error: { "error": { "code", "message", ...details } }.
import { NextResponse } from "next/server";

export type ErrorDetails = Record<string, unknown>;

/** An answer a route handler gives instead of its result; route() turns it into JSON. */
export class ApiProblem extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ErrorDetails,
    /** Extra response headers (e.g. Retry-After on 503). */
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = "ApiProblem";
  }

  toResponse(): NextResponse {
    return apiError(this.status, this.code, this.message, this.details, this.headers);
  }
}

export function apiError(status: number, code: string, message: string, details?: ErrorDetails, headers?: Record<string, string>): NextResponse {
  return NextResponse.json({ error: { ...details, code, message } }, { status, headers });
}

// node-postgres connection failures and PostgreSQL's "connection exception" / "operator intervention" classes.
const UNAVAILABLE_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "ENOTFOUND", "EAI_AGAIN", "57P01", "57P02", "57P03", "3D000"]);

/** True when an error means PostgreSQL cannot be reached, as opposed to a fault in our code. */
export function isDatabaseUnavailable(error: unknown): boolean {
  for (let cause: unknown = error, depth = 0; cause && depth < 5; depth++) {
    const code = (cause as { code?: unknown }).code;
    if (typeof code === "string" && (UNAVAILABLE_CODES.has(code) || code.startsWith("08"))) return true;
    const message = (cause as { message?: unknown }).message;
    if (typeof message === "string" && /Connection terminated|connect ECONNREFUSED|timeout exceeded when trying to connect/i.test(message)) return true;
    cause = (cause as { cause?: unknown }).cause ?? (cause as { errors?: unknown[] }).errors?.[0];
  }
  return false;
}
