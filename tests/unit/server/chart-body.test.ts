import { describe, expect, it } from "vitest";
import { prepareChart } from "@/lib/server/chart-body";
import { AppError } from "@/lib/server/errors";
import { MAX_CHART_TEXT_CHARS, MAX_CHART_TEXT_LINES } from "@/lib/chart";

const fields = { title: "Test Form", composer: "", key: "F", meter: "3/4", tempo: null, feel: "" };

describe("preparing a chart from the form", () => {
  it("takes title, key and meter from the fields when the text has no header", () => {
    const p = prepareChart({ ...fields, sourceText: "A:\n| F | C7 | F | F |" });
    expect(p.body.title).toBe("Test Form");
    expect(p.body.meter).toEqual({ beats: 3, unit: 4 });
    expect(p.sourceText).toBe("A:\n| F | C7 | F | F |");
  });

  it("counts beats by the form's meter and reports errors at the line of the text as written", () => {
    // Four chords cannot share a 3/4 bar evenly by beat: the parser refuses it.
    try {
      prepareChart({ ...fields, sourceText: "A:\n| F C7 G7 Dm |" });
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(AppError);
      expect((err as AppError).details?.fields?.[0]).toMatchObject({ field: "sourceText", line: 2 });
    }
  });

  it("accepts a text exactly at the size limits although the form's header lines are added in front", () => {
    const lines = ["A:"];
    while (lines.length < MAX_CHART_TEXT_LINES) lines.push(lines.length % 500 === 0 ? `S${lines.length}:` : "| F |");
    const body = lines.join("\n");
    const sourceText = body + " ".repeat(MAX_CHART_TEXT_CHARS - body.length);
    expect(sourceText.length).toBe(MAX_CHART_TEXT_CHARS);
    const p = prepareChart({ ...fields, meter: "4/4", sourceText });
    expect(p.body.sections.length).toBe(10);
    expect(() => prepareChart({ ...fields, meter: "4/4", sourceText: `${sourceText} ` })).toThrow(/too long/);
  });
});
