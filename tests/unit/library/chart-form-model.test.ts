import { describe, expect, it } from "vitest";
import { bodyOf, composeText, emptyValues, fromServerFields, placeProblem, toInput } from "@/components/library/chart-form-model";

const values = { ...emptyValues(), title: "Quay Lights", key: "Eb", tempo: "132", feel: "medium swing", sourceText: "A:\n| Ebmaj7 | Cm7 |\n| Fm7 | Bb7 |\n" };

describe("chart form", () => {
  it("joins the fields as header lines above the text box", () => {
    const c = composeText(values);
    expect(c.text.split("\n").slice(0, 6)).toEqual(["title: Quay Lights", "key: Eb", "time: 4/4", "tempo: 132", "feel: medium swing", ""]);
    expect(c.header).toEqual(["title", "key", "meter", "tempo", "feel"]);
  });

  it("splits a stored text back into the text box's part", () => {
    expect(bodyOf(composeText(values).text)).toBe(values.sourceText);
  });

  it("places a problem in the text box at its own line, or on the field it came from", () => {
    const c = composeText(values);
    // header (5 lines) + blank line: line 8 of the joined text is line 2 of the box
    expect(placeProblem(c, { line: 8, column: 4, message: "x" })).toEqual({ line: 2, column: 4, message: "x" });
    expect(placeProblem(c, { line: 4, column: 1, message: "bad tempo" })).toEqual({ field: "tempo", message: "bad tempo" });
  });

  it("maps a server 422 on the chart text to the text box's line", () => {
    const r = fromServerFields([{ field: "sourceText", message: "no chord", line: 9, column: 3 }], composeText(values));
    expect(r.text).toEqual({ line: 3, column: 3, message: "no chord" });
  });

  it("rejects a tempo that is not a number, naming the field", () => {
    const r = toInput({ ...values, tempo: "fast" });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.errors)).toEqual(["tempo"]);
  });

  it("accepts an empty tempo as none", () => {
    const r = toInput({ ...values, tempo: "" });
    expect(r.ok && r.input.tempo).toBe(null);
  });
});
