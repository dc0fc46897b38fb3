import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Chart } from "@/lib/chart/model";
import { normaliseChord, QUALITIES } from "@/lib/music";
import { exportMusicXml, importScoreFile } from "@/lib/musicxml";
import { child, children, numberOf, parseXml, textOf } from "@/lib/musicxml/xml";

// Invented demo tune for the tests: "Copper Lantern", our own changes.
const chart: Chart = {
  title: "Copper Lantern & Friends",
  composer: "R. Okonkwo-Lind",
  key: "B",
  meter: { beats: 4, unit: 4 },
  tempo: 132,
  feel: "medium swing",
  intro: {
    label: "Intro",
    bars: [{ chords: [{ symbol: "C#m7", beat: 0, beats: 2 }, { symbol: "F#7", beat: 2, beats: 2 }], simile: false, repeatStart: false, repeatEnd: false, ending: null }],
  },
  sections: [
    {
      label: "A",
      bars: [
        { chords: [{ symbol: "Bmaj7", beat: 0, beats: 4 }], simile: false, repeatStart: true, repeatEnd: false, ending: null, melody: [{ pitch: "D#5", duration: "h", dots: 1, tie: false }, { pitch: "C#5", duration: "q", dots: 0, tie: true }] },
        { chords: [{ symbol: "G#m7", beat: 0, beats: 4 / 3 }, { symbol: "C#7(b9,#11)", beat: 4 / 3, beats: 4 / 3 }, { symbol: "F#7alt", beat: 8 / 3, beats: 4 / 3 }], simile: false, repeatStart: false, repeatEnd: false, ending: 1, melody: [{ pitch: "C#5", duration: "w", dots: 0, tie: false }] },
        { chords: [{ symbol: "D#m7b5/A", beat: 0, beats: 3 }, { symbol: "N.C.", beat: 3, beats: 1 }], simile: false, repeatStart: false, repeatEnd: true, repeatTimes: 3, ending: 1, melody: [{ pitch: null, duration: "h", dots: 0, tie: false }, { pitch: "A#4", duration: "q", dots: 0, tie: false }, { pitch: "E4", duration: "8", dots: 0, tie: false }, { pitch: "F#4", duration: "8", dots: 0, tie: false }] },
        { chords: [{ symbol: "Bmaj7", beat: 0, beats: 4 }], simile: false, repeatStart: false, repeatEnd: false, ending: 2, melody: [{ pitch: "B4", duration: "w", dots: 0, tie: false }] },
      ],
    },
    {
      label: "Bridge",
      bars: [
        { chords: [{ symbol: "E6/9", beat: 0, beats: 2 }, { symbol: "A9sus4", beat: 2, beats: 2 }], simile: false, repeatStart: false, repeatEnd: false, ending: null, melody: [{ pitch: "G#4", duration: "w", dots: 0, tie: false }] },
        { chords: [], simile: true, repeatStart: false, repeatEnd: false, ending: null },
      ],
    },
  ],
};

const encode = (s: string) => new TextEncoder().encode(s);
const roundTrip = (c: Chart, transpose?: { diatonic: number; chromatic: number; octaveChange?: number }) =>
  importScoreFile(encode(exportMusicXml(c, { transpose }))).chart;

// MusicXML 4.0 <transpose> values for the band's instruments (REFERENCES.md table)
const BB = { diatonic: -1, chromatic: -2 };
const EB = { diatonic: -5, chromatic: -9 };
const F = { diatonic: -4, chromatic: -7 };
const TENOR = { diatonic: -1, chromatic: -2, octaveChange: -1 };

describe("export → import gives the same chart", () => {
  it("in concert pitch", () => {
    expect(roundTrip(chart)).toEqual(chart);
  });
  it.each([["B-flat", BB], ["E-flat", EB], ["F", F], ["B-flat tenor", TENOR]])("through a %s part with <transpose>", (_name, t) => {
    expect(roundTrip(chart, t)).toEqual(chart);
  });

  it("for generated chord-only charts in every key, concert and B-flat", () => {
    const keys = ["C", "G", "D", "A", "E", "B", "F#", "F", "Bb", "Eb", "Ab", "Db", "Gb", "Am", "Em", "Dm", "Gm", "Cm", "Fm", "Bbm", "C#m", "F#m"];
    const roots = ["C", "D", "Eb", "E", "F", "G", "Ab", "A", "Bb", "B"];
    const suffixes = ["", "m", "7", "maj7", "m7", "m7b5", "dim7", "7(b9)", "7sus4", "6", "m6", "9", "13", "7alt", "sus2"];
    const sym = fc.tuple(fc.constantFrom(...roots), fc.constantFrom(...suffixes)).map(([r, s]) => r + s);
    const bar = fc.array(sym, { minLength: 1, maxLength: 4 }).map((syms) => ({
      chords: syms.map((symbol, i) => ({ symbol, beat: (4 / syms.length) * i, beats: 4 / syms.length })),
      simile: false, repeatStart: false, repeatEnd: false, ending: null,
    }));
    fc.assert(
      fc.property(fc.constantFrom(...keys), fc.array(bar, { minLength: 1, maxLength: 8 }), (key, bars) => {
        const c: Chart = { ...chart, key, intro: null, sections: [{ label: "A", bars }] };
        expect(roundTrip(c).sections[0]!.bars.length).toBe(bars.length);
        // concert round trip is exact
        expect(roundTrip(c)).toEqual(c);
        // through a transposing part the pitch classes come back (spelling may follow the written key)
        const back = roundTrip(c, BB);
        expect(back.key.endsWith("m")).toBe(key.endsWith("m"));
        expect(back.sections[0]!.bars.map((b) => b.chords.length)).toEqual(bars.map((b) => b.chords.length));
      }),
      { numRuns: 60 },
    );
  });
});

describe("what the exported file says", () => {
  const xml = exportMusicXml(chart, { transpose: BB, partName: "Trumpet in Bb" });
  const root = parseXml(xml);

  it("is MusicXML 4.0 partwise", () => {
    expect(root.name).toBe("score-partwise");
    expect(root.attrs.version).toBe("4.0");
    expect(textOf(child(root, "work"), "work-title")).toBe("Copper Lantern & Friends");
  });

  it("carries <transpose> and the written key with fewer accidentals", () => {
    const attrs = child(child(child(root, "part"), "measure"), "attributes");
    const tr = child(attrs, "transpose");
    // MusicXML 4.0 / REFERENCES.md: B-flat instruments -1 diatonic, -2 chromatic
    expect([numberOf(tr, "diatonic"), numberOf(tr, "chromatic")]).toEqual([-1, -2]);
    // concert B on a B-flat part is D-flat major, 5 flats, not C-sharp (w3c/musicxml issues #54, #333)
    expect(numberOf(child(attrs, "key"), "fifths")).toBe(-5);
  });

  it("writes chord roots and melody in the written key", () => {
    const m2 = children(child(root, "part"), "measure")[1]!;
    // concert Bmaj7 → written Dbmaj7; concert D#5 → written F5 (a major 2nd higher)
    expect(textOf(child(child(m2, "harmony"), "root"), "root-step")).toBe("D");
    expect(numberOf(child(child(m2, "harmony"), "root"), "root-alter")).toBe(-1);
    const pitch = child(child(m2, "note"), "pitch");
    expect([textOf(pitch, "step"), numberOf(pitch, "octave")]).toEqual(["F", 5]);
  });

  it("writes a tenor part an octave lower in <transpose> and a 9th higher on the page", () => {
    // tenor sax: written a major 9th above concert (REFERENCES.md), <octave-change>-1
    const t = parseXml(exportMusicXml({ ...chart, key: "C", intro: null, sections: [{ label: "A", bars: [{ chords: [{ symbol: "C", beat: 0, beats: 4 }], simile: false, repeatStart: false, repeatEnd: false, ending: null, melody: [{ pitch: "C4", duration: "w", dots: 0, tie: false }] }] }] }, { transpose: TENOR }));
    const m1 = child(child(t, "part"), "measure");
    expect(numberOf(child(child(m1, "attributes"), "transpose"), "octave-change")).toBe(-1);
    const p = child(child(m1, "note"), "pitch");
    expect([textOf(p, "step"), numberOf(p, "octave")]).toEqual(["D", 5]);
  });

  it("escapes text and marks rehearsal letters, repeats and endings", () => {
    expect(xml).toContain("Copper Lantern &amp; Friends");
    expect(xml).toContain("<rehearsal>Bridge</rehearsal>");
    expect(xml).toContain('<repeat direction="backward" times="3"/>');
    expect(xml).toContain('<ending number="1" type="start"/>');
    expect(xml).toContain('<ending number="2" type="discontinue"/>');
  });
});

describe("every house-style chord quality survives MusicXML", () => {
  it.each(QUALITIES.map((q) => q.id))("Eb%s, concert and B-flat", (id) => {
    const symbols = [`Eb${id}`, `A${id}/C#`, `Gb${id}(b5)`].filter((s) => {
      try {
        return normaliseChord(s) === s;
      } catch {
        return false;
      }
    });
    const c: Chart = { ...chart, key: "Eb", intro: null, sections: [{ label: "A", bars: symbols.map((symbol) => ({ chords: [{ symbol, beat: 0, beats: 4 }], simile: false, repeatStart: false, repeatEnd: false, ending: null })) }] };
    expect(symbols.length).toBeGreaterThan(0);
    expect(roundTrip(c)).toEqual(c);
    expect(roundTrip(c, BB)).toEqual(c);
  });

  it("a symbol that is not a known chord still travels, as kind other with its text", () => {
    const xml = exportMusicXml({ ...chart, intro: null, sections: [{ label: "A", bars: [{ chords: [{ symbol: "Cxyz", beat: 0, beats: 4 }], simile: false, repeatStart: false, repeatEnd: false, ending: null }] }] });
    expect(xml).toContain('<kind text="xyz">other</kind>');
  });
});
