// The one zod-issues conversion, as the server and the device both use it.
import { z } from "zod";
import { describe, expect, it } from "vitest";
import { zodIssues } from "@/lib/validation/issues";

const Schema = z.object({ title: z.string().min(1, "Give the tune a title"), sets: z.array(z.number()) }).strict();

function errorOf(value: unknown): z.ZodError {
  const r = Schema.safeParse(value);
  if (r.success) throw new Error("expected a failure");
  return r.error;
}

describe("zodIssues", () => {
  it("names each field by its dotted path, and the whole value as (body) unless told otherwise", () => {
    expect(zodIssues(errorOf({ title: "", sets: [1, "x"] }))).toEqual([
      { field: "title", message: "Give the tune a title" },
      { field: "sets.1", message: expect.any(String) },
    ]);
    expect(zodIssues(errorOf("text")).map((f) => f.field)).toEqual(["(body)"]);
    expect(zodIssues(errorOf("text"), { whole: "(form)" }).map((f) => f.field)).toEqual(["(form)"]);
  });

  it("puts a prefix before every path (a sync mutation's payload is under data)", () => {
    expect(zodIssues(errorOf({ title: "", sets: [] }), { prefix: "data" }).map((f) => f.field)).toEqual(["data.title"]);
    expect(zodIssues(errorOf("text"), { prefix: "data" }).map((f) => f.field)).toEqual(["data"]);
  });
});
