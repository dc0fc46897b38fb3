import { describe, expect, it } from "vitest";
import { ChartTextError, parseChartText, serializeChart } from "@/lib/chart";

// DESIGN.md §5's example, verbatim: outside checks write charts this way.
const DESIGN_EXAMPLE = `title: Lantern Street          # metadata lines \`name: value\`
key: Eb
time: 4/4
tempo: 160
feel: medium swing

Intro:
| Cm7 F7 | Fm7 Bb7 |
A:
|: Ebmaj7 | Cm7 | Fm7 | Bb7 |
| Gm7 C7 | Fm7 Bb7 | [1 Ebmaj7 | Fm7 Bb7 :| [2 Ebmaj7 | % |
`;

const chart = (body: string, head = "title: Test Tune\nkey: C\n") => parseChartText(head + body);

function errorOf(text: string): ChartTextError {
  try {
    parseChartText(text);
  } catch (e) {
    if (e instanceof ChartTextError) return e;
    throw e;
  }
  throw new Error("expected a ChartTextError");
}

describe("reading the chart text of DESIGN.md §5", () => {
  const c = parseChartText(DESIGN_EXAMPLE);

  it("reads the metadata, with the comment dropped", () => {
    expect([c.title, c.key, c.meter, c.tempo, c.feel, c.composer]).toEqual(["Lantern Street", "Eb", { beats: 4, unit: 4 }, 160, "medium swing", ""]);
  });

  it("keeps the composed intro apart from the form", () => {
    expect(c.intro?.label).toBe("Intro");
    expect(c.intro?.bars.map((b) => b.chords.map((x) => x.symbol))).toEqual([["Cm7", "F7"], ["Fm7", "Bb7"]]);
    expect(c.sections.map((s) => s.label)).toEqual(["A"]);
  });

  it("reads repeats, endings and the simile bar", () => {
    const bars = c.sections[0]!.bars;
    expect(bars).toHaveLength(10);
    expect(bars[0]!.repeatStart).toBe(true);
    expect(bars.map((b) => b.ending)).toEqual([null, null, null, null, null, null, 1, 1, 2, 2]);
    expect(bars[7]!.repeatEnd).toBe(true);
    expect(bars[9]!.simile).toBe(true);
    expect(bars[9]!.chords).toEqual([]);
  });

  it("shares a bar's beats evenly between its chords (4/4: two beats each)", () => {
    expect(c.sections[0]!.bars[4]!.chords).toEqual([
      { symbol: "Gm7", beat: 0, beats: 2 },
      { symbol: "C7", beat: 2, beats: 2 },
    ]);
  });
});

describe("beats and slashes", () => {
  it("a lone / holds the chord before it one more beat", () => {
    expect(chart("A:\n| C / / G7 |").sections[0]!.bars[0]!.chords).toEqual([
      { symbol: "C", beat: 0, beats: 3 },
      { symbol: "G7", beat: 3, beats: 1 },
    ]);
  });

  it("counts beats in the time signature's unit (6/8: six eighths, two chords of three)", () => {
    const c = chart("A:\n| Dm7 G7 |", "title: T\nkey: C\ntime: 6/8\n");
    expect(c.meter).toEqual({ beats: 6, unit: 8 });
    expect(c.sections[0]!.bars[0]!.chords.map((x) => [x.beat, x.beats])).toEqual([[0, 3], [3, 3]]);
  });

  it("reads 3/4 with one chord a beat", () => {
    const c = chart("A:\n| C Dm Em |", "title: T\nkey: C\ntime: 3/4\n");
    expect(c.sections[0]!.bars[0]!.chords.map((x) => x.beats)).toEqual([1, 1, 1]);
  });

  it("too many chords for the bar is an error at the first chord that does not fit", () => {
    const e = errorOf("title: T\nkey: C\ntime: 3/4\nA:\n| C D E F |");
    expect([e.line, e.column]).toEqual([5, 9]);
    expect(e.message).toMatch(/Too many chords/);
    expect(e.message).toMatch(/3\/4/);
  });

  it("when the chords can't share the bar evenly, the earlier ones take the extra beats (3/4: two and one)", () => {
    const c = chart("A:\n| Dm7 G7 |", "title: T\nkey: C\ntime: 3/4\n");
    expect(c.sections[0]!.bars[0]!.chords.map((x) => [x.beat, x.beats])).toEqual([[0, 2], [2, 1]]);
    expect(chart("A:\n| C D E |").sections[0]!.bars[0]!.chords.map((x) => x.beats)).toEqual([2, 1, 1]);
    expect(serializeChart(c)).toContain("| Dm7 / G7 |");
  });

  it("N.C., house style and spelling variants", () => {
    const c = chart("A:\n| N.C. | C-7 F7b9 | BbΔ | Gø C7(#9) |");
    expect(c.sections[0]!.bars.map((b) => b.chords.map((x) => x.symbol).join(" "))).toEqual(["N.C.", "Cm7 F7(b9)", "Bbmaj7", "Gm7b5 C7(#9)"]);
  });
});

describe("more of the format", () => {
  it("reads :|x3 as three times through, |: :| on one bar, and a ] closing an ending", () => {
    const c = chart("A:\n|: C | F :|x3\nB:\n| [1 G ] | C |");
    expect(c.sections[0]!.bars[1]!.repeatTimes).toBe(3);
    expect(c.sections[1]!.bars.map((b) => b.ending)).toEqual([1, null]);
  });

  it("tells a header followed by a repeat (A:|:) from a chord before a repeat end (G7:|)", () => {
    const c = chart("A:|: C | F :|\nB (out): | D | G7:| C |");
    expect(c.sections.map((s) => s.label)).toEqual(["A", "B (out)"]);
    expect(c.sections[0]!.bars[0]!.repeatStart).toBe(true);
    expect(c.sections[1]!.bars[1]!.repeatEnd).toBe(true);
    expect(c.sections[1]!.bars[1]!.chords[0]!.symbol).toBe("G7");
  });

  it("reads bars on the header line, and bars with no header into section A", () => {
    expect(chart("A: | C | F |").sections[0]!.bars).toHaveLength(2);
    expect(chart("| C | F |").sections[0]!.label).toBe("A");
  });

  it("keeps # in chord names and titles, but reads # after a space as a comment", () => {
    const c = parseChartText("title: Take #5\nkey: F#  # sharp key\nA:\n| F#7 | C#m7 |  # two bars\n# a whole-line comment\n");
    expect(c.title).toBe("Take #5");
    expect(c.key).toBe("F#");
    expect(c.sections[0]!.bars).toHaveLength(2);
  });

  it("reads a melody line under its bar line", () => {
    const c = chart("A:\n| C | G7 |\nmelody: | E4:h G4:h | r:q F4:q~ F4:h |");
    expect(c.sections[0]!.bars[0]!.melody).toEqual([
      { pitch: "E4", duration: "h", dots: 0, tie: false },
      { pitch: "G4", duration: "h", dots: 0, tie: false },
    ]);
    expect(c.sections[0]!.bars[1]!.melody![1]).toEqual({ pitch: "F4", duration: "q", dots: 0, tie: true });
  });

  it("a melody that does not fill its bar is an error at that bar", () => {
    const e = errorOf("title: T\nkey: C\nA:\n| C | G7 |\nmelody: | E4:w | F4:h |");
    expect(e.line).toBe(5);
    expect(e.column).toBe(17);
    expect(e.message).toMatch(/2 beats.*4 beats/);
  });

  it.each([
    ["title: T\nkey: C\nA:\n| Cxyz |", 4, 3, /Can't read the chord "Cxyz"/],
    ["title: T\nkey: H\nA:\n| C |", 2, 1, /"H" is not a key/],
    ["title: T\nkey: G#\nA:\n| C |", 2, 1, /8 sharps: write it as Ab/], // G# major: 8 sharps (circle of fifths, common practice)
    ["title: T\nkey: C\ntime: 7/5\nA:\n| C |", 3, 1, /time signature/],
    ["title: T\nkey: C\ntempo: fast\nA:\n| C |", 3, 1, /tempo/],
    ["title: T\nkey: C\ntitle: U\nA:\n| C |", 3, 1, /title is given twice/],
    ["title: T\nkey: C\nA:\n| C | | D |", 4, 7, /empty/],
    ["title: T\nkey: C\nA:\n| % | C |", 4, 1, /no bar before/],
    ["title: T\nkey: C\nA:\n| [1 C | [2 D |", 4, 1, /must end with :\|/],
    ["title: T\nkey: C\nA:\n| [2 C |", 4, 3, /without an ending \[1/],
    ["title: T\nkey: C\nA:\n| / C |", 4, 3, /can't start with \//],
    ["title: T\nkey: C\nA:\n| C % |", 4, 3, /stands alone/],
    ["title: T\nkey: C\nverse: sung\n", 3, 1, /not a field we know/],
    ["title: T\nkey: C\nA:\nB:\n| C |", 3, 1, /Section "A" has no bars/],
    ["key: C\nA:\n| C |", 1, 1, /needs a title/],
    ["title: T\nA:\n| C |", 1, 1, /needs a concert key/],
    ["title: T\nkey: C\n", 2, 1, /no bars/],
    ["title: T\nkey: C\nmelody: C4:w\n", 3, 8, /under the bar line/],
    ["title: T\nkey: C\nA:\n| C |\nmelody: | C4:w | D4:w |", 5, 17, /2 bars/],
    ["title: T\nkey: C\nA:\n| C |\nmelody: | X9:q |", 5, 11, /not a melody note/],
    ["title: T\nkey: C\nA:\n| C :|x1", 4, 5, /2 to 16 times/],
    ["title: T\nkey: C\nIntro:\n| C |\nIntro:\n| D |", 5, 1, /already has an Intro/],
  ])("reports a problem at its line and column (%#)", (text, line, column, message) => {
    const e = errorOf(text);
    expect(e.message).toMatch(message);
    expect([e.line, e.column]).toEqual([line, column]);
  });

  it("gives a status line with the place", () => {
    expect(errorOf("title: T\nkey: C\nA:\n| Cxyz |").where).toMatch(/^Line 4, column 3: /);
  });
});

describe("writing chart text", () => {
  it("writes the DESIGN.md example back so that it reads the same", () => {
    const c = parseChartText(DESIGN_EXAMPLE);
    const text = serializeChart(c);
    expect(parseChartText(text)).toEqual(c);
    expect(text).toContain("Intro:\n| Cm7 F7 | Fm7 Bb7 |\nA:\n|: Ebmaj7 | Cm7 | Fm7 | Bb7 |\n| Gm7 C7 | Fm7 Bb7 | [1 Ebmaj7 | Fm7 Bb7 :|\n| [2 Ebmaj7 | % |");
  });

  it("is stable: writing what it read gives the same text", () => {
    const once = serializeChart(chart("A:\n|: C / / G7 | N.C. :|x4\nmelody: | C4:h. r:q | r:w |\n| [1 Dm7 :| [2 G7 ] | C |"));
    expect(serializeChart(parseChartText(once))).toBe(once);
    expect(once).toContain("|: C / / G7 | N.C. :|x4 [1 Dm7 :| [2 G7 ] |\nmelody: | C4:h. r:q | r:w |\n| C |");
  });
});

describe("docs/chart-text.md", () => {
  it("its opening example reads, with composer, intro, melody, endings and a held chord", async () => {
    const fs = await import("node:fs");
    const path = await import("node:path");
    const doc = fs.readFileSync(path.resolve(import.meta.dirname, "../../../docs/chart-text.md"), "utf8");
    const example = /```\n([\s\S]*?)```/.exec(doc)![1]!;
    const c = parseChartText(example);
    expect(c.composer).not.toBe("");
    expect(c.intro?.bars).toHaveLength(2);
    expect(c.sections.map((s) => s.label)).toEqual(["A", "B"]);
    expect(c.sections[0]!.bars[2]!.melody?.map((n) => n.pitch)).toEqual([null, "Ab4", "Ab4"]);
    expect(c.sections[1]!.bars[0]!.chords.map((x) => x.beats)).toEqual([3, 1]);
  });
});
