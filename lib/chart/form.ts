// Walking the form of a chart (bars as played, the top, the last time through) and reading its top.
import { analyseChord, formatChord, harmonicFunction, parseChord, parseKey, type ChordTones, type HarmonicFunction } from "@/lib/music";
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
    const maxEnding = new Map<number, number>();
    // Endings belong to the repeat they follow; the highest number in each group is the last pass.
    let group = 0;
    const groups: number[] = [];
    s.bars.forEach((b, i) => {
      const prev = s.bars[i - 1];
      if (b.ending === null && prev && prev.ending !== null) group++;
      groups.push(group);
      if (b.ending !== null) maxEnding.set(group, Math.max(maxEnding.get(group) ?? 0, b.ending));
    });
    s.bars.forEach((b, i) => {
      if (b.ending !== null && b.ending !== maxEnding.get(groups[i]!)) return;
      out.push(b.simile && out.length ? { ...b, chords: out[out.length - 1]!.chords } : b);
    });
  }
  return out;
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

export function analyzeTop(chart: Chart): TopAnalysis {
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
