// Use cases parse their own input too, so a server action, a route and a test all get the same
// 422 naming the field.
import type { ZodType } from "zod";
import { AppError } from "./errors";
import { zodIssues } from "./zod-issues";

export function parseInput<T>(schema: ZodType<T>, input: unknown): T {
  const r = schema.safeParse(input);
  if (r.success) return r.data;
  const fields = zodIssues(r.error);
  const first = fields[0];
  throw new AppError("unprocessable", first ? first.message : "Check the form.", { fields });
}
