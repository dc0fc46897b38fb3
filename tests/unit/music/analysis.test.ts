import { describe, expect, it } from "vitest";
import { Key, Progression } from "tonal";
import {
  dominantOf, harmonicFunction, parseChord, romanNumeral, tritoneSubstitute, turnaround, twoFiveInto,
} from "@/lib/music";

describe("roman numerals", () => {
  it.each([
    ["Abmaj7", "Eb", "IVmaj7"], // issue #3's example
    ["Ebmaj7", "Eb", "Imaj7"],
    ["Fm7", "Eb", "ii7"],
    ["Bb7", "Eb", "V7"],
    ["Cm7", "Eb", "vi7"],
    ["Dm7b5", "Eb", "viiø7"],
    ["Gbmaj7", "Eb", "bIIImaj7"],
    ["Cm7", "Cm", "i7"],
    ["Dm7b5", "Cm", "iiø7"], // minor ii–V–i, Berklee Book of Jazz Harmony ch. 4 (from memory)
    ["G7(b9)", "Cm", "V7(b9)"],
    ["Ebmaj7", "Cm", "bIIImaj7"],
    ["Bdim7", "C", "vii°7"],
    ["Db7", "C", "bII7"], // tritone sub of V (Pease 2003 p.53)
    ["F#m7b5", "C", "#ivø7"],
    ["C/E", "C", "I"],
  ])("%s in %s is %s", (symbol, key, numeral) => {
    expect(romanNumeral(symbol, key)).toBe(numeral);
  });

  it("agrees with tonal's Progression.toRomanNumerals on the degree (tonal writes quality its own way)", () => {
    const chords = ["Ebmaj7", "Fm7", "Gm7", "Abmaj7", "Bb7", "Cm7", "Dm7b5"];
    const tonal = Progression.toRomanNumerals("Eb", chords).map((r) => r.replace(/m7b5|maj7|m7|7/g, "").toUpperCase());
    const ours = chords.map((c) => romanNumeral(c, "Eb").replace(/ø7|maj7|7/g, "").toUpperCase());
    expect(ours).toEqual(tonal);
  });

  it("names the function of a chord in the key (tonal Key.majorKey chordsHarmonicFunction for the diatonic 7ths)", () => {
    const k = Key.majorKey("Eb");
    const expected = k.chordsHarmonicFunction.map((f) => ({ T: "tonic", SD: "subdominant", D: "dominant" })[f]);
    expect(k.chords.map((c) => harmonicFunction(parseChord(c), "Eb"))).toEqual(expected);
    expect(harmonicFunction(parseChord("C7"), "Eb")).toBe("secondary-dominant"); // V7/ii (Pease 2003 p.53)
    expect(harmonicFunction(parseChord("Fb7"), "Eb")).toBe("dominant"); // tritone sub of B♭7
    expect(harmonicFunction(parseChord("F7"), "F")).toBe("tonic"); // a blues tonic (common practice)
  });
});

describe("progressions", () => {
  it("the dominant of E♭ is B♭7 (REFERENCES.md, common practice)", () => {
    expect(dominantOf("Eb")).toBe("Bb7");
  });

  it("the tritone substitute of G7 is D♭7 (Pease, Jazz Composition, 2003, p.53)", () => {
    expect(tritoneSubstitute("G7")).toBe("Db7");
  });

  it.each([
    // Secondary dominants in C and their substitutes (Pease 2003 p.53).
    ["A7", "Eb7"], ["B7", "F7"], ["C7", "Gb7"], ["D7", "Ab7"], ["E7", "Bb7"],
  ])("the tritone substitute of %s is %s (Pease 2003 p.53)", (dom, subst) => {
    expect(tritoneSubstitute(dom)).toBe(subst);
  });

  it("leaves a chord that is not a dominant alone", () => {
    expect(tritoneSubstitute("Cmaj7")).toBe("Cmaj7");
  });

  it("I–vi–ii–V in C is Cmaj7 Am7 Dm7 G7; iii–VI–ii–V is Em7 A7 Dm7 G7 (Berklee Book of Jazz Harmony ch. 2, from memory; Levine 1995)", () => {
    expect(turnaround("C")).toEqual(["Cmaj7", "Am7", "Dm7", "G7"]);
    expect(turnaround("C", "iii-VI-ii-V")).toEqual(["Em7", "A7", "Dm7", "G7"]);
  });

  it("tritone substitution replaces each dominant of a turnaround (Pease 2003 p.53)", () => {
    expect(turnaround("C", "I-vi-ii-V", true)).toEqual(["Cmaj7", "Am7", "Dm7", "Db7"]);
    expect(turnaround("C", "iii-VI-ii-V", true)).toEqual(["Em7", "Eb7", "Dm7", "Db7"]);
  });

  it("a major ii–V into C is Dm7 G7; the minor one is Dm7b5 G7(b9) (Berklee ch. 4, from memory)", () => {
    expect(twoFiveInto("Cmaj7")).toEqual(["Dm7", "G7"]);
    expect(twoFiveInto("Cm7")).toEqual(["Dm7b5", "G7(b9)"]);
    expect(twoFiveInto("Ebmaj7")).toEqual(["Fm7", "Bb7"]);
    expect(twoFiveInto("Cmaj7", true)).toEqual(["Dm7", "Db7"]);
  });

  it("builds minor-key turnarounds on the minor tonic (common practice)", () => {
    expect(turnaround("Cm")).toEqual(["Cm7", "Am7b5", "Dm7b5", "G7(b9)"]);
    expect(turnaround("Cm", "iii-VI-ii-V")).toEqual(["Ebmaj7", "Abmaj7", "Dm7b5", "G7(b9)"]);
  });

  it("builds a blues turnaround on I7 (I7–VI7–ii–V, common practice)", () => {
    expect(turnaround("F", "I-vi-ii-V", false, true)).toEqual(["F7", "D7", "Gm7", "C7"]);
  });
});
