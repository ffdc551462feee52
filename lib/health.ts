// The health check behind GET /api/health: is PostgreSQL answering? Kept apart from the route
// handler so tests can call it with any database handle, no server needed.
import { sql, type Kysely } from "kysely";

export interface HealthBody {
  status: "ok" | "degraded";
  database: "up" | "down";
}

export interface HealthResult {
  httpStatus: 200 | 503;
  body: HealthBody;
}

/** Asks the database for `select 1`; "down" when it errs or takes longer than timeoutMs. */
export async function checkHealth(database: Kysely<any>, timeoutMs = 2000): Promise<HealthResult> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${timeoutMs} ms`)), timeoutMs);
  });
  try {
    await Promise.race([sql`select 1`.execute(database), timeout]);
    return { httpStatus: 200, body: { status: "ok", database: "up" } };
  } catch {
    return { httpStatus: 503, body: { status: "degraded", database: "down" } };
  } finally {
    clearTimeout(timer);
  }
}
