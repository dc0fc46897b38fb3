import { describe, expect, it } from "vitest";
import { DEMO_CHARTS } from "@/db/demo-charts";
import { arrange, parseChartText, serializeChart, suggestIntros } from "@/lib/chart";
import { INSTRUMENT_IDS } from "@/lib/music";

// A smoke check that the music core reads the demo book: no music facts are checked against it.
describe("the demo book", () => {
  for (const demo of DEMO_CHARTS) {
    it(`${demo.slug} parses, round-trips, and arranges for every part with every intro`, () => {
      const chart = parseChartText(demo.text);
      expect(parseChartText(serializeChart(chart))).toEqual(chart);
      const intros = suggestIntros(chart);
      expect(intros).toHaveLength(7);
      for (const instrument of INSTRUMENT_IDS) {
        for (const intro of intros) {
          const a = arrange(chart, { instrument, intro: intro.choice ?? { kind: intro.kind } });
          expect(a.bars.length).toBeGreaterThanOrEqual(chart.sections.reduce((n, s) => n + s.bars.length, 0));
        }
      }
    });
  }
});
