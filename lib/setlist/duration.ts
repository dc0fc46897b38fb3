// How long a tune and a set run: bars as played × beats per bar × 60 / tempo. Pure.
// A tune is played as: intro, head in, each soloist's choruses over the form, head out, ending.
// With no solo order the head is played once (a ballad or a feature straight through).
import { playingOrder } from "@/lib/chart/as-played";
import { generateIntro } from "@/lib/chart/intro";
import type { Bar, Chart, IntroChoice } from "@/lib/chart/model";
import type { EndingChoice, SetlistEntry } from "./model";

/** How many bars are played going through `bars` once, repeats and endings taken (see `playingOrder`). */
export function barsPlayedCount(bars: readonly Bar[]): number {
  return playingOrder(bars).length;
}

/** The form once through as played (the chart's sections, not its composed intro). */
export function formBarsAsPlayed(chart: Chart): number {
  return barsPlayedCount(chart.sections.flatMap((s) => s.bars));
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
  if (!intro) return chart.intro ? barsPlayedCount(chart.intro.bars) : 0;
  try {
    return barsPlayedCount(generateIntro(chart, intro).bars);
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
