// The one path from a zod failure to an AppError. Use cases parse their own input with it, and the
// route and action wrappers parse addresses, queries and bodies with it, so a server action, a
// route and a test all get the same 400/422 naming the field.
import type { ZodType } from "zod";
import { firstIssueMessage, zodIssues } from "@/lib/validation/issues";
import { AppError, type ErrorCode } from "./errors";

export interface ParseOptions {
  /** "unprocessable" (422) for bodies and form input; "bad_request" (400) for addresses and queries. */
  code?: Extract<ErrorCode, "unprocessable" | "bad_request">;
  /** Said when zod gives no issue text. */
  fallback?: string;
  /** Put before every field path (a sync mutation's payload is under "data"). */
  prefix?: string;
}

export function parseInput<T>(schema: ZodType<T>, input: unknown, options: ParseOptions = {}): T {
  const r = schema.safeParse(input);
  if (r.success) return r.data;
  const fields = zodIssues(r.error, { prefix: options.prefix });
  // Plain words: the field's name travels in `fields`, so the form can put the message beside it.
  throw new AppError(options.code ?? "unprocessable", firstIssueMessage(fields, options.fallback ?? "Check the form."), { fields });
}
