// Walking the form of a chart (bars as played, the top, the last time through) and reading its top.
import { analyseChord, formatChord, harmonicFunction, parseChord, parseKey, type ChordTones, type HarmonicFunction } from "@/lib/music";
import { lastEndingPass, playsOnPass, type RepeatMarks } from "./endings";
import type { Bar, Chart, Meter } from "./model";

export function blankBar(): Bar {
  return { chords: [], simile: false, repeatStart: false, repeatEnd: false, ending: null };
}

/** A bar of the given chords sharing the meter's beats; odd shares give the earlier chords the extra beat. */
export function barOf(symbols: string[], meter: Meter): Bar {
  const n = Math.min(symbols.length, meter.beats);
  const base = Math.floor(meter.beats / n);
  let extra = meter.beats - base * n;
  let beat = 0;
  const bar = blankBar();
  for (const symbol of symbols.slice(0, n)) {
    const beats = base + (extra-- > 0 ? 1 : 0);
    bar.chords.push({ symbol, beat, beats });
    beat += beats;
  }
  return bar;
}

/** Copy of a bar for an intro: chords only, with a `%` bar's chords filled in from the bar before. */
export function plainCopy(bar: Bar, previous: Bar | undefined): Bar {
  const source = bar.simile && previous ? previous : bar;
  return { ...blankBar(), chords: source.chords.map((c) => ({ ...c })) };
}

/** All bars of the form with `%` bars resolved to real chords (for analysis, not for display). */
export function resolvedFormBars(chart: Chart): Bar[] {
  const out: Bar[] = [];
  for (const s of chart.sections) for (const b of s.bars) out.push(b.simile && out.length ? { ...b, chords: out[out.length - 1]!.chords } : b);
  return out;
}

/**
 * The bars as played the last time through the form: earlier endings of each repeat are skipped,
 * so the last bars are those that really end the tune. `%` bars resolved.
 */
export function lastPassBars(chart: Chart): Bar[] {
  const out: Bar[] = [];
  for (const s of chart.sections) {
    const keep = lastPassMask(s.bars);
    s.bars.forEach((b, i) => {
      if (!keep[i]) return;
      out.push(b.simile && out.length ? { ...b, chords: out[out.length - 1]!.chords } : b);
    });
  }
  return out;
}

/** For each bar of a section: is it played the last time through (not an earlier ending)? */
export function lastPassMask(bars: readonly Bar[]): boolean[] {
  const maxEnding = new Map<number, number>();
  // Endings belong to the repeat they follow; the highest pass in each group is the last one.
  let group = 0;
  const groups: number[] = [];
  bars.forEach((b, i) => {
    const prev = bars[i - 1];
    if (b.ending === null && prev && prev.ending !== null) group++;
    groups.push(group);
    const last = lastEndingPass(b);
    if (last !== null) maxEnding.set(group, Math.max(maxEnding.get(group) ?? 0, last));
  });
  return bars.map((b, i) => b.ending === null || playsOnPass(b, maxEnding.get(groups[i]!)!));
}

/** The first chord of the form that is not N.C. */
export function firstChord(chart: Chart): ChordTones | null {
  for (const b of resolvedFormBars(chart)) {
    for (const c of b.chords) {
      const parsed = parseChord(c.symbol);
      if (parsed.kind === "chord") return parsed;
    }
  }
  return null;
}

export interface TopAnalysis {
  /** The chord at the top of the form (concert), house style; null when the form has no chords. */
  symbol: string | null;
  /** Its roman numeral in the chart's key, e.g. "Imaj7", "ii7". */
  numeral: string;
  function: HarmonicFunction;
  /** The tune starts on its tonic chord (I or i). */
  startsOnTonic: boolean;
  /** Bar 1 itself is N.C. (the chord above is the first one heard). */
  barOneIsNoChord: boolean;
  description: string;
}

const FUNCTION_WORDS: Record<HarmonicFunction, string> = {
  tonic: "a tonic chord",
  subdominant: "a subdominant (pre-dominant) chord",
  dominant: "a dominant",
  "secondary-dominant": "a secondary dominant",
  chromatic: "a chromatic chord outside the key",
  none: "no chord",
};

export function analyseTop(chart: Chart): TopAnalysis {
  const key = parseKey(chart.key);
  const first = firstChord(chart);
  const barOne = chart.sections[0]?.bars[0]?.chords[0]?.symbol;
  const barOneIsNoChord = barOne !== undefined && parseChord(barOne).kind === "no-chord";
  if (!first) {
    return { symbol: null, numeral: "", function: "none", startsOnTonic: false, barOneIsNoChord, description: "The form has no chords to analyse." };
  }
  const a = analyseChord(first, key)!;
  const fn = harmonicFunction(first, key);
  const startsOnTonic = fn === "tonic" && a.degree === 1 && a.accidental === "";
  const full = chart.sections[0]!.bars.flatMap((b) => b.chords).find((c) => parseChord(c.symbol).kind === "chord")?.symbol ?? formatChord(first);
  const lead = barOneIsNoChord ? `The form opens on N.C.; the first chord is ${full}` : `Bar 1 is ${full}`;
  const description = startsOnTonic
    ? `${lead}, the ${a.numeral} of ${chart.key}: the tune starts on its tonic.`
    : `${lead}, the ${a.numeral} of ${chart.key} (${FUNCTION_WORDS[fn]}): the tune starts away from the tonic.`;
  return { symbol: full, numeral: a.numeral, function: fn, startsOnTonic, barOneIsNoChord, description };
}

/** A run of bars longer than any real chart: stops a malformed repeat from looping forever. */
const MAX_PLAYED = 4096;

/**
 * Where each bar the band plays sits in `bars`, in playing order: repeats taken (`:|x3` three times
 * through), each ending played on its own passes, bars outside an ending every time. A `:|` with no
 * `|:` goes back to the start, or to just after the last repeat that was finished. Linear in the bars
 * played, which a guard keeps finite for a malformed chart.
 */
export function playingOrder(bars: readonly RepeatMarks[]): number[] {
  const out: number[] = [];
  let start = 0;
  let pass = 1;
  let jumped = false;
  let i = 0;
  while (i < bars.length && out.length < MAX_PLAYED) {
    const b = bars[i]!;
    if (!jumped) {
      // A new repeat, or plain bars again after the last ending: the passes count from one.
      const afterEndings = b.ending === null && i > 0 && bars[i - 1]!.ending !== null;
      if (b.repeatStart || afterEndings) {
        start = i;
        pass = 1;
      }
    }
    jumped = false;
    if (!playsOnPass(b, pass)) {
      i++;
      continue;
    }
    out.push(i);
    if (b.repeatEnd) {
      if (pass < (b.repeatTimes ?? 2)) {
        pass++;
        i = start;
        jumped = true;
        continue;
      }
      if (b.ending === null) {
        start = i + 1;
        pass = 1;
      }
    }
    i++;
  }
  return out;
}

/** The bars in the order the band plays them (see `playingOrder`). `%` bars stay as they are. */
export function barsAsPlayed<B extends RepeatMarks>(bars: readonly B[]): B[] {
  return playingOrder(bars).map((i) => bars[i]!);
}

/** The form's bars as played (see `barsAsPlayed`): what "an N-bar form" and a duration count. */
export function formAsPlayed(chart: Chart): Bar[] {
  return barsAsPlayed(chart.sections.flatMap((s) => s.bars));
}

/** Seconds that `bars` take at `tempo` beats a minute in `meter`; null without a tempo. */
export function secondsFor(bars: number, meter: Meter, tempo: number | null): number | null {
  return tempo ? Math.round((bars * meter.beats * 60) / tempo) : null;
}
