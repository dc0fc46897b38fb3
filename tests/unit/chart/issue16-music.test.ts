// Issue 16, the music that read wrong (items 3, 4, 8, 15, 16, 17, 18): each test is named after its item.
import { describe, expect, it } from "vitest";
import { arrange, barsAsPlayed, formAsPlayed, generateIntro, parseChartText, suggestIntros, type IntroReader } from "@/lib/chart";
import { progressionNumerals, transposeChord } from "@/lib/music";
import { DEMO_CHARTS } from "@/db/demo-charts";
import { MINOR, ON_TONIC } from "./charts";

const demo = (slug: string) => parseChartText(DEMO_CHARTS.find((c) => c.slug === slug)!.text);
const symbols = (bars: { chords: { symbol: string }[] }[]) => bars.map((b) => b.chords.map((c) => c.symbol).join(" "));

const NO_CHORDS = parseChartText(`title: Sketch
key: F
A:
| N.C. | N.C. | N.C. | N.C. |
`);

describe("item 4: lengths count bars as played", () => {
  it("counts a 26-bar AABA with a first and second ending as the 32 bars the band plays", () => {
    // Lanternfish: 10 bars of A written with [1 (2 bars) and [2 (2 bars) → 8 + 8 played; B 8; A 8.
    // A chorus is one time through the form, repeats taken (common practice).
    const lanternfish = demo("lanternfish");
    expect(lanternfish.sections.flatMap((s) => s.bars)).toHaveLength(26);
    expect(formAsPlayed(lanternfish)).toHaveLength(32);
  });

  it("says 32 bars and times them from the bars as played (32 × 4 beats at 152 = 51 s)", () => {
    const r = generateIntro(demo("lanternfish"), { kind: "solo-chorus" });
    expect(r.advice).toContain("32-bar form");
    expect(r.advice).not.toContain("26-bar");
    // 32 bars × 4 beats × 60 / 152 = 50.5 s → "about 51 seconds" (arithmetic).
    expect(r.advice).toContain("about 51 seconds at 152");
  });

  it("takes a :|x3 three times through and plays each ending on its own pass", () => {
    const chart = parseChartText(`title: T
key: C
A:
|: C | [1 F :| [2 G :| [3 Am |
`);
    // First ending on pass 1, second on pass 2, third on pass 3 (common practice for numbered endings).
    const bars = chart.sections[0]!.bars;
    bars[2]!.repeatTimes = 3;
    expect(symbols(barsAsPlayed(bars))).toEqual(["C", "F", "C", "G", "C", "Am"]);
  });
});

describe("item 8: a chart without chords gets one plain answer", () => {
  it("never offers a chord that is not there, nor advice that contradicts itself", () => {
    for (const r of suggestIntros(NO_CHORDS)) {
      expect(r.fits, r.kind).toBe(false);
      expect(r.advice, r.kind).not.toContain("()");
      expect(r.advice, r.kind).not.toMatch(/works|fits better/);
      expect(r.suggestions, r.kind).toEqual([]);
      expect(r.advice, r.kind).toMatch(/no chords/);
    }
  });
});

describe("item 15: generated progressions are named by the numerals of their key", () => {
  it("names the D minor turnaround Dm7 Bm7♭5 Em7♭5 A7(♭9) i–viø–iiø–V", () => {
    // Minor-key turnaround i–viø–iiø–V (Berklee Book of Jazz Harmony ch. 4 minor ii–V; common practice).
    expect(progressionNumerals(["Dm7", "Bm7b5", "Em7b5", "A7(b9)"], "Dm")).toBe("i–viø–iiø–V");
    const r = generateIntro(MINOR, { kind: "turnaround" });
    expect(symbols(r.bars).join(" ")).toBe("Dm7 Bm7b5 Em7b5 A7(b9)");
    expect(r.name).toBe("i–viø–iiø–V");
    expect(r.advice).toContain("i–viø–iiø–V turnaround");
    expect(r.advice).not.toContain("I–vi–ii–V");
  });

  it("keeps I–vi–ii–V for a major key (Cmaj7 Am7 Dm7 G7 in C: Berklee Book of Jazz Harmony ch. 2)", () => {
    expect(progressionNumerals(["Cmaj7", "Am7", "Dm7", "G7"], "C")).toBe("I–vi–ii–V");
    expect(generateIntro(ON_TONIC, { kind: "turnaround" }).advice).toContain("I–vi–ii–V turnaround");
  });

  it("names the minor iii–VI–ii–V variant ♭III–♭VI–iiø–V", () => {
    // In C minor: E♭maj7 A♭maj7 Dm7♭5 G7(♭9) — ♭III, ♭VI on the tonic's major scale (common practice).
    expect(progressionNumerals(["Ebmaj7", "Abmaj7", "Dm7b5", "G7(b9)"], "Cm")).toBe("♭III–♭VI–iiø–V");
  });
});

describe("item 16: a turnaround played once has no repeat signs", () => {
  it("draws no repeat signs when no count is asked, or once is asked", () => {
    for (const repeats of [undefined, 1]) {
      const r = generateIntro(ON_TONIC, { kind: "turnaround", ...(repeats ? { repeats } : {}) });
      expect(r.bars.some((b) => b.repeatStart || b.repeatEnd), `repeats ${repeats}`).toBe(false);
      expect(r.choice?.repeats).toBe(1);
    }
  });

  it("draws repeat signs (and ×3) only when it is played more than once", () => {
    const r = generateIntro(ON_TONIC, { kind: "turnaround", repeats: 3 });
    expect(r.bars[0]!.repeatStart).toBe(true);
    expect(r.bars.at(-1)!.repeatEnd).toBe(true);
    expect(r.bars.at(-1)!.repeatTimes).toBe(3);
  });
});

describe("item 17: the vamp says till cue and the dominant pedal names its pedal note", () => {
  it("marks an open vamp 'till cue' on its repeat, and a counted one not", () => {
    const open = arrange(ON_TONIC, { intro: { kind: "vamp" } }).bars.filter((b) => b.part === "intro");
    expect(open.at(-1)!.repeatEnd).toBe(true);
    expect(open.at(-1)!.direction).toBe("till cue");
    const counted = arrange(ON_TONIC, { intro: { kind: "vamp", repeats: 4 } }).bars.filter((b) => b.part === "intro");
    expect(counted.some((b) => b.direction === "till cue")).toBe(false);
  });

  it("writes the pedal note in the part's key: concert C pedal (V of F) reads D on a B♭ part", () => {
    // The dominant of F is C (common practice); a B♭ part reads a major 2nd higher (MusicXML <transpose> −1/−2).
    const concert = arrange(ON_TONIC, { intro: { kind: "dominant-pedal" } }).bars[0]!;
    expect(concert.direction).toBe("C pedal");
    const bb = arrange(ON_TONIC, { instrument: "bb", intro: { kind: "dominant-pedal" } }).bars[0]!;
    expect(bb.direction).toBe("D pedal");
    // Lanternfish in E♭: the pedal is B♭ (the dominant of E♭ is B♭7, common practice); an E♭ part reads
    // a major 6th higher (MusicXML <transpose> −5/−9), so B♭ → G.
    const eb = arrange(demo("lanternfish"), { instrument: "eb", intro: { kind: "dominant-pedal" } }).bars[0]!;
    expect(eb.direction).toBe("G pedal");
  });
});

describe("item 18: the intro advice reads in the player's part", () => {
  const bbReader = (concertKey: string): IntroReader => ({
    chord: (s) => transposeChord(s, concertKey, "bb").replace(/([A-G])b/g, "$1♭").replace(/b(?=\d)/g, "♭"),
    note: (pc) => transposeChord(pc, concertKey, "bb").replace(/([A-G])b/g, "$1♭"),
    key: (k) => transposeChord(k, concertKey, "bb"),
  });

  it("names the pedal C7sus4 on a B♭ part for concert B♭7sus4 in E♭, and never the concert symbol", () => {
    // Concert B♭7sus4 → C7sus4 on a B♭ part (major 2nd up: MusicXML <transpose> −1/−2).
    const r = generateIntro(demo("lanternfish"), { kind: "dominant-pedal", read: bbReader("Eb") });
    expect(r.advice).toContain("C7sus4");
    expect(r.advice).not.toMatch(/B♭7sus4|Bb7sus4/);
    // The bars themselves stay in concert: the arrangement moves them into the part.
    expect(r.bars[0]!.chords[0]!.symbol).toBe("Bb7sus4");
  });

  it("spells the concert advice with ♭ and ♯, never b and #", () => {
    const r = generateIntro(demo("lanternfish"), { kind: "dominant-pedal" });
    expect(r.advice).toContain("B♭7sus4");
    expect(r.advice).not.toContain("Bb7");
  });
});

describe("item 3: a tag ending is part of the performance bars", () => {
  it("plays the last 4 bars of the last pass again inside repeat signs marked ×3, ending on the final barline", () => {
    const chart = demo("lanternfish");
    const bars = arrange(chart, { tag: { bars: 4, times: 3 } }).bars;
    const tag = bars.filter((b) => b.part === "tag");
    // Lanternfish's last A: | Fm7 | Gb7 | Ebmaj7 | Fm7 Bb7 | (the last four bars of the form as played).
    expect(symbols(tag)).toEqual(["Fm7", "Gb7", "Ebmaj7", "Fm7 Bb7"]);
    expect(tag[0]!.section).toBe("Tag ×3");
    expect(tag[0]!.repeatStart).toBe(true);
    expect(tag.at(-1)!.repeatEnd).toBe(true);
    expect(tag.at(-1)!.repeatTimes).toBe(3);
    expect(tag.at(-1)!.barline).toBe("final");
    const lastForm = bars.filter((b) => b.part === "form").at(-1)!;
    expect(lastForm.barline).toBe("double");
    expect(bars.filter((b) => b.barline === "final")).toHaveLength(1);
  });

  it("takes the last ending, not an earlier one, and writes out a % that opens the tag", () => {
    // MINOR ends | [2 Em7b5 A7(b9) | Dm7 |: a 2-bar tag is those bars, not the first ending's.
    const tag = arrange(MINOR, { tag: { bars: 2, times: 2 } }).bars.filter((b) => b.part === "tag");
    expect(symbols(tag)).toEqual(["Em7b5 A7(b9)", "Dm7"]);
    expect(tag.every((b) => b.ending === null)).toBe(true);
    const slow = demo("slow-tide-at-fennick-quay"); // ends | Dbmaj7 | % |
    const one = arrange(slow, { tag: { bars: 1, times: 1 } }).bars.filter((b) => b.part === "tag");
    expect(one[0]!.simile).toBe(false);
    expect(symbols(one)).toEqual(["Dbmaj7"]);
    // Once: written out, no repeat signs.
    expect(one[0]!.repeatStart || one[0]!.repeatEnd).toBe(false);
  });

  it("moves the tag into the part's key like the rest (E♭ concert → F on a B♭ part)", () => {
    const tag = arrange(demo("lanternfish"), { instrument: "bb", tag: { bars: 2, times: 3 } }).bars.filter((b) => b.part === "tag");
    // Concert E♭maj7 | Fm7 B♭7 → Fmaj7 | Gm7 C7 a major 2nd up (MusicXML <transpose> −1/−2).
    expect(symbols(tag)).toEqual(["Fmaj7", "Gm7 C7"]);
  });
});
