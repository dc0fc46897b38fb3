// The generator's timing, form, bass line and drums, each rule checked against where it comes from.
import { describe, expect, it } from "vitest";
import { Note } from "tonal";
import { chordPitchClasses, parseChord } from "@/lib/music";
import { backBeats, BASS_HIGH, BASS_LOW, COUNT_IN_BARS, generateAccompaniment, playedBars, swingRatio, VAMP_OUT_TIMES, type HitEvent } from "@/lib/accompaniment";
import { chroma, concertBars, inBar, notesOf } from "./helpers";

const LANTERN = `A:\n|: Ebmaj7 | Cm7 | Fm7 | Bb7 |\n| Gm7 C7 | Fm7 Bb7 | [1 Ebmaj7 | Fm7 Bb7 :| [2 Ebmaj7 | % |`;

describe("event times: bars × beats at the tempo, the count-in first (arithmetic)", () => {
  it("starts bar n at count-in + (n−1) × beats × 60/tempo, and the count-in takes two bars", () => {
    const t = concertBars(LANTERN);
    const acc = generateAccompaniment({ ...t, tempo: 150, feel: "medium swing" });
    const beat = 60 / 150;
    expect(acc.countInSeconds).toBeCloseTo(COUNT_IN_BARS * 4 * beat, 9);
    acc.bars.forEach((b, i) => expect(b.start).toBeCloseTo(acc.countInSeconds + i * 4 * beat, 9));
    // Nothing but the count sounds before the first bar.
    const early = acc.events.filter((e) => e.time < acc.countInSeconds - 1e-9);
    expect(early.length).toBeGreaterThan(0);
    expect(early.every((e) => e.part === "count")).toBe(true);
    expect(acc.events.filter((e) => e.part === "count").every((e) => e.time < acc.countInSeconds)).toBe(true);
  });

  it("counts the leader's way: one … two … one two three four", () => {
    const t = concertBars(LANTERN);
    const acc = generateAccompaniment({ ...t, tempo: 120, feel: "swing" });
    const clicks = acc.events.filter((e) => e.part === "count").map((e) => e.time / 0.5);
    expect(clicks.map((c) => Math.round(c * 1000) / 1000)).toEqual([0, 2, 4, 5, 6, 7]);
  });

  it("plays no count-in when asked not to", () => {
    const t = concertBars(LANTERN);
    const acc = generateAccompaniment({ ...t, tempo: 120, feel: "swing", countIn: false });
    expect(acc.countInSeconds).toBe(0);
    expect(acc.bars[0]!.start).toBe(0);
    expect(acc.events.some((e) => e.part === "count")).toBe(false);
  });

  it("slows a ritardando over its last bars only", () => {
    const t = concertBars(LANTERN);
    const acc = generateAccompaniment({ ...t, tempo: 120, feel: "swing", ending: { kind: "ritardando", bars: 2 } });
    const n = acc.bars.length;
    expect(acc.bars[n - 3]!.beatSeconds).toBeCloseTo(0.5, 9);
    expect(acc.bars[n - 2]!.beatSeconds).toBeGreaterThan(0.5);
    expect(acc.bars[n - 1]!.beatSeconds).toBeGreaterThan(acc.bars[n - 2]!.beatSeconds);
  });
});

describe("repeats, endings and tonight's ending played the right number of times (chart text: docs/chart-text.md)", () => {
  it("takes the repeat once, the 1st ending then the 2nd, and fills % with the bar before", () => {
    const { bars } = concertBars(LANTERN);
    const played = playedBars(bars);
    // 6 bars + 1st ending (2) + 6 bars again + 2nd ending (2) = 16.
    expect(played.map((b) => b.chords.map((c) => c.symbol).join(" "))).toEqual([
      "Ebmaj7", "Cm7", "Fm7", "Bb7", "Gm7 C7", "Fm7 Bb7", "Ebmaj7", "Fm7 Bb7",
      "Ebmaj7", "Cm7", "Fm7", "Bb7", "Gm7 C7", "Fm7 Bb7", "Ebmaj7", "Ebmaj7",
    ]);
    expect(played.map((b) => b.number)).toEqual(Array.from({ length: 16 }, (_, i) => i + 1));
  });

  it("plays a repeat marked :|x3 three times", () => {
    const { bars } = concertBars(`A:\n|: C | F :|x3\nB:\n| G7 | C |`);
    expect(playedBars(bars).map((b) => b.chords[0]!.symbol)).toEqual(["C", "F", "C", "F", "C", "F", "G7", "C"]);
  });

  it("plays the intro first and numbers it from 1", () => {
    const { bars } = concertBars(`Intro:\n| Dm7 | G7 |\nA:\n| Cmaj7 | % |`);
    const played = playedBars(bars);
    expect(played.map((b) => [b.number, b.part])).toEqual([[1, "intro"], [2, "intro"], [3, "form"], [4, "form"]]);
  });

  it("tags the last 2 bars 3 more times", () => {
    const { bars } = concertBars(`A:\n| C | Am7 | Dm7 | G7 |`);
    const played = playedBars(bars, { kind: "tag", bars: 2, times: 3 });
    expect(played.map((b) => b.chords[0]!.symbol)).toEqual(["C", "Am7", "Dm7", "G7", "Dm7", "G7", "Dm7", "G7", "Dm7", "G7"]);
    expect(played.filter((b) => b.part === "tag")).toHaveLength(6);
  });

  it(`vamps out on the last bars ${VAMP_OUT_TIMES} more times`, () => {
    const { bars } = concertBars(`A:\n| C | Am7 | Dm7 | G7 |`);
    expect(playedBars(bars, { kind: "vamp-out", bars: 2 }).filter((b) => b.part === "tag")).toHaveLength(2 * VAMP_OUT_TIMES);
  });

  it("plays only the asked range, and a loop leads back to its first chord", () => {
    const t = concertBars(`A:\n| Cmaj7 | A7 | Dm7 | G7 |`);
    const acc = generateAccompaniment({ ...t, tempo: 120, feel: "swing", range: { from: 3, to: 4 }, loop: true, countIn: false });
    expect(acc.bars.map((b) => b.number)).toEqual([3, 4]);
    const bass = notesOf(acc, "bass");
    const last = bass[bass.length - 1]!;
    // The loop's first chord is Dm7: the last note leads into D by a step or half step (common practice).
    const d = bass[0]!.midi;
    expect(chroma(d)).toBe(Note.chroma("D"));
    expect(Math.abs(last.midi - d)).toBeLessThanOrEqual(2);
    expect(acc.duration).toBeCloseTo(acc.barsEnd, 9); // no final chord inside a loop
  });
});

describe("walking bass (common practice)", () => {
  const t = concertBars(`A:\n| Dm7 | G7 | Cmaj7 | A7(b9) |\n| Dm7 G7 | Em7 A7 | Dm7 | G7 |\n| C/E | Ebdim7 | Dm7 | G7sus4 |`);
  const acc = generateAccompaniment({ ...t, tempo: 160, feel: "medium swing" });
  const bass = notesOf(acc, "bass").filter((e) => e.time < acc.barsEnd);
  const onBeat = (bar: (typeof acc.bars)[number], beat: number) => bass.find((e) => Math.abs(e.time - (bar.start + beat * bar.beatSeconds)) < 1e-6);

  it("plays quarter notes: one note on every beat of every bar", () => {
    for (const bar of acc.bars) for (let k = 0; k < 4; k++) expect(onBeat(bar, k)).toBeDefined();
    expect(bass).toHaveLength(acc.bars.length * 4);
  });

  it("puts a chord tone on every downbeat, and the root (or the slash bass) on each chord's first beat", () => {
    for (const bar of acc.bars) {
      for (const slot of bar.chords) {
        const first = onBeat(bar, Math.ceil(slot.beat))!;
        const c = parseChord(slot.symbol);
        if (c.kind !== "chord") continue;
        expect(chroma(first.midi)).toBe(Note.chroma(c.bass ?? c.root));
      }
      const down = onBeat(bar, 0)!;
      expect(chordPitchClasses(bar.chords[0]!.symbol).map((p) => Note.chroma(p))).toContain(chroma(down.midi));
    }
  });

  it("leads the last note of each chord into the next root by a step or half step", () => {
    const firsts = acc.bars.flatMap((bar) => bar.chords.map((slot) => ({ bar, beat: Math.ceil(slot.beat) })));
    for (let i = 1; i < firsts.length; i++) {
      const target = onBeat(firsts[i]!.bar, firsts[i]!.beat)!;
      const before = bass[bass.indexOf(target) - 1]!;
      expect(Math.abs(target.midi - before.midi)).toBeGreaterThanOrEqual(1);
      expect(Math.abs(target.midi - before.midi)).toBeLessThanOrEqual(2);
    }
  });

  it("stays in the bass's register (E1–G3)", () => {
    expect(BASS_LOW).toBe(Note.midi("E1"));
    expect(BASS_HIGH).toBe(Note.midi("G3"));
    for (const n of bass) expect(n.midi >= BASS_LOW && n.midi <= BASS_HIGH).toBe(true);
  });

  it("plays a ballad in two (half notes) and a bossa root–fifth", () => {
    const ballad = generateAccompaniment({ ...t, tempo: 60, feel: "ballad" });
    const first = ballad.bars[0]!;
    const inFirst = notesOf(ballad, "bass").filter((e) => inBar(first, e.time));
    expect(inFirst.map((e) => (e.time - first.start) / first.beatSeconds)).toEqual([0, 2]);
    const bossa = generateAccompaniment({ ...t, tempo: 132, feel: "bossa" });
    const b0 = bossa.bars[0]!;
    const notes = notesOf(bossa, "bass").filter((e) => inBar(b0, e.time));
    // Dm7: D on 1, A (the 5th) on 3.
    expect(notes.map((e) => chroma(e.midi))).toEqual([Note.chroma("D"), Note.chroma("A")]);
  });
});

describe("drums and swing (common practice; Friberg & Sundström 2002)", () => {
  it("falls from about 3:1 when slow to about 2:1 at medium tempo to nearly even when fast", () => {
    // A. Friberg & A. Sundström, "Swing ratios and ensemble timing in jazz performance", Music
    // Perception 19(3), 2002 (from memory): the ratio falls roughly linearly with tempo.
    expect(swingRatio(60)).toBeGreaterThanOrEqual(2.8);
    expect(swingRatio(160)).toBeGreaterThan(1.8);
    expect(swingRatio(160)).toBeLessThan(2.3);
    expect(swingRatio(320)).toBeLessThanOrEqual(1.15);
    for (let bpm = 40; bpm < 360; bpm += 10) expect(swingRatio(bpm + 10)).toBeLessThanOrEqual(swingRatio(bpm));
  });

  it("swings the ride's off-beat eighth at the tempo's ratio, and closes the hi-hat on 2 and 4", () => {
    const t = concertBars(`A:\n| Cmaj7 | % |`);
    const acc = generateAccompaniment({ ...t, tempo: 160, feel: "swing", countIn: false });
    const beat = 60 / 160;
    const ride = acc.events.filter((e): e is HitEvent => e.kind === "hit" && e.drum === "ride" && e.time < 4 * beat - 1e-9);
    const offbeat = ride.find((e) => e.time > beat + 1e-6 && e.time < 2 * beat - 1e-6)!;
    const r = swingRatio(160);
    expect(offbeat.time).toBeCloseTo(beat + (beat * r) / (1 + r), 9);
    const hats = acc.events.filter((e): e is HitEvent => e.kind === "hit" && e.drum === "hat" && e.time < 4 * beat - 1e-9);
    expect(hats.map((e) => Math.round(e.time / beat))).toEqual([1, 3]);
    expect(backBeats(4)).toEqual([1, 3]);
  });

  it("plays brushes for a ballad and straight eighths on the hi-hat for a bossa", () => {
    const t = concertBars(`A:\n| Cmaj7 | % |`);
    const ballad = generateAccompaniment({ ...t, tempo: 60, feel: "ballad", countIn: false });
    expect(ballad.events.some((e) => e.kind === "hit" && e.drum === "brush")).toBe(true);
    expect(ballad.events.some((e) => e.kind === "hit" && e.drum === "ride")).toBe(false);
    const bossa = generateAccompaniment({ ...t, tempo: 120, feel: "bossa", countIn: false });
    expect(bossa.swingRatio).toBe(1);
    const hats = bossa.events.filter((e) => e.kind === "hit" && e.drum === "hat" && e.time < 2 - 1e-9);
    expect(hats.map((e) => e.time)).toEqual([0, 0.25, 0.5, 0.75, 1, 1.25, 1.5, 1.75]);
  });
});

describe("piano comping in time", () => {
  it("plays shells in a crowded bar and rootless voicings otherwise", () => {
    const t = concertBars(`A:\n| Dm7 | C Am7 Dm7 G7 |`);
    const acc = generateAccompaniment({ ...t, tempo: 120, feel: "swing", countIn: false, range: { from: 1, to: 2 } });
    const piano = notesOf(acc, "piano");
    const firstHit = piano.filter((e) => e.time === 0).map((e) => chroma(e.midi));
    expect(firstHit).not.toContain(Note.chroma("D")); // rootless
    const crowded = piano.filter((e) => e.time === acc.bars[1]!.start + 3 * 0.5).map((e) => chroma(e.midi));
    expect(crowded).toContain(Note.chroma("G")); // the G7 shell has its root
    expect(crowded).toHaveLength(3);
  });

  it("ends the tune on the key's tonic chord after the last bar", () => {
    const t = concertBars(LANTERN, { key: "Eb" });
    const acc = generateAccompaniment({ ...t, tempo: 150, feel: "swing" });
    const last = acc.events.filter((e) => e.time >= acc.barsEnd - 1e-9 && e.kind === "note" && e.part === "bass");
    expect(last.map((e) => (e.kind === "note" ? chroma(e.midi) : -1))).toEqual([Note.chroma("Eb")]);
  });
});
