import { describe, expect, it } from "vitest";
import { Interval, Note } from "tonal";
import { INSTRUMENTS, INSTRUMENT_IDS, concertToWrittenInterval, isInstrumentId, writtenKey, writtenPitch } from "@/lib/music";
import { transposingParts } from "./xml";

describe("instrument transpositions", () => {
  // MusicXML 4.0 <transpose>: what is added to the written pitch to get the sounding pitch.
  // Values read from the MusicXML test suite (cuthbertLab/musicxmlTestSuite, MIT, fixtures/SOURCE.md).
  const a = transposingParts("72a-TransposingInstruments.xml");
  const b = transposingParts("72b-TransposingInstruments-Full.xml");
  const c = transposingParts("72c-TransposingInstruments-Change.xml");
  const first = (parts: typeof a, name: string) => parts.find((p) => p.name === name)!.transposes[0]!;

  it("the B♭ part matches the B♭ trumpet of 72a and 72b and the B♭ clarinet of 72b/72c", () => {
    for (const t of [first(a, "Trumpet in Bb"), first(b, "Trumpet in Bb"), first(b, "Clarinet in Bb"), c[0]!.transposes[1]!]) {
      expect(INSTRUMENTS.bb.transpose.diatonic).toBe(t.diatonic);
      expect(INSTRUMENTS.bb.transpose.chromatic).toBe(t.chromatic);
      expect(INSTRUMENTS.bb.transpose.octaveChange).toBe(t["octave-change"] ?? 0);
    }
  });

  it("the E♭ part matches the horn in E♭ of 72a and 72b (a major 6th, like the alto sax)", () => {
    for (const t of [first(a, "Horn in Eb"), first(b, "Horn in Eb")]) {
      expect([INSTRUMENTS.eb.transpose.diatonic, INSTRUMENTS.eb.transpose.chromatic]).toEqual([t.diatonic, t.chromatic]);
    }
  });

  it("the F part matches the horn in F of 72b", () => {
    const t = first(b, "Horn in F");
    expect([INSTRUMENTS.f.transpose.diatonic, INSTRUMENTS.f.transpose.chromatic]).toEqual([t.diatonic, t.chromatic]);
  });

  it("concert parts carry no transposition, like the piano of 72a and the C trumpet of 72b", () => {
    expect(a.find((p) => p.name === "Piano")!.transposes).toEqual([]);
    expect(b.find((p) => p.name === "Trumpet in C")!.transposes).toEqual([]);
    for (const id of ["concert", "concert-bass"] as const) expect(INSTRUMENTS[id].transpose).toEqual({ diatonic: 0, chromatic: 0, octaveChange: 0 });
  });

  it("writes each part the published interval above concert", () => {
    // REFERENCES.md table (MusicXML tutorial "MIDI-Compatible Part"; music21 instrument.py): B♭ trumpet M2,
    // alto sax M6, horn P5 — written above sounding.
    expect(concertToWrittenInterval(INSTRUMENTS.bb.transpose)).toBe("2M");
    expect(concertToWrittenInterval(INSTRUMENTS.eb.transpose)).toBe("6M");
    expect(concertToWrittenInterval(INSTRUMENTS.f.transpose)).toBe("5P");
    expect(concertToWrittenInterval(INSTRUMENTS.concert.transpose)).toBe("1P");
  });

  it("the <transpose> semitones agree with the interval's size (tonal)", () => {
    for (const id of INSTRUMENT_IDS) {
      const t = INSTRUMENTS[id].transpose;
      expect(Interval.semitones(concertToWrittenInterval(t))).toBe((((-t.chromatic) % 12) + 12) % 12);
    }
  });

  it("has the labels and clefs the parts are known by", () => {
    expect(Object.fromEntries(INSTRUMENT_IDS.map((id) => [id, [INSTRUMENTS[id].label, INSTRUMENTS[id].clef]]))).toEqual({
      concert: ["Concert", "treble"],
      "concert-bass": ["Concert, bass clef", "bass"],
      bb: ["B♭ part", "treble"],
      eb: ["E♭ part", "treble"],
      f: ["F part", "treble"],
    });
    expect(isInstrumentId("eb")).toBe(true);
    expect(isInstrumentId("alto")).toBe(false);
    expect(isInstrumentId(3)).toBe(false);
  });
});

describe("written keys", () => {
  it.each([
    // Issue #3's own example and the interval table of REFERENCES.md (B♭ a major 2nd above).
    ["Eb", "bb", "F"],
    ["C", "bb", "D"],
    ["C", "eb", "A"],
    ["C", "f", "G"],
    ["Eb", "eb", "C"],
    ["Cm", "eb", "Am"],
    ["Cm", "bb", "Dm"],
    ["F", "concert-bass", "F"],
    // Fewer accidentals (MusicXML/MNX community, w3c/musicxml #54 and #333, w3c/mnx #287, via REFERENCES.md):
    ["B", "bb", "Db"], // not C# (7♯)
    ["B", "eb", "Ab"], // not G# (8♯)
    ["F#", "bb", "Ab"], // not G# (8♯)
    ["G#m", "bb", "Bbm"], // not A#m (7♯)
    // Ties keep the concert key's side (common practice): sharp concert keys give sharp parts.
    ["E", "bb", "F#"],
    ["Bb", "f", "F"],
  ])("concert %s on the %s part reads in %s", (concert, inst, written) => {
    expect(writtenKey(concert, inst)).toBe(written);
  });

  it("never writes a part in more than 6 accidentals from a concert key of at most 7 (w3c/mnx #287)", () => {
    const keys = ["C", "G", "D", "A", "E", "B", "F#", "C#", "F", "Bb", "Eb", "Ab", "Db", "Gb", "Cb"];
    for (const k of keys) for (const id of INSTRUMENT_IDS) {
      const w = writtenKey(k, id);
      expect(Math.abs(Note.get(w).alt)).toBeLessThanOrEqual(1);
    }
  });
});

describe("written melody pitch", () => {
  it("moves a concert pitch up the part's interval and into its staff's octave", () => {
    // B♭ part: written a major 2nd above sounding (MusicXML <transpose> -1/-2).
    expect(writtenPitch("Bb4", "Eb", "bb")).toBe("C5");
    // E♭ part: a major 6th above (72a horn in E♭ -5/-9), then an octave down to sit on the treble staff.
    expect(writtenPitch("Eb5", "Eb", "eb")).toBe("C5");
    // F part: a perfect 5th above (72b horn in F -4/-7).
    expect(writtenPitch("C5", "C", "f")).toBe("G5");
    // Bass clef concert part: same letters an octave down (common practice for a lead sheet in bass clef).
    expect(writtenPitch("C5", "C", "concert-bass")).toBe("C4");
    expect(writtenPitch(null, "C", "bb")).toBeNull();
  });

  it("spells written pitches in the written key (concert B major on a B♭ part reads in D♭)", () => {
    // D# (the 3rd of B) becomes F, the 3rd of D♭ — not E#.
    expect(writtenPitch("D#5", "B", "bb")).toBe("F5");
  });
});
