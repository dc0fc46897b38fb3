// The one conversion of zod issues into field messages, used by the server (route params, query,
// bodies, use-case input, sync mutations) and by the device (a form checked before it is sent).
// Pure: no server-only code, so browser code may import it.
import type { z } from "zod";

export interface FieldIssue {
  field: string;
  message: string;
  /** For the chart text: where the problem is (1-based). */
  line?: number;
  column?: number;
}

export interface IssueOptions {
  /** Put before every field path, e.g. "data" for a sync mutation's payload. */
  prefix?: string;
  /** The field name used when an issue concerns the whole value rather than one field. */
  whole?: string;
}

export function zodIssues(error: z.ZodError, options: IssueOptions = {}): FieldIssue[] {
  const whole = options.whole ?? "(body)";
  return error.issues.map((i) => {
    const path = i.path.map(String).join(".");
    const field = options.prefix ? [options.prefix, path].filter(Boolean).join(".") : path || whole;
    return { field, message: i.message };
  });
}

/** The message shown when a value fails: the first issue's words, else the fallback. */
export function firstIssueMessage(fields: readonly FieldIssue[], fallback: string): string {
  return fields[0]?.message ?? fallback;
}
