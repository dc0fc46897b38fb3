// How long a tune and a set run: bars as played × beats per bar × 60 / tempo. Pure.
// A tune is played as: intro, head in, each soloist's choruses over the form, head out, ending.
// With no solo order the head is played once (a ballad or a feature straight through).
import { generateIntro } from "@/lib/chart/intro";
import type { Bar, Chart, IntroChoice } from "@/lib/chart/model";
import type { EndingChoice, SetlistEntry } from "./model";

/**
 * How many bars are played going through `bars` once, repeats taken: `:|` jumps back to the last `|:`
 * (or the start) until its times are used up (2 unless `:|x3`), and an ending bar is played only on
 * its own pass.
 */
export function barsAsPlayed(bars: readonly Bar[]): number {
  let played = 0;
  let start = 0;
  let pass = 1;
  let endingPass = 1;
  let jumped = false;
  let i = 0;
  // Each bar is visited at most 16 times (the most a repeat can be taken); the guard keeps a bad chart finite.
  for (let guard = 0; i < bars.length && guard < bars.length * 17; guard++) {
    const b = bars[i]!;
    if (b.repeatStart && !jumped) {
      start = i;
      pass = 1;
      endingPass = 1;
    }
    jumped = false;
    if (b.ending !== null && b.ending !== undefined && b.ending !== endingPass) {
      i++;
      continue;
    }
    played++;
    if (b.repeatEnd) {
      if (pass < (b.repeatTimes ?? 2)) {
        pass++;
        endingPass = pass;
        i = start;
        jumped = true;
        continue;
      }
      pass = 1;
      start = i + 1;
    }
    i++;
  }
  return played;
}

/** The form once through as played (the chart's sections, not its composed intro). */
export function formBarsAsPlayed(chart: Chart): number {
  return barsAsPlayed(chart.sections.flatMap((s) => s.bars));
}

/** Names in a solo order ("tenor, piano, bass" → 3); "and", "&", "/" and ";" also separate. */
export function soloistCount(soloOrder: string): number {
  return soloOrder
    .split(/,|;|\/|&|\band\b|\bthen\b/i)
    .map((s) => s.trim())
    .filter(Boolean).length;
}

/** Intro bars as played: the chosen intro, else the chart's composed intro, none when the entry goes straight in. */
export function introBarsAsPlayed(chart: Chart, intro: IntroChoice | null, straightIn = false): number {
  if (straightIn) return 0;
  if (!intro) return chart.intro ? barsAsPlayed(chart.intro.bars) : 0;
  try {
    return barsAsPlayed(generateIntro(chart, intro).bars);
  } catch {
    return 0;
  }
}

/** Bars the ending adds after the last chorus: a tag plays its bars again `times` more; the rest add none. */
export function endingExtraBars(ending: EndingChoice | null): number {
  return ending?.kind === "tag" ? ending.bars * ending.times : 0;
}

export interface TuneTiming {
  /** Beats per minute used (the entry's, else the chart's); null when neither gives one. */
  tempo: number | null;
  introBars: number;
  formBars: number;
  /** Times through the form: head in, solos, head out. */
  choruses: number;
  endingBars: number;
  totalBars: number;
  /** null when the tempo is unknown. */
  seconds: number | null;
}

type TimedEntry = Pick<SetlistEntry, "tempo" | "intro" | "ending" | "soloOrder" | "choruses"> & { straightIn?: boolean };

export function tuneTiming(chart: Chart, entry: TimedEntry): TuneTiming {
  const tempo = entry.tempo ?? chart.tempo ?? null;
  const introBars = introBarsAsPlayed(chart, entry.intro, entry.straightIn ?? false);
  const formBars = formBarsAsPlayed(chart);
  const soloists = soloistCount(entry.soloOrder);
  const choruses = soloists === 0 ? 1 : 2 + soloists * Math.max(1, entry.choruses);
  const endingBars = endingExtraBars(entry.ending);
  const totalBars = introBars + formBars * choruses + endingBars;
  const seconds = tempo ? (totalBars * chart.meter.beats * 60) / tempo : null;
  return { tempo, introBars, formBars, choruses, endingBars, totalBars, seconds };
}

export interface SetTiming {
  seconds: number;
  /** Tunes left out of the total because neither the entry nor the chart gives a tempo. */
  untimed: number;
}

export function setTiming(timings: readonly Pick<TuneTiming, "seconds">[]): SetTiming {
  let seconds = 0;
  let untimed = 0;
  for (const t of timings) {
    if (t.seconds === null) untimed++;
    else seconds += t.seconds;
  }
  return { seconds, untimed };
}

/** "4:05" for a tune. */
export function formatTuneLength(seconds: number): string {
  const s = Math.round(seconds);
  return `${Math.floor(s / 60)}:${String(s % 60).padStart(2, "0")}`;
}

/** "Set 1: 47 min of 45" — whole minutes, rounded; without a target, "Set 1: 47 min". */
export function setLengthInWords(setNumber: number, seconds: number, targetMinutes: number | null): string {
  const minutes = Math.round(seconds / 60);
  return `Set ${setNumber}: ${minutes} min${targetMinutes ? ` of ${targetMinutes}` : ""}`;
}
