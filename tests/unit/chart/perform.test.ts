import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { Note } from "tonal";
import { INTRO_KINDS, arrange, parseChartText, performanceBars, transposeChart, type PerformanceBar } from "@/lib/chart";
import { chordPitchClasses, parseChord } from "@/lib/music";
import { chartArb } from "./arbitrary";
import { MINOR, ON_TONIC, SHORT, WITH_INTRO } from "./charts";

const symbols = (bars: PerformanceBar[]) => bars.map((b) => b.chords.map((c) => c.symbol).join(" "));

describe("the bars a player reads", () => {
  it("prepends the chosen intro under an Intro label, then the form with its section labels", () => {
    const bars = performanceBars(ON_TONIC, { intro: { kind: "two-five" } });
    expect(bars.map((b) => b.part)).toEqual([...Array(2).fill("intro"), ...Array(16).fill("form")]);
    expect(bars.map((b) => b.section).filter((s) => s !== null)).toEqual(["Intro", "A", "B"]);
    expect(bars[1]!.barline).toBe("double");
    expect(bars[9]!.barline).toBe("double"); // end of A
    expect(bars.at(-1)!.barline).toBe("final");
    expect(bars.map((b) => b.index)).toEqual(bars.map((_, i) => i));
    expect(bars[0]!.source).toBeNull();
    expect(bars[2]!.source).toEqual({ section: 0, bar: 0 });
  });

  it("keeps repeats and endings of the form", () => {
    const bars = performanceBars(MINOR, { intro: null });
    expect(bars[0]!.repeatStart).toBe(true);
    expect(bars.map((b) => b.ending)).toEqual([null, null, null, null, 1, 1, 2, 2]);
    expect(bars[5]!.repeatEnd).toBe(true);
  });

  it("plays the chart's composed intro unless told otherwise, and none with intro: null", () => {
    expect(performanceBars(WITH_INTRO)[0]!.section).toBe("Intro");
    expect(performanceBars(WITH_INTRO)).toHaveLength(8);
    expect(performanceBars(WITH_INTRO, { intro: null })).toHaveLength(4);
    expect(performanceBars(ON_TONIC)).toHaveLength(16);
  });

  it("labels the sections inside a solo-chorus intro", () => {
    const bars = performanceBars(ON_TONIC, { intro: { kind: "solo-chorus" } });
    expect(bars[0]!.section).toBe("Intro");
    expect(bars[8]!.section).toBe("Intro · B");
    expect(bars[16]!.section).toBe("A");
  });

  it("transposes everything for a B♭ part, a major 2nd up (MusicXML <transpose> -1/-2)", () => {
    const a = arrange(ON_TONIC, { instrument: "bb", intro: { kind: "two-five" } });
    expect([a.concertKey, a.writtenKey, a.instrument]).toEqual(["F", "G", "bb"]);
    expect(symbols(a.bars).slice(0, 4)).toEqual(["Am7", "D7", "Gmaj7", "Em7"]);
    expect(a.intro?.kind).toBe("two-five");
    expect(a.meter).toEqual({ beats: 4, unit: 4 });
  });

  it("plays in a singer's key and then transposes for the part (E♭ part a major 6th up: 72a horn in E♭)", () => {
    const a = arrange(ON_TONIC, { instrument: "eb", key: "Ab", intro: null });
    expect([a.concertKey, a.writtenKey]).toEqual(["Ab", "F"]);
    expect(symbols(a.bars).slice(0, 4)).toEqual(["Fmaj7", "Dm7", "Gm7", "C7"]);
  });

  it("moves the melody into the part's key and octave", () => {
    const bass = performanceBars(SHORT, { instrument: "concert-bass" });
    expect(bass[0]!.melody?.[0]?.pitch).toBe("G3");
    const bb = performanceBars(SHORT, { instrument: "bb" });
    expect(bb[1]!.melody?.map((n) => n.pitch)).toEqual(["Bb4", "D5"]);
    expect(bb[1]!.chords[0]!.symbol).toBe("Bb7");
  });

  it("refuses an instrument it does not know", () => {
    expect(() => arrange(ON_TONIC, { instrument: "kazoo" })).toThrow(/Unknown instrument/);
  });
});

describe("a singer's key", () => {
  it("moves every chord keeping its function", () => {
    const c = transposeChart(ON_TONIC, "G");
    expect(c.key).toBe("G");
    expect(c.sections[0]!.bars.slice(0, 4).map((b) => b.chords[0]!.symbol)).toEqual(["Gmaj7", "Em7", "Am7", "D7"]);
  });

  it("keeps the chart's mode and takes the spelling with fewer accidentals (C# major → Db)", () => {
    expect(transposeChart(MINOR, "E").key).toBe("Em");
    expect(transposeChart(ON_TONIC, "C#").key).toBe("Db");
  });

  it("moves the melody the nearer way (Eb → F: up a whole step)", () => {
    expect(transposeChart(SHORT, "F").sections[0]!.bars[0]!.melody?.[0]?.pitch).toBe("A4");
    expect(transposeChart(SHORT, "C").sections[0]!.bars[0]!.melody?.[0]?.pitch).toBe("E4");
  });

  it("is the same chart when the key does not change", () => {
    expect(transposeChart(ON_TONIC, "F")).toBe(ON_TONIC);
  });

  it("transposes a composed intro with the form", () => {
    const c = parseChartText("title: T\nkey: C\nIntro:\n| Dm7 G7 |\nA:\n| C |");
    expect(transposeChart(c, "D").intro?.bars[0]!.chords.map((x) => x.symbol)).toEqual(["Em7", "A7"]);
  });
});

describe("arrangement properties (fast-check)", () => {
  const instruments = ["concert", "concert-bass", "bb", "eb", "f"];
  const keys = ["C", "Db", "D", "Eb", "E", "F", "F#", "G", "Ab", "A", "Bb", "B"];

  it("any chart, part, key and intro gives the intro's bars then every bar of the form, spelled without double accidentals", () => {
    fc.assert(
      fc.property(chartArb, fc.constantFrom(...instruments), fc.option(fc.constantFrom(...keys), { nil: undefined }), fc.constantFrom(...INTRO_KINDS), (chart, instrument, key, kind) => {
        const a = arrange(chart, { instrument, ...(key ? { key } : {}), intro: { kind } });
        const formBars = chart.sections.reduce((n, s) => n + s.bars.length, 0);
        expect(a.bars.filter((b) => b.part === "form")).toHaveLength(formBars);
        expect(a.bars.filter((b) => b.part === "intro")).toHaveLength(a.intro?.bars.length ?? 0);
        expect(a.bars.at(-1)!.barline).toBe("final");
        for (const b of a.bars) {
          for (const c of b.chords) {
            const parsed = parseChord(c.symbol);
            if (parsed.kind === "chord") expect(Math.abs(Note.get(parsed.root).alt)).toBeLessThanOrEqual(1);
          }
        }
      }),
      { numRuns: 150 },
    );
  });

  it("moving a chart to another key and back gives the same chord pitch classes", () => {
    fc.assert(
      fc.property(chartArb, fc.constantFrom(...keys), (chart, key) => {
        const there = transposeChart(chart, key);
        const back = transposeChart(there, chart.key);
        const pcs = (c: typeof chart) => c.sections.flatMap((s) => s.bars.flatMap((b) => b.chords.map((x) => chordPitchClasses(x.symbol).map((p) => Note.chroma(p)))));
        expect(pcs(back)).toEqual(pcs(chart));
      }),
      { numRuns: 150 },
    );
  });
});
