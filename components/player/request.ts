// From the chart and the player's controls to what the accompaniment generator is asked for.
import { arrange } from "@/lib/chart/perform";
import type { Chart, IntroChoice, PerformanceBar } from "@/lib/chart/model";
import type { EndingChoice } from "@/lib/setlist/model";
import { playedBars, playedSections, type PlayedSection } from "@/lib/accompaniment/as-played";
import type { AccompanimentRequest } from "@/lib/accompaniment/types";

export const TEMPO_MIN_PERCENT = 50;
export const TEMPO_MAX_PERCENT = 150;
/** When neither the set list nor the chart gives a tempo. */
export const DEFAULT_TEMPO = 120;

export interface Tune {
  chart: Chart;
  /** Tonight's concert key; null: the chart's. */
  key?: string | null;
  intro?: IntroChoice | null;
  ending?: EndingChoice | null;
  /** Tonight's tempo from the set list; null: the chart's. */
  tempo?: number | null;
}

export type LoopChoice = { kind: "none" } | { kind: "section"; index: number } | { kind: "bars"; from: number; to: number };

export interface Controls {
  percent: number;
  loop: LoopChoice;
  introOnly: boolean;
  countIn: boolean;
}

export interface TunePlan {
  bars: PerformanceBar[];
  concertKey: string;
  meter: Chart["meter"];
  baseTempo: number;
  /** Played bars in all, and how many of them are the intro. */
  total: number;
  introBars: number;
  sections: PlayedSection[];
}

/** The tune at concert pitch, whatever part the reader reads: the sound is always concert. */
export function planTune(t: Tune): TunePlan {
  const a = arrange(t.chart, { instrument: "concert", key: t.key ?? undefined, intro: t.intro });
  const played = playedBars(a.bars, t.ending);
  return {
    bars: a.bars,
    concertKey: a.concertKey,
    meter: a.meter,
    baseTempo: t.tempo ?? t.chart.tempo ?? DEFAULT_TEMPO,
    total: played.length,
    introBars: played.filter((b) => b.part === "intro").length,
    sections: playedSections(played),
  };
}

export function tempoAt(plan: TunePlan, percent: number): number {
  const p = Math.min(TEMPO_MAX_PERCENT, Math.max(TEMPO_MIN_PERCENT, percent));
  return Math.min(400, Math.max(20, Math.round((plan.baseTempo * p) / 100)));
}

export function rangeOf(plan: TunePlan, c: Controls): { from: number; to: number; loop: boolean } | null {
  if (c.introOnly && plan.introBars > 0) return { from: 1, to: plan.introBars, loop: false };
  if (c.loop.kind === "section") {
    const s = plan.sections[c.loop.index];
    return s ? { from: s.from, to: s.to, loop: true } : null;
  }
  if (c.loop.kind === "bars") {
    const from = Math.max(1, Math.min(plan.total, Math.round(c.loop.from)));
    const to = Math.max(from, Math.min(plan.total, Math.round(c.loop.to)));
    return { from, to, loop: true };
  }
  return null;
}

export function requestFor(t: Tune, plan: TunePlan, c: Controls): AccompanimentRequest {
  const range = rangeOf(plan, c);
  return {
    bars: plan.bars,
    meter: plan.meter,
    tempo: tempoAt(plan, c.percent),
    feel: t.chart.feel,
    key: plan.concertKey,
    ending: t.ending ?? null,
    range: range ? { from: range.from, to: range.to } : null,
    loop: range?.loop ?? false,
    countIn: c.countIn,
  };
}

/** "A (2nd time), bars 13–20". */
export function sectionLabel(s: PlayedSection): string {
  const nth = s.time === 1 ? "" : ` (${s.time}${s.time === 2 ? "nd" : s.time === 3 ? "rd" : "th"} time)`;
  return `${s.label}${nth}, bars ${s.from}–${s.to}`;
}
