import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { Note } from "tonal";
import { INSTRUMENT_IDS, chordPitchClasses, parseChord, transposeChord, transposeChordToKey, writtenKey } from "@/lib/music";

const chromas = (pcs: string[]) => pcs.map((p) => Note.chroma(p));

describe("transposing chords to a part", () => {
  it.each([
    // Issue #3's example: B♭ part a major 2nd above concert (MusicXML <transpose> -1/-2).
    ["Bb7sus4", "Eb", "bb", "C7sus4"],
    ["Ebmaj7", "Eb", "bb", "Fmaj7"],
    ["Ebmaj7", "Eb", "eb", "Cmaj7"], // E♭ part a major 6th above (-5/-9)
    ["Ebmaj7", "Eb", "f", "Bbmaj7"], // F part a perfect 5th above (-4/-7)
    ["Bb/D", "Eb", "eb", "G/B"],
    ["Cm7b5", "Bb", "concert-bass", "Cm7b5"],
    ["N.C.", "C", "bb", "N.C."],
    ["C7(b9,#11)", "F", "bb", "D7(b9,#11)"],
  ])("%s in concert %s reads on the %s part as %s", (symbol, key, inst, written) => {
    expect(transposeChord(symbol, key, inst)).toBe(written);
  });

  it("spells chord roots in the written key, not by raw arithmetic (REFERENCES.md: concert B on a B♭ part is D♭)", () => {
    // Concert key B: the part reads in D♭, so B's V7 (F#7) is A♭7 there, not G#7.
    expect(transposeChord("F#7", "B", "bb")).toBe("Ab7");
    expect(transposeChord("Bmaj7", "B", "bb")).toBe("Dbmaj7");
    expect(transposeChord("C#m7", "B", "bb")).toBe("Ebm7");
    // Concert B on an E♭ part reads in A♭ (4♭, not G# with 8♯).
    expect(transposeChord("E/G#", "B", "eb")).toBe("Db/F");
  });

  it("keeps a chromatic chord's function in the written key (Pease 2003 p.53: D♭7 is the tritone sub of G7 in C)", () => {
    // On a B♭ part concert C reads as D: the bII7 of D is E♭7.
    expect(transposeChord("Db7", "C", "bb")).toBe("Eb7");
    // bVI7 in C (Ab7) reads as Bb7 in D — a flat even in a sharp key, as players read it (common practice).
    expect(transposeChord("Ab7", "C", "bb")).toBe("Bb7");
  });

  it("moves a chart to a singer's key keeping each chord's function", () => {
    expect(transposeChordToKey("Fm7", "Eb", "F")).toBe("Gm7");
    expect(transposeChordToKey("Bb7(b9)", "Eb", "Db")).toBe("Ab7(b9)");
    expect(transposeChordToKey("Dm7b5", "Cm", "Am")).toBe("Bm7b5");
  });
});

describe("transposition properties (fast-check)", () => {
  const keys = ["C", "G", "D", "A", "E", "B", "F#", "F", "Bb", "Eb", "Ab", "Db", "Gb", "Am", "Cm", "F#m", "Bbm", "C#m", "Ebm"];
  const roots = ["C", "C#", "Db", "D", "D#", "Eb", "E", "F", "F#", "Gb", "G", "G#", "Ab", "A", "A#", "Bb", "B"];
  const qualities = ["", "m7", "7", "maj7", "m7b5", "dim7", "7(b9)", "7alt", "m(maj7)", "13(#11)", "sus4", "6/9"];
  const chord = fc.tuple(fc.constantFrom(...roots), fc.constantFrom(...qualities), fc.option(fc.constantFrom(...roots), { nil: null }))
    .map(([r, q, b]) => `${r}${q}${b && Note.chroma(b) !== Note.chroma(r) ? `/${b}` : ""}`);

  it("transposing to a part and back returns the original pitch classes", () => {
    fc.assert(
      fc.property(chord, fc.constantFrom(...keys), fc.constantFrom(...INSTRUMENT_IDS), (symbol, key, inst) => {
        const written = transposeChord(symbol, key, inst);
        const back = transposeChordToKey(written, writtenKey(key, inst), key);
        expect(chromas(chordPitchClasses(back))).toEqual(chromas(chordPitchClasses(symbol)));
      }),
      { numRuns: 800 },
    );
  });

  it("a written chord sounds the part's interval away: B♭ part 2, E♭ 9, F 7 semitones up (MusicXML <transpose>)", () => {
    const up: Record<string, number> = { concert: 0, "concert-bass": 0, bb: 2, eb: 9, f: 7 };
    fc.assert(
      fc.property(chord, fc.constantFrom(...keys), fc.constantFrom(...INSTRUMENT_IDS), (symbol, key, inst) => {
        const w = parseChord(transposeChord(symbol, key, inst));
        const c = parseChord(symbol);
        if (w.kind !== "chord" || c.kind !== "chord") return;
        expect((Note.chroma(w.root) - Note.chroma(c.root) + 12) % 12).toBe(up[inst]);
        expect(w.quality).toBe(c.quality);
        // Written roots never need a double accidental or an odd E#/B#/Fb spelling outside the key.
        expect(Math.abs(Note.get(w.root).alt)).toBeLessThanOrEqual(1);
      }),
      { numRuns: 800 },
    );
  });
});
