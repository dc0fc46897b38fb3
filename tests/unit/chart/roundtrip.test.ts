import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { ChartTextError, parseChartText, serializeChart } from "@/lib/chart";
import { chartArb } from "./arbitrary";

describe("chart text round trip (fast-check)", () => {
  it("parseChartText(serializeChart(chart)) gives back the chart", () => {
    fc.assert(
      fc.property(chartArb, (chart) => {
        const text = serializeChart(chart);
        expect(parseChartText(text)).toEqual(chart);
        expect(serializeChart(parseChartText(text))).toBe(text);
      }),
      { numRuns: 300 },
    );
  });
});

describe("random text (fast-check)", () => {
  const piece = fc.constantFrom(
    "title: T", "key: Eb", "key: Q", "time: 3/4", "time: 6/8", "tempo: 99", "A:", "B:", "Intro:", "melody:", "|", "|:", ":|", ":|x3", "[1", "[2", "]",
    "%", "/", "N.C.", "Cm7", "F7(b9)", "Bbmaj7", "G#", "x", "#", "C4:q", "r:h", "Eb5:w~", "(", ")", ",", ":", "\n", "\n", " ",
  );
  const textArb = fc.oneof(
    fc.array(piece, { maxLength: 40 }).map((p) => p.join(" ")),
    fc.array(fc.oneof(piece, fc.string({ maxLength: 6 })), { maxLength: 30 }).map((p) => `title: T\nkey: C\n${p.join(" ")}`),
    fc.string({ maxLength: 200 }),
  );

  it("gives a chart or a ChartTextError with a place inside the text, nothing else", () => {
    fc.assert(
      fc.property(textArb, (text) => {
        try {
          parseChartText(text);
        } catch (e) {
          expect(e).toBeInstanceOf(ChartTextError);
          const err = e as ChartTextError;
          const lines = text.replace(/\r\n?/g, "\n").split("\n");
          expect(err.line).toBeGreaterThanOrEqual(1);
          expect(err.line).toBeLessThanOrEqual(lines.length);
          expect(err.column).toBeGreaterThanOrEqual(1);
          expect(err.message.length).toBeGreaterThan(10);
        }
      }),
      { numRuns: 2000 },
    );
  });
});
