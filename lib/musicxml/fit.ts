// Makes an imported chart one that chart text can say, bar by bar, and says what changed: chords only
// on whole beats and no more than the bar has beats, a melody that fills its bar exactly, endings that
// close with a repeat. One bar that cannot be kept never costs the rest of the file.
import { parseChartText } from "@/lib/chart/text-parse";
import { serializeChart } from "@/lib/chart/text-serialize";
import { noteQuarters } from "@/lib/chart/melody";
import type { Bar, Chart, ChordSlot, MelodyNote, Section } from "@/lib/chart/model";
import type { Skipped } from "./report";

/** Chords on whole beats, at most one a beat; the ones that do not fit are named. */
function fitChords(bar: Bar, beats: number, number: string, skipped: Skipped): void {
  const byBeat = new Map<number, ChordSlot>();
  // chords already on a beat take it first; one between beats goes to the nearest beat still free
  const onBeatFirst = [...bar.chords].sort((a, b) => Math.abs(a.beat - Math.round(a.beat)) - Math.abs(b.beat - Math.round(b.beat)));
  for (const c of onBeatFirst) {
    const beat = Math.min(beats - 1, Math.round(c.beat));
    const taken = byBeat.get(beat);
    if (taken) {
      skipped.add(`chords between the beats or more than one on a beat, left out (${c.symbol})`, number);
      continue;
    }
    if (Math.abs(beat - c.beat) > 1e-6) skipped.add(`chords moved to the nearest beat (${c.symbol})`, number);
    byBeat.set(beat, { ...c, beat });
  }
  const starts = [...byBeat.keys()].sort((a, b) => a - b);
  let chords = starts.map((b) => byBeat.get(b) as ChordSlot);
  if (chords.length && chords[0]!.beat > 0) {
    skipped.add(`bars whose first chord comes after beat 1: the chord moved to beat 1 (${chords[0]!.symbol})`, number);
    chords[0] = { ...chords[0]!, beat: 0 };
  }
  chords = chords.map((c, i) => ({ ...c, beats: (chords[i + 1]?.beat ?? beats) - c.beat }));
  bar.chords = chords;
}

function restsFor(quarters: number): MelodyNote[] {
  const out: MelodyNote[] = [];
  let left = quarters;
  for (const [d, q] of [["w", 4], ["h", 2], ["q", 1], ["8", 0.5], ["16", 0.25]] as const) {
    while (left >= q - 1e-9) {
      out.push({ pitch: null, duration: d, dots: 0, tie: false });
      left -= q;
    }
  }
  return left > 1e-6 ? [] : out;
}

/** A melody that fills its bar: a short bar gets rests at the end, an overfull one loses its last notes. */
function fitMelody(bar: Bar, quarters: number, number: string, skipped: Skipped): void {
  if (!bar.melody) return;
  const total = bar.melody.reduce((n, x) => n + noteQuarters(x), 0);
  if (Math.abs(total - quarters) < 1e-6) return;
  if (total > quarters) {
    const kept: MelodyNote[] = [];
    let sum = 0;
    for (const n of bar.melody) {
      if (sum + noteQuarters(n) > quarters + 1e-6) break;
      kept.push(n);
      sum += noteQuarters(n);
    }
    skipped.add("overfull measures: the notes past the end of the bar left out", number);
    bar.melody = [...kept, ...restsFor(quarters - sum)];
  } else {
    skipped.add("measures shorter than their time signature: filled with rests", number);
    bar.melody = [...bar.melody, ...restsFor(quarters - total)];
  }
  if (Math.abs(bar.melody.reduce((n, x) => n + noteQuarters(x), 0) - quarters) > 1e-6) {
    skipped.add("melodies chart text cannot hold (tuplets or odd lengths), left out", number);
    delete bar.melody;
  }
}

/** Endings that chart text cannot close (an ending before another without :|) become plain bars. */
function fitEndings(section: Section, numbers: Map<Bar, string>, skipped: Skipped): void {
  try {
    parseChartText(serializeChart({ title: "t", composer: "", key: "C", meter: { beats: 4, unit: 4 }, tempo: null, feel: "", intro: null, sections: [{ ...section, bars: section.bars.map((b) => ({ chords: [{ symbol: "C", beat: 0, beats: 4 }], simile: false, repeatStart: b.repeatStart, repeatEnd: b.repeatEnd, ending: b.ending, ...(b.endingPasses ? { endingPasses: b.endingPasses } : {}), ...(b.repeatTimes ? { repeatTimes: b.repeatTimes } : {}) })) }] }));
  } catch {
    for (const b of section.bars) {
      if (b.ending !== null) skipped.add("endings that do not close with a repeat, read as plain bars", numbers.get(b));
      b.ending = null;
      delete b.endingPasses;
    }
  }
}

export function fitToChartText(chart: Chart, numbers: Map<Bar, string>, skipped: Skipped): void {
  const quarterPerBeat = 4 / chart.meter.unit;
  const sections = [...(chart.intro ? [chart.intro] : []), ...chart.sections];
  for (const s of sections) {
    s.bars.forEach((bar, i) => {
      const number = numbers.get(bar) ?? "?";
      const beats = bar.pickup ?? chart.meter.beats;
      if (!bar.simile) fitChords(bar, Math.max(1, Math.round(beats)), number, skipped);
      if (bar.pickup && !Number.isInteger(bar.pickup)) {
        skipped.add("pickups that are not a whole number of beats, read as whole beats", number);
        bar.pickup = Math.max(1, Math.round(bar.pickup));
      }
      fitMelody(bar, (bar.pickup ?? chart.meter.beats) * quarterPerBeat, number, skipped);
      if (bar.simile && i === 0) {
        skipped.add("one-bar repeat signs at the start of a section, read as a bar without chords", number);
        bar.simile = false;
      }
    });
    fitEndings(s, numbers, skipped);
  }
}
