// Export rules of the MusicXML 4.0 standard (W3C Music Notation Community Group), each test named after
// the rule it checks. Charts here are invented test data.
import { describe, expect, it } from "vitest";
import { parseChartText } from "@/lib/chart";
import { exportMusicXml, importScoreFile, partExportOptions } from "@/lib/musicxml";
import { child, children, numberOf, parseXml, textOf, type XNode } from "@/lib/musicxml/xml";
import { invalid, validateAll } from "./xmllint";

const measures = (xml: string): XNode[] => children(child(parseXml(xml), "part"), "measure");
const encode = (s: string) => new TextEncoder().encode(s);

const SIMILE = parseChartText(`title: Test simile
key: F
A:
| Fmaj7 Dm7 | % | Gm7 | % |
melody: | A4:h F4:h | | G4:w |
`);

describe("measure-repeat: the music being repeated is present in each measure (MusicXML 4.0)", () => {
  const ms = measures(exportMusicXml(SIMILE));

  it("a % bar starts <measure-repeat> and still carries the chords it repeats", () => {
    const m2 = ms[1]!;
    expect(child(child(child(m2, "attributes"), "measure-style"), "measure-repeat")?.attrs.type).toBe("start");
    // a reader that ignores <measure-repeat> still reads Fmaj7 and Dm7 in bar 2
    expect(children(m2, "harmony").map((h) => textOf(child(h, "root"), "root-step"))).toEqual(["F", "D"]);
    expect(children(m2, "note").map((n) => textOf(child(n, "pitch"), "step"))).toEqual(["A", "F"]);
  });

  it("the next plain bar stops it, and the second % carries Gm7", () => {
    expect(child(child(child(ms[2]!, "attributes"), "measure-style"), "measure-repeat")?.attrs.type).toBe("stop");
    expect(textOf(child(children(ms[3]!, "harmony")[0], "root"), "root-step")).toBe("G");
  });

  it("comes back as % bars, not as written-out bars", () => {
    expect(importScoreFile(encode(exportMusicXml(SIMILE))).chart).toEqual(SIMILE);
  });
});

describe("kind none: no chord, with the root's text empty (MusicXML 4.0 kind-value none)", () => {
  const chart = parseChartText(`title: Test stop time\nkey: C\nA:\n| C7 | N.C. |\n`);
  const harmony = child(measures(exportMusicXml(chart))[1]!, "harmony")!;

  it("writes kind none, root-step text=\"\" and the display text N.C.", () => {
    expect(textOf(harmony, "kind")).toBe("none");
    expect(child(harmony, "kind")?.attrs.text).toBe("N.C.");
    expect(child(child(harmony, "root"), "root-step")?.attrs.text).toBe("");
  });

  it("validates and reads back as N.C.", () => {
    const xml = exportMusicXml(chart);
    expect(invalid(validateAll({ "nc.musicxml": xml }))).toEqual({});
    expect(importScoreFile(encode(xml)).chart.sections[0]!.bars[1]!.chords[0]!.symbol).toBe("N.C.");
  });
});

describe("transpose: the written octave is the drawn part's, and <octave-change> keeps the sound (MusicXML 4.0)", () => {
  const chart = parseChartText(`title: Test octave\nkey: C\nA:\n| C |\nmelody: | C5:w |\n`);
  const first = (id: string) => {
    const m1 = measures(exportMusicXml(chart, partExportOptions(id)))[0]!;
    const p = child(child(m1, "note"), "pitch");
    const t = child(child(m1, "attributes"), "transpose");
    return { note: `${textOf(p, "step")}${numberOf(p, "alter") ?? ""}${numberOf(p, "octave")}`, t: t ? [numberOf(t, "diatonic"), numberOf(t, "chromatic"), numberOf(t, "octave-change") ?? 0] : null };
  };

  it("a bass-clef part writes concert C5 as C4, with octave-change +1", () => {
    // the bass-clef part draws the melody an octave down (lib/music INSTRUMENTS melodyOctave -1);
    // written C4 + one octave sounds C5 again
    expect(first("concert-bass")).toEqual({ note: "C4", t: [0, 0, 1] });
  });

  it("an E♭ part writes concert C5 a minor 3rd below (A4), sounding right through -5/-9 and +1 octave", () => {
    // E♭ alto is written a major 6th above concert (REFERENCES.md): C5 → A5; drawn an octave down → A4.
    // A4 + (-9 semitones) + 12 = C5.
    expect(first("eb")).toEqual({ note: "A4", t: [-5, -9, 1] });
  });

  it("a B♭ part is a major 2nd above, no octave change (REFERENCES.md)", () => {
    expect(first("bb")).toEqual({ note: "D5", t: [-1, -2, 0] });
  });

  it("every part reads back to the concert melody", () => {
    for (const id of ["concert", "concert-bass", "bb", "eb", "f"]) {
      expect(importScoreFile(encode(exportMusicXml(chart, partExportOptions(id)))).chart.sections[0]!.bars[0]!.melody).toEqual([{ pitch: "C5", duration: "w", dots: 0, tie: false }]);
    }
  });
});

describe("metronome: beat-unit and beat-unit-dot say the note value that is counted (MusicXML 4.0)", () => {
  const metronome = (text: string) => {
    const xml = exportMusicXml(parseChartText(text));
    const dir = children(measures(xml)[0]!, "direction").find((d) => child(child(d, "direction-type"), "metronome"))!;
    const m = child(child(dir, "direction-type"), "metronome")!;
    return { unit: textOf(m, "beat-unit"), dot: !!child(m, "beat-unit-dot"), perMinute: numberOf(m, "per-minute"), sound: Number(child(dir, "sound")?.attrs.tempo), back: importScoreFile(encode(xml)).chart.tempo };
  };

  it("6/8 at 300 eighths a minute is written 100 to the dotted quarter (150 quarters), and reads back as 300", () => {
    expect(metronome(`title: T\nkey: C\ntime: 6/8\ntempo: 300\nA:\n| C |\n`)).toEqual({ unit: "quarter", dot: true, perMinute: 100, sound: 150, back: 300 });
  });

  it("cut time at 120 is written 120 to the half note (240 quarters)", () => {
    expect(metronome(`title: T\nkey: C\ntime: 2/2\ntempo: 120\nA:\n| C |\n`)).toEqual({ unit: "half", dot: false, perMinute: 120, sound: 240, back: 120 });
  });

  it("4/4 at 160 is 160 to the quarter", () => {
    expect(metronome(`title: T\nkey: C\ntempo: 160\nA:\n| C |\n`)).toEqual({ unit: "quarter", dot: false, perMinute: 160, sound: 160, back: 160 });
  });

  it("a dotted-quarter mark in 4/4 is read as that many dotted quarters, not quarters", () => {
    const xml = exportMusicXml(parseChartText(`title: T\nkey: C\ntime: 12/8\ntempo: 300\nA:\n| C |\n`)).replace("<time><beats>12</beats><beat-type>8</beat-type>", "<time><beats>4</beats><beat-type>4</beat-type>");
    // 100 dotted quarters a minute = 150 quarters (a dotted quarter is 1.5 quarters)
    expect(importScoreFile(encode(xml)).chart.tempo).toBe(150);
  });
});

describe("pickup: an implicit measure 0 (MusicXML 4.0 measure@implicit)", () => {
  const chart = parseChartText(`title: Test pickup\nkey: F\npickup: 1 beat\nA:\n| C7 | Fmaj7 |\nmelody: | C5:q | A4:w |\n`);
  const ms = measures(exportMusicXml(chart, partExportOptions("bb")));

  it("is written as measure 0, implicit, one beat long", () => {
    expect(ms[0]!.attrs).toMatchObject({ number: "0", implicit: "yes" });
    expect(numberOf(child(ms[0]!, "note"), "duration")).toBe(48);
    expect(ms[1]!.attrs.number).toBe("1");
  });

  it("validates and stays a pickup through every part", () => {
    const docs = Object.fromEntries(["concert", "concert-bass", "bb", "eb", "f"].map((id) => [`${id}.musicxml`, exportMusicXml(chart, partExportOptions(id))]));
    expect(invalid(validateAll(docs))).toEqual({});
    for (const xml of Object.values(docs)) expect(importScoreFile(encode(xml)).chart).toEqual(chart);
  });
});
