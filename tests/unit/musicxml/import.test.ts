import { describe, expect, it } from "vitest";
import { importScoreFile } from "@/lib/musicxml";
import { formatKey, keyFromFifths } from "@/lib/musicxml/pitch";
import { readPart } from "@/lib/musicxml/read-part";
import { Skipped } from "@/lib/musicxml/report";
import { child, parseXml } from "@/lib/musicxml/xml";
import { fixture, suite } from "./helpers";

describe("repeats and endings (MusicXML test suite 45a/45b/45c)", () => {
  it("45a-SimpleRepeat.xml: a backward repeat played five times", () => {
    // 45a: measure 1 ends with <repeat direction="backward" times="5"/>
    const bars = importScoreFile(suite("45a-SimpleRepeat.xml")).chart.sections[0]!.bars;
    expect(bars).toHaveLength(2);
    expect(bars[0]).toMatchObject({ repeatEnd: true, repeatTimes: 5 });
    expect(bars[1]).toMatchObject({ repeatEnd: false });
  });

  it("45b-RepeatWithAlternatives.xml: 1st ending closes the repeat, 2nd ending follows", () => {
    // 45b: measure 2 is ending 1 with the backward repeat, measure 3 ending 2 (discontinue)
    const { chart, report } = importScoreFile(suite("45b-RepeatWithAlternatives.xml"));
    const bars = chart.sections[0]!.bars;
    expect(bars.map((b) => b.ending)).toEqual([null, 1, 2, null]);
    expect(bars.map((b) => b.repeatEnd)).toEqual([false, true, false, false]);
    expect(report.read.join(" ")).toMatch(/1 repeat, 2 numbered endings/);
  });

  it("45c-RepeatMultipleTimes.xml: forward repeat marks and two repeat counts", () => {
    // 45c: forward repeat at measure 2, backward x5 at 3, backward x3 at 7
    const bars = importScoreFile(suite("45c-RepeatMultipleTimes.xml")).chart.sections[0]!.bars;
    expect(bars.map((b) => b.repeatStart)).toEqual([false, true, false, false, false, false, false, false]);
    expect(bars.filter((b) => b.repeatEnd).map((b) => b.repeatTimes)).toEqual([5, 3]);
  });
});

describe("keys, tempo, transposing parts", () => {
  it("13a-KeySignatures.xml: every <fifths>/<mode> names the key Gardner's table gives", () => {
    // Major: Cb 7b … C# 7#; minor keys are the relative minors (Carl E. Gardner, 1912; MusicXML <fifths>)
    const major = ["Cb", "Gb", "Db", "Ab", "Eb", "Bb", "F", "C", "G", "D", "A", "E", "B", "F#", "C#"];
    const minor = ["Abm", "Ebm", "Bbm", "Fm", "Cm", "Gm", "Dm", "Am", "Em", "Bm", "F#m", "C#m", "G#m", "D#m", "A#m"];
    const root = parseXml(new TextDecoder().decode(suite("13a-KeySignatures.xml")));
    const measures = readPart(child(root, "part")!, new Skipped());
    const names = measures.map((m) => formatKey(keyFromFifths(m.fifths, m.minor)));
    const expected = major.flatMap((k, i) => [k, minor[i]!]);
    expect(names.slice(0, 30)).toEqual(expected);
    // the chart keeps the opening key and says so
    const { chart, report } = importScoreFile(suite("13a-KeySignatures.xml"));
    expect(chart.key).toBe("Cb");
    expect(report.skipped.join(" ")).toMatch(/key changes/);
  });

  it("31c-MetronomeMarks.xml: the first metronome mark is the tempo, counted in the meter's beats", () => {
    // 31c measure 1: <beat-unit>quarter</beat-unit><beat-unit-dot/><per-minute>100</per-minute> in 4/4.
    // A dotted quarter is 1.5 quarters (MusicXML 4.0 beat-unit-dot), so 100 of them a minute is 150 quarters.
    const { chart, report } = importScoreFile(suite("31c-MetronomeMarks.xml"));
    expect(chart.tempo).toBe(150);
    expect(report.read).toContain("Tempo: 100 to the dotted quarter, read as 150 to the quarter");
  });

  it("72a-TransposingInstruments.xml: a B-flat trumpet part written in D is concert C", () => {
    // 72a: Trumpet in Bb, <fifths>2</fifths> with <transpose> -1/-2 (MusicXML 4.0: added to the
    // written pitch gives the sounding pitch); written D major sounds C major
    const { chart, report } = importScoreFile(suite("72a-TransposingInstruments.xml"));
    expect(chart.key).toBe("C");
    expect(report.partName).toBe("Trumpet in Bb");
    expect(report.read.join(" ")).toMatch(/transposing instrument \(in D\)/);
    expect(report.skipped.join(" ")).toMatch(/Horn in Eb/);
    const written = parseXml(new TextDecoder().decode(suite("72a-TransposingInstruments.xml")));
    const firstWritten = readPart(child(written, "part")!, new Skipped())[0]!.notes[0]!.pitch!;
    const firstConcert = chart.sections[0]!.bars[0]!.melody![0]!.pitch!;
    // a major 2nd down from the written note (REFERENCES.md: B-flat trumpet written a major 2nd higher)
    const pc = (p: string) => ({ C: 0, D: 2, E: 4, F: 5, G: 7, A: 9, B: 11 })[p[0] as "C"] + (p.includes("#") ? 1 : p.includes("b") ? -1 : 0);
    expect((pc(`${firstWritten.step}`) + firstWritten.alter - pc(firstConcert) + 12) % 12).toBe(2);
  });

  it("90a-Compressed-MusicXML.mxl: reads the score named in META-INF/container.xml", () => {
    // 90a: a zip with container.xml pointing at 20a-Compressed-MusicXML.xml (and a PDF beside it)
    const { chart, report } = importScoreFile(suite("90a-Compressed-MusicXML.mxl"));
    expect(chart.title).toBe("Compressed MusicXML file");
    expect(report.melodyNotes).toBeGreaterThan(0);
  });
});

describe("a lead sheet written for these tests", () => {
  const { chart, report } = importScoreFile(fixture("cinderpath-nocturne.musicxml"));

  it("reads the metadata", () => {
    expect(chart).toMatchObject({ title: "Cinderpath Nocturne", composer: "Ines Varga-Holm", tempo: 96, feel: "slow bolero", meter: { beats: 4, unit: 4 } });
  });

  it("reads an alto part in D minor as concert F minor", () => {
    // E-flat alto is written a major 6th above concert (REFERENCES.md; MusicXML <transpose> -5/-9)
    expect(chart.key).toBe("Fm");
  });

  it("moves every chord to concert pitch, degrees and bass included", () => {
    const bars = [...chart.sections.flatMap((s) => s.bars)].map((b) => b.chords.map((c) => `${c.symbol}@${c.beat}`));
    expect(bars).toEqual([["Fm7@0", "Bb7(b9)@2"], ["Dbmaj7@0"], ["Gm7b5@0", "C7(#9)/E@2"], ["Fm6/9@0"]]);
  });

  it("keeps sections, the repeat and both endings", () => {
    expect(chart.sections.map((s) => s.label)).toEqual(["A", "B"]);
    const a = chart.sections[0]!.bars;
    expect(a.map((b) => [b.repeatStart, b.repeatEnd, b.ending])).toEqual([[true, false, null], [false, true, 1], [false, false, 2]]);
  });

  it("reads the melody in concert pitch with dots and ties", () => {
    // written A4 Bb4. C5 on an alto sounds C4 Db4. Eb4 (a major 6th lower)
    expect(chart.sections[0]!.bars[0]!.melody).toEqual([
      { pitch: "C4", duration: "h", dots: 0, tie: false },
      { pitch: "Db4", duration: "q", dots: 1, tie: false },
      { pitch: "Eb4", duration: "8", dots: 0, tie: false },
    ]);
    expect(chart.sections[0]!.bars[1]!.melody).toEqual([{ pitch: "F4", duration: "w", dots: 0, tie: true }]);
    expect(chart.sections[0]!.bars[2]!.melody?.[1]?.pitch).toBe("B3");
  });

  it("reports what it left out", () => {
    expect(report.skipped.join("\n")).toMatch(/other parts: "Piano"/);
    expect(report.skipped.join("\n")).toMatch(/lyrics \(1\)/);
    expect(report.read.join("\n")).toMatch(/Alto Saxophone/);
  });

  it("brings symbols to house style through the hook, and falls back to the plain chord", () => {
    const normalizeChord = (s: string) => (s.includes("(") ? null : s.replace("maj7", "Δ7"));
    const r = importScoreFile(fixture("cinderpath-nocturne.musicxml"), { normalizeChord });
    const symbols = r.chart.sections.flatMap((s) => s.bars.flatMap((b) => b.chords.map((c) => c.symbol)));
    expect(symbols).toEqual(["Fm7", "Bb7", "DbΔ7", "Gm7b5", "C7/E", "Fm6/9"]);
    expect(r.report.skipped.join("\n")).toMatch(/Bb7\(b9\) read as Bb7/);
  });
});
