// zod is the one description of API input: these helpers parse it or answer 400/422 naming the field.
import type { z } from "zod";
import { ApiProblem } from "@/lib/api/problem";

export interface FieldIssue {
  field: string;
  reason: string;
}

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

/** Reads a JSON body: 400 when it is not JSON, 422 when it breaks the schema. */
export async function parseBody<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  let body: unknown;
  try {
    body = await request.json();
  } catch {
    throw new ApiProblem(400, "invalid-json", "The request body must be JSON, e.g. {\"role\": \"curator\"}");
  }
  const result = schema.safeParse(body);
  if (!result.success) throw invalid(422, "invalid-input", "Invalid input", result.error);
  return result.data;
}

/** Reads query parameters (each as a string): 400 when they break the schema. */
export function parseQuery<S extends z.ZodType>(url: string | URL, schema: S): z.output<S> {
  const params = Object.fromEntries(new URL(url).searchParams.entries());
  const result = schema.safeParse(params);
  if (!result.success) throw invalid(400, "invalid-query", "Invalid query", result.error);
  return result.data;
}

/** Reads dynamic route segments such as [id]: 400 when they break the schema. */
export function parseParams<S extends z.ZodType>(params: unknown, schema: S): z.output<S> {
  const result = schema.safeParse(params);
  if (!result.success) throw invalid(400, "invalid-path", "Invalid address", result.error);
  return result.data;
}
