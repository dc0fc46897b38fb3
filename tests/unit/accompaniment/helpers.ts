// Small builders for accompaniment tests: performance bars from chart text, and reading events back.
import { arrange, parseChartText } from "@/lib/chart";
import type { IntroChoice } from "@/lib/chart/model";
import type { Accompaniment, NoteEvent, TimedBar } from "@/lib/accompaniment";

export function chartOf(body: string, meta: Record<string, string> = {}) {
  const head = { title: "Test Tune", key: "C", time: "4/4", tempo: "160", feel: "medium swing", ...meta };
  const text = `${Object.entries(head).map(([k, v]) => `${k}: ${v}`).join("\n")}\n\n${body}\n`;
  return parseChartText(text);
}

export function concertBars(body: string, meta: Record<string, string> = {}, intro?: IntroChoice | null) {
  const chart = chartOf(body, meta);
  const a = arrange(chart, { instrument: "concert", intro });
  return { chart, bars: a.bars, meter: a.meter, key: a.concertKey };
}

export const notesOf = (acc: Accompaniment, part: "piano" | "bass") => acc.events.filter((e): e is NoteEvent => e.kind === "note" && e.part === part);

export const inBar = (bar: TimedBar, t: number) => t >= bar.start - 1e-9 && t < bar.start + bar.beats * bar.beatSeconds - 1e-9;

export const chroma = (midi: number) => ((midi % 12) + 12) % 12;
