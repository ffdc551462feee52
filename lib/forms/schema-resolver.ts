// A react-hook-form resolver for forms that hold text while the shared zod schema judges numbers:
// `toInput` turns the form's values into what the API takes, the schema checks it, and each issue
// is placed on a form field (by default the first part of its path) with its message.
import type { FieldValues, Resolver } from "react-hook-form";
import type { z } from "zod";

export type IssuePlacement<T> = (issue: z.core.$ZodIssue, values: T) => { field: string; message: string };

const byFirstPathPart: IssuePlacement<unknown> = (issue) => ({ field: String(issue.path[0]), message: issue.message });

export function schemaResolver<T extends FieldValues>(schema: z.ZodType, toInput: (values: T) => unknown, place: IssuePlacement<T> = byFirstPathPart): Resolver<T> {
  return async (values) => {
    const parsed = schema.safeParse(toInput(values));
    if (parsed.success) return { values, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const issue of parsed.error.issues) {
      const { field, message } = place(issue, values);
      errors[field] ??= { type: "invalid", message };
    }
    return { values: {}, errors } as unknown as Awaited<ReturnType<Resolver<T>>>;
  };
}
