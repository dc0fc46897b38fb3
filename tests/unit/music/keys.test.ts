import { describe, expect, it } from "vitest";
import { Key } from "tonal";
import { KeyError, keySignature, parseKey, readKey } from "@/lib/music";
import { keySignatures } from "./xml";

// Carl E. Gardner, Essentials of Music Theory: Elementary (1912): accidentals of the 15 major keys;
// relative minors share the signature. Sign as MusicXML <fifths>: negative for flats.
const MAJOR: Record<string, number> = {
  C: 0, G: 1, D: 2, A: 3, E: 4, B: 5, "F#": 6, "C#": 7, F: -1, Bb: -2, Eb: -3, Ab: -4, Db: -5, Gb: -6, Cb: -7,
};
// The relative minor of each (a minor third below the major tonic), same signature (Gardner 1912).
const MINOR: Record<string, number> = {
  Am: 0, Em: 1, Bm: 2, "F#m": 3, "C#m": 4, "G#m": 5, "D#m": 6, "A#m": 7, Dm: -1, Gm: -2, Cm: -3, Fm: -4, Bbm: -5, Ebm: -6, Abm: -7,
};

describe("key signatures", () => {
  it.each(Object.entries(MAJOR))("%s major has %i fifths (Gardner 1912)", (key, fifths) => {
    const sig = keySignature(key);
    expect(sig.fifths).toBe(fifths);
    expect(sig.accidentals).toBe(Math.abs(fifths));
    expect(sig.notes).toHaveLength(Math.abs(fifths));
    // tonal Key.majorKey(k).alteration agrees (REFERENCES.md).
    expect(sig.fifths).toBe(Key.majorKey(key).alteration);
  });

  it.each(Object.entries(MINOR))("%s has %i fifths (Gardner 1912, relative minor)", (key, fifths) => {
    expect(keySignature(key).fifths).toBe(fifths);
    expect(keySignature(key).fifths).toBe(Key.minorKey(key.slice(0, -1)).alteration);
  });

  it("covers every <fifths>/<mode> pair of 13a-KeySignatures.xml (cuthbertLab/musicxmlTestSuite, MIT)", () => {
    const pairs = keySignatures("13a-KeySignatures.xml");
    expect(pairs).toHaveLength(30);
    for (const { fifths, mode } of pairs) {
      const table = mode === "minor" ? MINOR : MAJOR;
      const names = Object.entries(table).filter(([, f]) => f === fifths).map(([k]) => k);
      expect(names).toHaveLength(1);
      expect(keySignature(names[0]!).fifths).toBe(fifths);
    }
  });

  it("lists the accidentals in signature order (common practice: sharps F C G D A E B, flats the reverse)", () => {
    expect(keySignature("A").notes).toEqual(["F#", "C#", "G#"]);
    expect(keySignature("Db").notes).toEqual(["Bb", "Eb", "Ab", "Db", "Gb"]);
  });
});

describe("reading key names", () => {
  it("reads the spellings a chart may use", () => {
    expect(readKey("Eb")?.name).toBe("Eb");
    expect(readKey("C minor")?.name).toBe("Cm");
    expect(readKey("F# major")?.name).toBe("F#");
    expect(readKey("B♭m")?.name).toBe("Bbm");
    expect(readKey("H")).toBeNull();
    expect(() => parseKey("Q")).toThrow(KeyError);
  });
});
