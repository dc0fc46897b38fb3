// Piano voicings, each rule checked against where it comes from.
import { describe, expect, it } from "vitest";
import { Chord, Note } from "tonal";
import { chordPitchClasses } from "@/lib/music";
import { motion, voiceChord, VOICING_HIGH, VOICING_LOW, type Voicing } from "@/lib/accompaniment";

const chromas = (v: Voicing) => v.notes.map((n) => n % 12);
const pcs = (symbol: string) => Chord.get(symbol).notes.map((n) => Note.chroma(n));

function voiceAll(symbols: string[]): Voicing[] {
  const out: Voicing[] = [];
  let prev: number[] | null = null;
  for (const s of symbols) {
    const v: Voicing = voiceChord(s, prev)!;
    out.push(v);
    prev = v.notes;
  }
  return out;
}

describe("rootless voicings (Mark Levine, The Jazz Piano Book, 1989, rootless-voicing chapter — from memory)", () => {
  it("voices a minor 7th in A position as 3–5–7–9: Dm7 → F A C E", () => {
    // Levine's A position: 3rd at the bottom, 9th on top. Dm7 from D: F (b3), A (5), C (b7), E (9).
    const a = voiceChord("Dm7", [53, 57, 60, 64])!;
    expect(a.position).toBe("A");
    expect(a.notes.map((n) => Note.pitchClass(Note.fromMidi(n)))).toEqual(["F", "A", "C", "E"]);
  });

  it("puts the 13th in place of the 5th on a dominant: G7 in B position is F A B E (7–9–3–13)", () => {
    const b = voiceChord("G7", [53, 57, 60, 64])!;
    expect(b.position).toBe("B");
    expect(b.notes.map((n) => Note.pitchClass(Note.fromMidi(n)))).toEqual(["F", "A", "B", "E"]);
  });

  for (const key of ["C", "F", "Bb", "Eb", "Ab", "D", "G", "E"]) {
    it(`alternates positions through ii–V–I in ${key}, each voice moving by a step or staying`, () => {
      // Levine: through ii–V–I the positions alternate (A–B–A or B–A–B) so each voice moves by step or holds.
      const two = Note.transpose(key, "2M");
      const five = Note.transpose(key, "5P");
      const v = voiceAll([`${Note.simplify(two)}m7`, `${Note.simplify(five)}7`, `${key}maj7`]);
      const positions = v.map((x) => x.position).join("");
      expect(["ABA", "BAB"]).toContain(positions);
      for (let i = 1; i < v.length; i++) {
        v[i]!.notes.forEach((n, k) => expect(Math.abs(n - v[i - 1]!.notes[k]!)).toBeLessThanOrEqual(2));
      }
    });
  }

  it("keeps every voicing inside the comping range D3–G5 (Levine, from memory: the left-hand range)", () => {
    const cycle = ["Dm7", "G7", "Cmaj7", "Fmaj7", "Bm7b5", "E7(b9)", "Am7", "D7", "Gm7", "C7", "Fmaj7", "Bbmaj7", "Ebmaj7", "Abmaj7", "Dbmaj7", "Gb7"];
    for (const v of voiceAll([...cycle, ...cycle, ...cycle])) {
      expect(Math.min(...v.notes)).toBeGreaterThanOrEqual(VOICING_LOW);
      expect(Math.max(...v.notes)).toBeLessThanOrEqual(VOICING_HIGH);
    }
    expect(VOICING_LOW).toBe(Note.midi("D3"));
    expect(VOICING_HIGH).toBe(Note.midi("G5"));
  });

  it("never moves more than the nearest alternative would", () => {
    const from = voiceChord("Dm7", null)!;
    const to = voiceChord("G7", from.notes)!;
    const other = voiceChord("G7", null)!; // a voicing chosen without regard for the last chord
    expect(motion(from.notes, to.notes)).toBeLessThanOrEqual(motion(from.notes, other.notes));
  });
});

describe("chord tones of every voicing come from the chord (tonal and the music core)", () => {
  // Each symbol with the extended chord its voicing may draw on: the tensions Levine's voicings add
  // (9th on minor and major 7ths, 9th and 13th on dominants; from memory), spelled for tonal.
  const table: [symbol: string, allowed: string][] = [
    ["Cm7", "Cm9"], ["Cmaj7", "Cmaj9"], ["C7", "C13"], ["C9", "C13"], ["C13", "C13"], ["C6", "C69"], ["Cm6", "Cm69"],
    ["C7(b9)", "C13b9"], ["C7(#11)", "C9#11"], ["C7(b13)", "C9b13"], ["Cm(maj7)", "CmMaj9"], ["Cmaj7(#11)", "Cmaj9#11"],
  ];
  for (const [symbol, allowed] of table) {
    it(`${symbol}: every note in ${allowed}, with the 3rd and 7th of ${symbol}`, () => {
      const v = voiceChord(symbol, null)!;
      const ok = new Set([...pcs(allowed), ...chordPitchClasses(symbol).map((n) => Note.chroma(n))]);
      expect(ok.size).toBeGreaterThan(3);
      for (const c of chromas(v)) expect(ok.has(c)).toBe(true);
      const own = chordPitchClasses(symbol).map((n) => Note.chroma(n));
      expect(chromas(v)).toContain(own[1]); // the 3rd (guide tone)
      expect(chromas(v)).toContain(own[3]); // the 7th (or 6th)
      expect(chromas(v)).not.toContain(Note.chroma("C")); // rootless
    });
  }

  it("voices an altered dominant with its own tensions: G7alt is B (3), Eb (b13), F (b7), Bb (#9) in some order", () => {
    // Common practice for 7alt (ours, REFERENCES.md): 3rd, b7 and altered 9ths/13th, no natural 5th or 9th.
    const v = voiceChord("G7alt", null)!;
    expect(new Set(chromas(v))).toEqual(new Set(["B", "Eb", "F", "Bb"].map((n) => Note.chroma(n))));
    for (const c of chromas(v)) expect(chordPitchClasses("G7alt").map((n) => Note.chroma(n))).toContain(c);
  });

  it("voices a suspended dominant with the 4th, not the 3rd: G7sus4 → C, D, F, A (4–5–7–9)", () => {
    const v = voiceChord("G7sus4", null)!;
    expect(new Set(chromas(v))).toEqual(new Set(["C", "D", "F", "A"].map((n) => Note.chroma(n))));
    expect(chromas(v)).not.toContain(Note.chroma("B"));
  });

  it("gives the half-diminished chord its 11th: Bm7b5 → D, F, A, E", () => {
    const v = voiceChord("Bm7b5", null)!;
    expect(new Set(chromas(v))).toEqual(new Set([...pcs("Bm7b5").slice(1), Note.chroma("E")]));
  });

  it("plays root–3–7 shells where a bar is crowded", () => {
    const v = voiceChord("Eb7", null, true)!;
    expect(v.position).toBe("shell");
    expect(chromas(v)).toEqual(["Eb", "G", "Db"].map((n) => Note.chroma(n)));
  });

  it("rests on N.C.", () => {
    expect(voiceChord("N.C.", null)).toBeNull();
  });
});
