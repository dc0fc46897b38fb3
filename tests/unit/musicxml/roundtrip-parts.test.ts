// chart → export → schema-valid → import → the same chart, for every part the app draws.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEMO_CHARTS } from "@/db/demo-charts";
import { parseChartText, serializeChart, type Chart } from "@/lib/chart";
import { INSTRUMENT_IDS } from "@/lib/music";
import { exportMusicXml, importScoreFile, partExportOptions } from "@/lib/musicxml";
import { chartArb } from "../chart/arbitrary";
import { invalid, validateAll } from "./xmllint";

const encode = (s: string) => new TextEncoder().encode(s);
const PC: Record<string, number> = { C: 0, D: 2, E: 4, F: 5, G: 7, A: 9, B: 11 };

/** Every note name as its pitch class: "Bb7/D" → "10·7/2·". */
function enharmonic(chart: Chart): unknown {
  const acc = (a = "") => (a.startsWith("#") ? a.length : -a.length);
  const text = JSON.stringify(chart).replace(/"pitch":"([A-G])(#{1,2}|b{1,2})?(\d)"/g, (_m, l: string, a: string | undefined, o: string) => `"pitch":${Number(o) * 12 + PC[l]! + acc(a)}`);
  return JSON.parse(text.replace(/([A-G])(#{1,2}|b{1,2})?(?=[\d"m7(/+#b69adsu]|maj|dim|")/g, (_m, l: string, acc = "") => {
    const alter = acc.startsWith("#") ? acc.length : -acc.length;
    return `${(PC[l]! + alter + 12) % 12}·`;
  }));
}

/**
 * A transposing part whose written key is respelled to fewer accidentals (concert F# on a B♭ part is
 * written in A♭, not G#: w3c/musicxml #54, #333) cannot say which spelling a note outside the key had;
 * those come back as the same pitches, spelled the concert key's way.
 */
const RESPELLED = new Set(["F#", "Gb", "C#", "Cb"]);

function throughEveryPart(charts: Chart[], tag: string): void {
  const docs: Record<string, string> = {};
  charts.forEach((chart, i) => {
    for (const id of INSTRUMENT_IDS) docs[`${tag}-${i}-${id}.musicxml`] = exportMusicXml(chart, partExportOptions(id));
  });
  expect(invalid(validateAll(docs))).toEqual({});
  charts.forEach((chart, i) => {
    for (const id of INSTRUMENT_IDS) {
      const back = importScoreFile(encode(docs[`${tag}-${i}-${id}.musicxml`]!)).chart;
      // the title and the part name travel; everything musical must come back as it left
      if (RESPELLED.has(chart.key) && !id.startsWith("concert")) expect({ part: id, chart: enharmonic(back) }).toEqual({ part: id, chart: enharmonic(chart) });
      else expect({ part: id, chart: back }).toEqual({ part: id, chart });
      // and the chart text the import would save reads back the same
      expect(parseChartText(serializeChart(back))).toEqual(back);
    }
  });
}

describe("round trip through every part (concert, bass clef, B♭, E♭, F)", () => {
  it("every demo chart", () => {
    throughEveryPart(DEMO_CHARTS.map((d) => parseChartText(d.text)), "demo");
  });

  it("generated charts: meters, keys, repeats, endings, % bars, N.C., melody with ties", () => {
    throughEveryPart(fc.sample(chartArb, { numRuns: 30, seed: 7 }), "gen");
  }, 60_000);
});
