// Pickup bars in chart text: `pickup: N beats` makes the first bar played a short bar.
import { describe, expect, it } from "vitest";
import { ChartTextError, parseChartText, serializeChart } from "@/lib/chart";

const head = "title: Test pickup\nkey: F\n";

describe("pickup: a short first bar", () => {
  it("the first bar of the form lasts the pickup's beats, its chords share them, its melody fills them", () => {
    const chart = parseChartText(`${head}pickup: 2 beats\nA:\n| C7 / | Fmaj7 |\nmelody: | G4:q A4:q | F4:w |\n`);
    const [first, second] = chart.sections[0]!.bars;
    expect(first).toMatchObject({ pickup: 2, chords: [{ symbol: "C7", beat: 0, beats: 2 }] });
    expect(second!.pickup).toBeUndefined();
    expect(second!.chords).toEqual([{ symbol: "Fmaj7", beat: 0, beats: 4 }]);
  });

  it("with a composed intro, the pickup leads into the intro (the first bar played)", () => {
    const chart = parseChartText(`${head}pickup: 1 beat\nA:\n| Fmaj7 |\nIntro:\n| C7 | C7 |\n`);
    expect(chart.intro!.bars[0]!.pickup).toBe(1);
    expect(chart.sections[0]!.bars[0]!.pickup).toBeUndefined();
  });

  it("round-trips through serializeChart", () => {
    const chart = parseChartText(`${head}time: 3/4\npickup: 1 beat\nA:\n|: C7 | F | Bb C7 :|\nmelody: | C5:q | A4:h. | |\n`);
    const text = serializeChart(chart);
    expect(text).toMatch(/^pickup: 1 beat$/m);
    expect(parseChartText(text)).toEqual(chart);
  });

  it("a melody that does not fill the pickup is an error naming the pickup's length", () => {
    expect(() => parseChartText(`${head}pickup: 1 beat\nA:\n| C7 | F |\nmelody: | C5:h | F4:w |\n`)).toThrow(/lasts 2 beats .* holds 1 beat/);
  });

  it("a pickup as long as a bar is refused at its line", () => {
    try {
      parseChartText(`${head}time: 3/4\npickup: 3 beats\nA:\n| C | F |\n`);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ChartTextError);
      expect((e as ChartTextError).line).toBe(4);
      expect((e as ChartTextError).message).toMatch(/A pickup is shorter than a bar/);
    }
  });

  it("`Pickup:` alone still starts a section of that name, as it always did", () => {
    const chart = parseChartText(`${head}Pickup:\n| C7 |\nA:\n| F |\n`);
    expect(chart.sections.map((s) => s.label)).toEqual(["Pickup", "A"]);
    expect(chart.sections[0]!.bars[0]!.pickup).toBeUndefined();
  });

  it("a pickup that is not a number of beats is an error", () => {
    expect(() => parseChartText(`${head}pickup: soon\nA:\n| F |\n`)).toThrow(/is not a pickup/);
  });
});
