// Imports of the MusicXML test suite (cuthbertLab/musicxmlTestSuite, MIT; tests/fixtures/musicxml/suite),
// each expectation written out by hand from the file named in the test.
import { describe, expect, it } from "vitest";
import { parseChartText, serializeChart } from "@/lib/chart";
import { playingOrder } from "@/lib/chart/as-played";
import { exportMusicXml, importScoreFile, MusicXmlError } from "@/lib/musicxml";
import { invalid, validateAll } from "./xmllint";
import { fixture, suite } from "./helpers";

const read = (name: string) => importScoreFile(suite(name), { fitChartText: true });
const encode = (s: string) => new TextEncoder().encode(s);

describe("72c-TransposingInstruments-Change.xml: a change of <transpose> inside a part is followed bar by bar", () => {
  // Bar 1: Clarinet in Eb, <fifths>1</fifths>, <transpose> +2/+3 (written G major sounds Bb major), note C4.
  // Bar 2: Clarinet in Bb, <fifths>0</fifths>, <transpose> -1/-2, note C4; bar 3 the same.
  const { chart, report } = read("72c-TransposingInstruments-Change.xml");

  it("keeps concert Bb major throughout", () => {
    expect(chart.key).toBe("Bb");
    expect(report.skipped.join("\n")).not.toMatch(/key change/);
  });

  it("sounds written C4 as Eb4 on the E♭ clarinet, then Bb3 on the B♭ clarinet", () => {
    // written + transpose = sounding (MusicXML 4.0): C4 + m3 = Eb4; C4 - M2 = Bb3
    expect(chart.sections[0]!.bars.map((b) => b.melody?.map((n) => n.pitch))).toEqual([["Eb4"], ["Bb3"], ["Bb3"]]);
  });

  it("says where the transposition changes", () => {
    expect(report.read).toContain("Bar 2: the part changes transposition (to -1/-2); followed, still read in concert pitch");
  });
});

describe("46g-PickupMeasure-Chordnames-FiguredBass.xml: a pickup stays a pickup", () => {
  // Measure 0 implicit="yes": harmony C, two eighths C5 (1 beat of 4/4). Measure 1: harmony C, four quarters C4.
  // A <figured-bass> in each measure.
  const { chart, report } = read("46g-PickupMeasure-Chordnames-FiguredBass.xml");
  const [pickup, bar1] = chart.sections[0]!.bars;

  it("reads measure 0 as a one-beat pickup with its chord and melody, not padded to a full bar", () => {
    expect(pickup).toMatchObject({ pickup: 1, chords: [{ symbol: "C", beat: 0, beats: 1 }] });
    expect(pickup!.melody).toEqual([{ pitch: "C5", duration: "8", dots: 0, tie: false }, { pitch: "C5", duration: "8", dots: 0, tie: false }]);
    expect(bar1).toMatchObject({ chords: [{ symbol: "C", beat: 0, beats: 4 }] });
    expect(bar1!.pickup).toBeUndefined();
  });

  it("is chart text with a pickup line", () => {
    const text = serializeChart(chart);
    expect(text).toMatch(/^pickup: 1 beat$/m);
    expect(parseChartText(text)).toEqual(chart);
  });

  it("reports the figured bass it left out, with its bars", () => {
    expect(report.skipped).toContain("figured bass (2) — bars 0 and 1");
    expect(report.read).toContain("Bar 0: a pickup of 1 beat");
  });
});

describe("61i-Lyrics-Chords.xml: a score chart text cannot hold is imported, with what changed", () => {
  // One 4/4 measure holding a single quarter E5 with lyric 1, and C5, A4 stacked on it (<chord/>) with lyrics 2, 3.
  const { chart, report } = read("61i-Lyrics-Chords.xml");

  it("keeps the top note and fills the bar with rests", () => {
    expect(chart.sections[0]!.bars[0]!.melody?.map((n) => `${n.pitch ?? "r"}:${n.duration}`)).toEqual(["E5:q", "r:h", "r:q"]);
    expect(parseChartText(serializeChart(chart))).toEqual({ ...chart, sections: [{ ...chart.sections[0]!, bars: [{ ...chart.sections[0]!.bars[0]!, chords: [{ symbol: "N.C.", beat: 0, beats: 4 }] }] }] });
  });

  it("says which bar was changed and what was left out", () => {
    expect(report.skipped).toEqual(["lyrics (3) — bar 1", "notes stacked under the melody (chords in the staff) (2) — bar 1"]);
    expect(report.changed).toEqual(["measures shorter than their time signature: filled with rests (1) — bar 1"]);
  });
});

describe("71f-AllChordTypes.xml: every kind imported into chart text, naming the bars and chords changed", () => {
  // Measure 9 holds F# (inversion 2), Fbb/C, G#/D# and C at quarter positions 0, 2, 2½ and 3 (divisions 2).
  const { chart, report } = read("71f-AllChordTypes.xml");
  const bar9 = chart.sections[0]!.bars[8]!;

  it("inversion 2 of F# major is F#/C# (MusicXML 4.0 <inversion>: 2 = the 5th in the bass)", () => {
    expect(bar9.chords[0]!.symbol).toBe("F#/C#");
  });

  it("a double-flat root is respelled only with a report line (Fbb → Eb)", () => {
    expect(bar9.chords.map((c) => c.symbol)).toContain("Eb/C");
    expect(report.skipped).toContain("chord roots with a double flat (Fbb), respelled as the plain note (1) — bar 9");
  });

  it("a chord between the beats is left out by name, and the rest of the file is kept", () => {
    // G#/D# at beat 2½ would share beat 3 with C: chart text holds one chord a beat
    expect(report.changed.join("\n")).toMatch(/left out \(G#\/D#\) \(1\) — bar 9/);
    expect(chart.sections[0]!.bars).toHaveLength(10);
    expect(() => parseChartText(serializeChart(chart))).not.toThrow();
  });
});

describe("71g-MultipleChordnames.xml: harmonies with no <offset> keep the position the file implies", () => {
  // Two harmonies (C, F#m6) before a half note A4, two more (Dm7, G7) before a half note G4: each pair
  // changes during its note (the file's own description), so each chord gets a quarter.
  const { chart, report } = read("71g-MultipleChordnames.xml");

  it("places C, F#m6, Dm7, G7 on beats 1 to 4", () => {
    expect(chart.sections[0]!.bars[0]!.chords.map((c) => `${c.symbol}@${c.beat}`)).toEqual(["C@0", "F#m6@1", "Dm7@2", "G7@3"]);
  });

  it("says the positions were guessed", () => {
    expect(report.skipped).toContain("chord positions guessed: chords written one after another over one note share it evenly (1) — bar 1");
  });
});

describe("71a-Chordnames.xml: an added 2nd stays a chord, and the report says it is written add9", () => {
  // Measure 1, 4th harmony: Eb major with <degree> add 2
  it("reports the add2 → add9 renaming", () => {
    const { chart, report } = read("71a-Chordnames.xml");
    expect(chart.sections[0]!.bars[0]!.chords[3]!.symbol).toBe("Ebadd9");
    expect(report.skipped.join("\n")).toMatch(/Ebadd2 read as Ebadd9/);
  });
});

describe("nothing read is dropped silently", () => {
  it("46a-Barlines.xml: each barline style is counted with its bar", () => {
    // 46a: measure 3 dotted, 4 dashed, 5 heavy, 6 light-light, 7 light-heavy, 8 heavy-light, 9 heavy-heavy,
    // 10 tick, 11 short, 12 none (right barlines, no repeats); measure 13 ends the piece
    const { report } = read("46a-Barlines.xml");
    for (const [style, bar] of [["dotted", 3], ["dashed", 4], ["heavy", 5], ["light-light", 6], ["light-heavy", 7], ["heavy-light", 8], ["heavy-heavy", 9], ["tick", 10], ["short", 11], ["none", 12]] as const) {
      expect(report.skipped).toContain(`barline styles ("${style}") drawn as plain barlines (1) — bar ${bar}`);
    }
  });

  it("31c-MetronomeMarks.xml: extra tempo marks and marks with no number are counted", () => {
    // 31c: measure 1 has two marks (dotted quarter = 100, long = 100); measures 2 and 3 equate two
    // note values (no per-minute), measure 3 also has a dotted quarter = 77
    const { report } = read("31c-MetronomeMarks.xml");
    expect(report.skipped).toContain("tempo marks after the first; the chart keeps one tempo (2) — bars 1 and 3");
    expect(report.skipped).toContain("tempo marks that equate two note values or give no number (3) — bars 2 and 3");
  });

  it("a mode-only key change is reported apart from key changes", () => {
    const xml = new TextDecoder().decode(fixture("cinderpath-nocturne.musicxml")).replace(/(<measure number="2"[^>]*>)/, "$1<attributes><key><fifths>-1</fifths><mode>major</mode></key></attributes>");
    // the file is in D minor (1 flat) on an alto part; bar 2 switches to F major, the same signature
    expect(importScoreFile(encode(xml)).report.skipped.join("\n")).toMatch(/changes of mode only .* — bar 2/);
  });

  it("45b-RepeatWithAlternatives.xml with its 1st ending numbered \"1, 2\" and the 2nd \"3\": one ending for passes 1 and 2", () => {
    // MusicXML 4.0, <ending>: "Single endings such as "1" or comma-separated multiple endings such as "1,2" may be used";
    // the repeat is made three times through (<repeat times="3">) so the ending numbered 3 is reached.
    const xml = new TextDecoder()
      .decode(suite("45b-RepeatWithAlternatives.xml"))
      .replace(/<ending number="1" type="(start|stop)"/g, '<ending number="1, 2" type="$1"')
      .replace(/<ending number="2" type="(start|discontinue)"/g, '<ending number="3" type="$1"')
      .replace('<repeat direction="backward"/>', '<repeat direction="backward" times="3"/>');
    const { chart, report } = importScoreFile(encode(xml));
    const bars = chart.sections.flatMap((s) => s.bars);
    expect(bars.map((b) => b.ending)).toEqual([null, 1, 3, null]);
    expect(bars[1]!.endingPasses).toEqual([1, 2]);
    expect(bars[2]!.endingPasses).toBeUndefined();
    expect(report.skipped.join("\n")).not.toMatch(/ending/);
    // played: bar 1, ending bar (pass 1), bar 1, ending bar (pass 2), bar 1, 3rd ending, bar 4
    expect(playingOrder(bars)).toEqual([0, 1, 0, 1, 0, 2, 3]);
    // and back out: the export names both passes, and the round trip keeps them
    const out = exportMusicXml(chart);
    expect(invalid(validateAll({ "45b-1-2.musicxml": out }))).toEqual({});
    expect(out).toContain('<ending number="1, 2" type="start"/>');
    expect(out).toContain('<ending number="1, 2" type="stop"/>');
    expect(importScoreFile(encode(out)).chart.sections.flatMap((s) => s.bars).map((b) => b.endingPasses ?? b.ending)).toEqual([null, [1, 2], 3, null]);
  });

  it("an ending number past 8 is reported with its bar", () => {
    const xml = new TextDecoder().decode(suite("45b-RepeatWithAlternatives.xml")).replace(/<ending number="2" type="(start|discontinue)"/g, '<ending number="2, 9" type="$1"');
    expect(importScoreFile(encode(xml)).report.skipped.join("\n")).toMatch(/ending numbers beyond 8 or unreadable \("2, 9"\), read as 2 \(1\) — bar 3/);
  });
});

describe("clear errors for a file that is cut off or malformed", () => {
  const full = new TextDecoder().decode(suite("45a-SimpleRepeat.xml"));
  const refusal = (text: string) => {
    try {
      importScoreFile(encode(text));
    } catch (e) {
      if (e instanceof MusicXmlError) return e.message;
      throw e;
    }
    throw new Error("not refused");
  };

  it("a file cut off after a measure names the last line and the tags left open", () => {
    const cut = full.slice(0, full.indexOf("</measure>") + "</measure>".length);
    expect(refusal(cut)).toBe(`This file is not well-formed XML. The file ends at line ${cut.split("\n").length} before the score is complete: expected </part>, </score-partwise> to close them. It may have been cut off while saving or uploading.`);
  });

  it("a wrong closing tag names its line and the tag expected", () => {
    expect(refusal(full.replace("</measure>", "</part>"))).toMatch(/^This file is not well-formed XML\. Line \d+, column \d+: expected the closing tag <\/measure> \(opened on line \d+\), but found <\/part>\.$/);
  });

  it("an attribute without quotes and a bare & name their line, without the parser's words", () => {
    expect(refusal(full.replace('<measure number="1"', "<measure number=1"))).toMatch(/^This file is not well-formed XML\. Line \d+, column \d+: expected a value in quotes for the attribute number/);
    expect(refusal(full.replace("<part-name>", "<part-name>A & B"))).toMatch(/Line \d+, column \d+: a bare "&" — expected &amp;/);
  });
});
