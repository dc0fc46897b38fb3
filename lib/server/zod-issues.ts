// zod issues as field messages, without pulling in the route wrapper (and next-auth) with them.
import type { z } from "zod";
import type { FieldIssue } from "./errors";

export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((i) => ({ field: i.path.join(".") || "(body)", message: i.message }));
}
