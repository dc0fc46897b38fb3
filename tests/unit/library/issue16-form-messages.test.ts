// Issue 16 item 6: every form message sits at its field and reads as plain words — no backticks from
// the chart-text parser, no "email: …" field-name prefixes from the validation layer.
import { describe, expect, it } from "vitest";
import { parseChartText } from "@/lib/chart/text-parse";
import { ChartTextError } from "@/lib/chart";
import { composeText, emptyValues, fromServerFields, placeProblem, toInput } from "@/components/library/chart-form-model";
import { parseInput } from "@/lib/server/input";
import { AppError } from "@/lib/server/errors";
import { SignUpSchema } from "@/lib/validation/auth";

const FIELD_PREFIX = /^(email|password|name|instrument|title|sourceText|tempo|key|meter)\s*:/i;

function problemOf(text: string): ChartTextError {
  try {
    parseChartText(text);
  } catch (e) {
    if (e instanceof ChartTextError) return e;
    throw e;
  }
  throw new Error("expected a chart-text problem");
}

function signUpFailure(body: unknown): AppError {
  try {
    parseInput(SignUpSchema, body);
  } catch (e) {
    if (e instanceof AppError) return e;
    throw e;
  }
  throw new Error("expected the sign-up body to be refused");
}

describe("item 6: form errors sit at their field, in plain words", () => {
  it("puts the empty chart-text error at the chart-text box (line 1), not on the time signature field", () => {
    const composed = composeText({ ...emptyValues(), title: "Tidewater Clock", sourceText: "" });
    const p = problemOf(composed.text);
    // The parser finds it on the last header line ("time: 4/4"), which used to land under Time signature.
    expect(composed.header[p.line - 1]).toBe("meter");
    const placed = placeProblem(composed, { line: p.line, column: p.column, message: p.message });
    expect(placed).not.toHaveProperty("field");
    expect(placed).toMatchObject({ line: 1, column: 1 });
    expect(placed.message).not.toContain("`");
    expect(placed.message).toMatch(/^The chart has no bars yet/);
  });

  it("quotes chart text in quotation marks, never backticks, also for a server's answer", () => {
    const composed = composeText({ ...emptyValues(), title: "Tidewater Clock", sourceText: "A:\n| Cmaj7 | Hx7 |\n" });
    const p = problemOf(composed.text);
    const placed = placeProblem(composed, { line: p.line, column: p.column, message: p.message });
    expect(placed.message).not.toContain("`");
    const server = fromServerFields([{ field: "composer", message: "Use `plain` words" }], composed);
    expect(server.errors.composer).toBe("Use “plain” words");
  });

  it("gives a sign-up refusal without field names in front, each message under its own field", () => {
    const e = signUpFailure({ name: " ", email: "not-an-address", password: "short" });
    expect(e.status).toBe(422);
    expect(e.message).not.toMatch(FIELD_PREFIX);
    const fields = e.details?.fields ?? [];
    expect(Object.fromEntries(fields.map((f) => [f.field, f.message]))).toEqual({
      name: "Tell us your name",
      email: "Enter an e-mail address like name@example.com",
      password: "Use at least 8 characters for the password",
    });
    for (const f of fields) expect(f.message).not.toMatch(FIELD_PREFIX);
  });

  it("names the chart form's own field for a bad tempo, with words fit for a musician", () => {
    const r = toInput({ ...emptyValues(), title: "Tidewater Clock", tempo: "fast", sourceText: "A:\n| C |\n" });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(Object.keys(r.errors)).toEqual(["tempo"]);
      expect(r.errors.tempo).not.toMatch(FIELD_PREFIX);
      expect(r.errors.tempo).not.toContain("`");
    }
  });
});
