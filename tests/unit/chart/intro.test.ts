import { describe, expect, it } from "vitest";
import { INTRO_KINDS, IntroChoiceSchema, analyseTop, generateIntro, suggestIntros, type Bar } from "@/lib/chart";
import { AWAY, BLUES, MINOR, ON_TONIC, SHORT, WITH_INTRO } from "./charts";

const symbols = (bars: Bar[]) => bars.map((b) => b.chords.map((c) => c.symbol).join(" "));

describe("the top of the form", () => {
  it("finds a tune starting on its tonic", () => {
    const top = analyseTop(ON_TONIC);
    expect([top.symbol, top.numeral, top.function, top.startsOnTonic]).toEqual(["Fmaj7", "Imaj7", "tonic", true]);
  });

  it("finds a tune starting on ii, away from the tonic (ii is a subdominant chord: tonal Key.majorKey functions)", () => {
    const top = analyseTop(AWAY);
    expect([top.numeral, top.function, top.startsOnTonic]).toEqual(["ii7", "subdominant", false]);
    expect(top.description).toMatch(/away from the tonic/);
  });

  it("reads a blues I7 as the tonic (common practice)", () => {
    expect(analyseTop(BLUES).startsOnTonic).toBe(true);
  });

  it("reads a minor tune's i7", () => {
    expect(analyseTop(MINOR).numeral).toBe("i7");
  });
});

describe("dominant pedal", () => {
  it("pedals on V7sus4 of the first chord and opens to V7 (common practice: sus4 on the dominant resolves to the tonic)", () => {
    const r = generateIntro(ON_TONIC, { kind: "dominant-pedal" });
    expect(symbols(r.bars)).toEqual(["C7sus4", "C7sus4", "C7sus4", "C7sus4 C7"]);
    expect(r.fits).toBe(true);
    expect(r.advice).toMatch(/C7sus4/);
  });

  it("takes a length, repeats and a tritone substitute (Pease 2003 p.53: C7's substitute is Gb7)", () => {
    const r = generateIntro(ON_TONIC, { kind: "dominant-pedal", bars: 2, repeats: 3, tritoneSub: true });
    expect(symbols(r.bars)).toEqual(["C7sus4", "C7sus4 Gb7"]);
    expect(r.bars[0]!.repeatStart).toBe(true);
    expect(r.bars[1]!.repeatEnd).toBe(true);
    expect(r.bars[1]!.repeatTimes).toBe(3);
  });

  it("leads to bar 1 even when the tune starts away from the tonic (V of Cm7 is G7)", () => {
    const r = generateIntro(AWAY, { kind: "dominant-pedal", bars: 1 });
    expect(symbols(r.bars)).toEqual(["G7sus4 G7"]);
    expect(r.fits).toBe(true);
  });
});

describe("last bars", () => {
  it("plays the last 8 bars with the last bar turned into a ii–V of bar 1 (common practice)", () => {
    const r = generateIntro(ON_TONIC, { kind: "last-bars" });
    expect(symbols(r.bars)).toEqual(["Cm7", "F7", "Bbmaj7", "Bbmaj7", "Gm7", "C7", "Fmaj7", "Gm7 C7"]);
    expect(r.fits).toBe(true);
    expect(r.bars.every((b) => !b.repeatStart && !b.repeatEnd && b.ending === null)).toBe(true);
  });

  it("takes 4 bars, and keeps a last bar that already leads to the top", () => {
    const r = generateIntro(AWAY, { kind: "last-bars", bars: 4 });
    expect(symbols(r.bars)).toEqual(["Am7b5", "D7(b9)", "Gm7", "G7"]); // G7 is the V of Cm7
  });

  it("follows the last time through: the 2nd ending, not the 1st", () => {
    const r = generateIntro(MINOR, { kind: "last-bars", bars: 4 });
    expect(symbols(r.bars)).toEqual(["Dm7", "Gm7", "Em7b5 A7(b9)", "Em7b5 A7(b9)"]);
  });

  it("says so when the form is shorter than the bars asked for, and suggests a solo chorus", () => {
    const r = generateIntro(SHORT, { kind: "last-bars", bars: 8 });
    expect(r.fits).toBe(false);
    expect(r.suggestions[0]).toBe("solo-chorus");
    expect(r.advice).toMatch(/only 2 bars/);
  });
});

describe("vamp", () => {
  it("suggests a vamp from the tune: I–ii on a major tonic", () => {
    const r = generateIntro(ON_TONIC, { kind: "vamp" });
    expect(r.vamp).toEqual(["Fmaj7", "Gm7"]);
    expect(symbols(r.bars)).toEqual(["Fmaj7", "Gm7"]);
    expect(r.fits).toBe(true);
    expect(r.bars[0]!.repeatStart && r.bars[1]!.repeatEnd).toBe(true);
  });

  it("suggests i–IV7 on a minor tonic and I7–IV7 on a blues", () => {
    expect(generateIntro(MINOR, { kind: "vamp" }).vamp).toEqual(["Dm7", "G7"]);
    expect(generateIntro(BLUES, { kind: "vamp" }).vamp).toEqual(["F7", "Bb7"]);
  });

  it("takes the band's two chords, in house style", () => {
    const r = generateIntro(ON_TONIC, { kind: "vamp", vamp: ["G-7", "C7b9"], repeats: 4 });
    expect(symbols(r.bars)).toEqual(["Gm7", "C7(b9)"]);
    expect(r.fits).toBe(true);
    expect(r.bars[1]!.repeatTimes).toBe(4);
  });

  it("flags a vamp whose chords clash with bar 1, and says what fits", () => {
    // F#m7 and B7 belong to E major, a half step below F: four of their notes are foreign to F and to Fmaj7.
    const r = generateIntro(ON_TONIC, { kind: "vamp", vamp: ["F#m7", "B7"] });
    expect(r.fits).toBe(false);
    expect(r.advice).toMatch(/clashes with Fmaj7/);
    expect(r.advice).toMatch(/Fmaj7 \| Gm7/);
    expect(r.suggestions).toContain("two-five");
  });

  it("lets the dominant of bar 1 bring its altered notes (C7alt into Fmaj7 fits)", () => {
    expect(generateIntro(ON_TONIC, { kind: "vamp", vamp: ["Gm7", "C7alt"] }).fits).toBe(true);
  });

  it("applies the tritone substitute only to the dominant that leads in", () => {
    expect(symbols(generateIntro(BLUES, { kind: "vamp", vamp: ["Gm7", "C7"], tritoneSub: true }).bars)).toEqual(["Gm7", "Gb7"]);
  });
});

describe("solo chorus", () => {
  it("is once through the form (common practice: a chorus is one time through), with section labels", () => {
    const r = generateIntro(MINOR, { kind: "solo-chorus" });
    expect(r.bars).toHaveLength(MINOR.sections[0]!.bars.length);
    expect(r.bars[0]!.repeatStart).toBe(true);
    expect(r.bars.map((b) => b.ending)).toEqual(MINOR.sections[0]!.bars.map((b) => b.ending));
    expect(r.labels?.[0]).toBe("A");
    // The form ends on Dm7, the tonic, so its last bar turns into the ii–V of Dm7 (common practice).
    expect(symbols(r.bars).at(-1)).toBe("Em7b5 A7(b9)");
  });

  it("takes a number of choruses and drops the melody", () => {
    const r = generateIntro(SHORT, { kind: "solo-chorus", repeats: 2 });
    expect(r.bars).toHaveLength(4);
    expect(r.bars.every((b) => b.melody === undefined)).toBe(true);
  });
});

describe("turnarounds", () => {
  it("plays I–vi–ii–V into a tune that starts on the tonic (Berklee ch. 2, from memory)", () => {
    const r = generateIntro(ON_TONIC, { kind: "turnaround" });
    expect(symbols(r.bars)).toEqual(["Fmaj7 Dm7", "Gm7 C7"]);
    expect(r.fits).toBe(true);
  });

  it("plays iii–VI–ii–V, with tritone substitutes (Pease 2003 p.53: D7 → Ab7, C7 → Gb7)", () => {
    const r = generateIntro(ON_TONIC, { kind: "turnaround", variant: "iii-VI-ii-V", tritoneSub: true });
    expect(symbols(r.bars)).toEqual(["Am7 Ab7", "Gm7 Gb7"]);
  });

  it("says a turnaround does not fit a tune that starts away from the tonic, and suggests a ii–V", () => {
    const r = generateIntro(AWAY, { kind: "turnaround" });
    expect(r.fits).toBe(false);
    expect(r.advice).toMatch(/starts on Cm7 \(ii7\)/);
    expect(r.suggestions[0]).toBe("two-five");
  });

  it("uses one chord a bar in 3/4, and the minor turnaround in a minor key", () => {
    expect(symbols(generateIntro(WITH_INTRO, { kind: "turnaround" }).bars)).toEqual(["Gmaj7", "Em7", "Am7", "D7"]);
    expect(symbols(generateIntro(MINOR, { kind: "turnaround" }).bars)).toEqual(["Dm7 Bm7b5", "Em7b5 A7(b9)"]);
  });

  it("uses I7–VI7–ii–V on a blues (common practice)", () => {
    expect(symbols(generateIntro(BLUES, { kind: "turnaround" }).bars)).toEqual(["F7 D7", "Gm7 C7"]);
  });
});

describe("ii–V into the top", () => {
  it("major ii–V into a major first chord; iiø–V7(b9) into a minor one (Berklee ch. 4, from memory)", () => {
    expect(symbols(generateIntro(ON_TONIC, { kind: "two-five" }).bars)).toEqual(["Gm7", "C7"]);
    expect(symbols(generateIntro(MINOR, { kind: "two-five" }).bars)).toEqual(["Em7b5", "A7(b9)"]);
    expect(symbols(generateIntro(AWAY, { kind: "two-five", bars: 1 }).bars)).toEqual(["Dm7b5 G7(b9)"]);
  });

  it("substitutes the V a tritone away (Pease 2003 p.53: G7 → Db7)", () => {
    expect(symbols(generateIntro(AWAY, { kind: "two-five", tritoneSub: true }).bars)).toEqual(["Dm7b5", "Db7"]);
  });
});

describe("composed intro", () => {
  it("plays the chart's own intro", () => {
    const r = generateIntro(WITH_INTRO, { kind: "composed" });
    expect(symbols(r.bars)).toEqual(["Cmaj7", "Bm7", "Am7", "D7"]);
    expect(r.fits).toBe(true);
  });

  it("says so when there is none, and suggests what fits the top", () => {
    const tonic = generateIntro(ON_TONIC, { kind: "composed" });
    expect([tonic.fits, tonic.bars]).toEqual([false, []]);
    expect(tonic.advice).toMatch(/no composed intro/);
    expect(tonic.suggestions[0]).toBe("turnaround");
    const away = generateIntro(AWAY, { kind: "composed" });
    expect(away.suggestions[0]).toBe("two-five");
    expect(away.suggestions).not.toContain("composed");
  });
});

describe("the intro picker", () => {
  it("offers every kind with its fit", () => {
    const all = suggestIntros(AWAY);
    expect(all.map((r) => r.kind)).toEqual([...INTRO_KINDS]);
    expect(Object.fromEntries(all.map((r) => [r.kind, r.fits]))).toEqual({
      "dominant-pedal": true, "last-bars": true, vamp: true, "solo-chorus": true, turnaround: false, "two-five": true, composed: false,
    });
    for (const r of all) {
      expect(r.advice.length).toBeGreaterThan(20);
      if (!r.fits) expect(r.suggestions.length).toBeGreaterThan(0);
      else expect(r.suggestions).toEqual([]);
    }
  });
});

describe("the options an intro was built with", () => {
  it("come back with defaults filled in, and rebuild the same intro", () => {
    for (const chart of [ON_TONIC, AWAY, MINOR, WITH_INTRO, BLUES, SHORT]) {
      for (const first of suggestIntros(chart)) {
        const choice = IntroChoiceSchema.parse(first.choice);
        expect(choice.kind).toBe(first.kind);
        expect(generateIntro(chart, choice).bars).toEqual(first.bars);
      }
    }
  });

  it("an unreadable vamp chord gives no bars and names the chord, never a guess", () => {
    const r = generateIntro(ON_TONIC, { kind: "vamp", vamp: ["Fmaj7", "Gx9"] });
    expect([r.fits, r.bars]).toEqual([false, []]);
    expect(r.advice).toMatch(/"Gx9"/);
  });

  it("keeps lengths in range instead of failing", () => {
    expect(generateIntro(ON_TONIC, { kind: "dominant-pedal", bars: 0 }).bars).toHaveLength(1);
    expect(generateIntro(ON_TONIC, { kind: "turnaround", bars: 1 }).bars).toHaveLength(1);
    expect(generateIntro(WITH_INTRO, { kind: "turnaround", bars: 1 }).bars).toHaveLength(2); // 4 chords need 2 bars of 3/4
    expect(generateIntro(ON_TONIC, { kind: "turnaround", bars: 3 }).bars.map((b) => b.chords.length)).toEqual([1, 1, 2]);
  });
});
