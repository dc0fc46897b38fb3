// Chart text + form fields → one chart model, the same on the server and on the device.
import { describe, expect, it } from "vitest";
import { ChartTextError, joinChartText, missingHeaderLines } from "@/lib/chart";

const FIELDS = { title: "Harbour Lights Out", composer: "R. Okafor", key: "Eb", meter: "3/4", tempo: 140, feel: "waltz" };

describe("joinChartText", () => {
  it("supplies the header lines the text leaves to the fields", () => {
    expect(missingHeaderLines(FIELDS, "| Ebmaj7 | Cm7 |")).toEqual(["title: Harbour Lights Out", "key: Eb", "time: 3/4"]);
    expect(missingHeaderLines(FIELDS, "title: X\nkey: F\ntime: 4/4\n| F |")).toEqual([]);
  });

  it("reads a text with no header at all, the fields giving title, key and meter", () => {
    const chart = joinChartText(FIELDS, "| Ebmaj7 | Cm7 | Fm7 | Bb7 |");
    expect(chart.title).toBe("Harbour Lights Out");
    expect(chart.key).toBe("Eb");
    // 3/4: three quarter-note beats a bar (common practice meter notation).
    expect(chart.meter).toEqual({ beats: 3, unit: 4 });
    expect(chart.tempo).toBe(140);
  });

  it("lets the fields win over the text's own header lines", () => {
    const chart = joinChartText(FIELDS, "title: Old Name\nkey: F\ntime: 4/4\n| F | F |");
    expect(chart.title).toBe("Harbour Lights Out");
    expect(chart.key).toBe("Eb");
    expect(chart.meter).toEqual({ beats: 3, unit: 4 });
  });

  it("counts an error's line in the text as written, not after the supplied header", () => {
    let caught: unknown;
    try {
      joinChartText(FIELDS, "| Ebmaj7 |\n| Q#nonsense |");
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(ChartTextError);
    expect((caught as ChartTextError).line).toBe(2);
  });
});
