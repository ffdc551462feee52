import "server-only";
import type { NextRequest } from "next/server";
import { ApiProblem, apiError, isDatabaseUnavailable } from "@/lib/api/problem";
import { refuseForeignOrigin } from "@/lib/api/origin";
import { renewSession } from "@/lib/auth/token";
import { PlanPoolFull } from "@/lib/guarding/plan-pool-types";

type Handler<Ctx> = (request: NextRequest, context: Ctx) => Promise<Response>;

/**
 * Wraps a route handler: a state-changing call from another site's page is refused (403) before
 * the handler runs; an ApiProblem becomes its JSON answer, PostgreSQL being down or every planner
 * being busy becomes 503 (the latter with Retry-After),
 * anything else becomes a 500 with no stack trace (the trace goes to the server log only). A
 * working session's idle expiry is renewed on the answer.
 */
export function route<Ctx = { params: Promise<Record<string, string>> }>(handler: Handler<Ctx>): Handler<Ctx> {
  return async (request, context) => {
    let response: Response;
    try {
      refuseForeignOrigin(request);
      response = await handler(request, context);
    } catch (error) {
      if (error instanceof ApiProblem) return error.toResponse();
      if (error instanceof PlanPoolFull) {
        const retryAfter = String(error.retryAfterSeconds);
        return apiError(503, "planner-busy", error.message, { retryAfterSeconds: error.retryAfterSeconds }, { "Retry-After": retryAfter });
      }
      if (isDatabaseUnavailable(error)) {
        return apiError(503, "database-unavailable", "The database is unavailable; try again shortly.");
      }
      console.error(`[api] ${request.method} ${request.nextUrl.pathname} failed:`, error);
      return apiError(500, "internal", "Something went wrong on the server; it has been logged.");
    }
    if (response.ok) await renewSession(request, response).catch(() => undefined);
    return response;
  };
}
