// Change summaries from small before/after pairs. Transpositions: a B♭ part reads a major 2nd above
// concert, an E♭ part a major 6th above (any orchestration text; common practice).
import { describe, expect, it } from "vitest";
import { parseChartText } from "@/lib/chart";
import { describeChanges, headline, prettySymbol } from "@/lib/chart/changes";

const BASE = `title: Harbour Lights
key: F
time: 4/4
tempo: 138
feel: medium swing

A:
| F6 | D7 | Gm7 | C7 | Am7 | Ab7 | Gm7 | C7 |
`;

const chart = (text: string) => parseChartText(text);
const texts = (before: string, after: string, opts = {}) => describeChanges(chart(before), chart(after), opts).map((l) => l.text);

describe("change summaries", () => {
  it("names metadata changes: tempo and feel", () => {
    const after = BASE.replace("tempo: 138", "tempo: 144").replace("medium swing", "bossa");
    expect(texts(BASE, after)).toEqual(["tempo: 138 → 144", "feel: medium swing → bossa"]);
  });

  it("names a changed bar with its chords in the player's written key", () => {
    const after = BASE.replace("| Am7 | Ab7 |", "| Am7 | D7(b9) |");
    // Concert A♭7 → D7(♭9) reads B♭7 → E7(♭9) on a B♭ part (up a major 2nd).
    expect(texts(BASE, after, { instrument: "bb" })).toEqual(["bar 6: B♭7 → E7(♭9)"]);
    expect(texts(BASE, after)).toEqual(["bar 6: A♭7 → D7(♭9)"]);
  });

  it("a key change alone is one line, not every bar, and the headline says the new key", () => {
    const after = BASE.replace("key: F", "key: Eb").replace("| F6 | D7 | Gm7 | C7 | Am7 | Ab7 | Gm7 | C7 |", "| Eb6 | C7 | Fm7 | Bb7 | Gm7 | Gb7 | Fm7 | Bb7 |");
    const lines = describeChanges(chart(BASE), chart(after), { instrument: "eb" });
    // E♭ part: concert F reads D, concert E♭ reads C (a major 6th up).
    expect(lines.map((l) => l.text)).toEqual(["key: D → C"]);
    expect(headline("Harbour Lights", lines)).toBe("Harbour Lights now in C");
  });

  it("reports sections added and removed", () => {
    const after = BASE + "\nB:\n| Bbmaj7 | Bbm7 | Am7 | D7 |\n";
    expect(texts(BASE, after)).toEqual(["section B added"]);
    expect(texts(after, BASE)).toEqual(["section B removed"]);
  });

  it("reports a composed intro added and tonight's intro and ending choices", () => {
    const after = BASE.replace("A:\n", "Intro:\n| Gm7 C7 | Gm7 C7 |\nA:\n");
    expect(texts(BASE, after)).toEqual(["composed intro added (2 bars)"]);
    const tonight = { before: { intro: "none", ending: "as written" }, after: { intro: "dominant pedal, 4 bars", ending: "tag ×3" } };
    expect(texts(BASE, BASE, { tonight })).toEqual(["tonight's intro: none → dominant pedal, 4 bars", "tonight's ending: as written → tag ×3"]);
  });

  it("reads chords in tonight's key when the set list moves the tune", () => {
    const after = BASE.replace("| Am7 | Ab7 |", "| Am7 | D7 |");
    // Tonight in G (up a whole step from F): concert A♭7 → B♭7, D7 → E7.
    expect(texts(BASE, after, { tonightKey: "G" })).toEqual(["bar 6: B♭7 → E7"]);
  });

  it("says nothing when nothing changed, and caps a long list", () => {
    expect(texts(BASE, BASE)).toEqual([]);
    const after = BASE.replace("| F6 | D7 | Gm7 | C7 | Am7 | Ab7 | Gm7 | C7 |", "| C | C | C | C | C | C | C | C |");
    const lines = texts(BASE, after, { maxBars: 3 });
    expect(lines).toHaveLength(4);
    expect(lines[3]).toBe("and 5 more bars");
  });

  it("prints flats and sharps as music signs", () => {
    expect(prettySymbol("Bb7(b9)")).toBe("B♭7(♭9)");
    expect(prettySymbol("F#m7b5")).toBe("F♯m7♭5");
  });
});
