// Chart model → chart text, in the layout docs/chart-text.md shows: four bars to a line, a melody line
// under any bar line that has melody. parseChartText(serializeChart(c)) gives back c. Comments and the
// author's own line breaks are not part of the model, so they are not kept.
import type { Bar, Chart, ChordSlot, Meter, Section } from "./model";
import { formatMelodyNote } from "./melody";
import { endingPassesOf, sameEnding } from "./endings";

export const BARS_PER_LINE = 4;

const gcd = (a: number, b: number): number => (b < 1e-9 ? a : gcd(b, a % b));

/** Chords of a bar as text: equal shares need no slashes; otherwise one token per beat-unit with `/`. */
function chordText(chords: ChordSlot[], meter: Meter, beats = meter.beats): string {
  if (chords.length === 0) return "N.C.";
  const unit = chords.reduce((g, c) => gcd(g, c.beats), beats);
  const tokens: string[] = [];
  for (const c of chords) {
    tokens.push(c.symbol);
    const extra = Math.round(c.beats / unit) - 1;
    for (let k = 0; k < extra; k++) tokens.push("/");
  }
  return tokens.join(" ");
}

function endingStarts(bars: Bar[], i: number): boolean {
  const bar = bars[i]!;
  const prev = bars[i - 1];
  if (bar.ending === null) return false;
  return !prev || !sameEnding(prev, bar) || prev.repeatEnd || bar.repeatStart;
}

function endingNeedsClose(bars: Bar[], i: number): boolean {
  const bar = bars[i]!;
  const next = bars[i + 1];
  return bar.ending !== null && !bar.repeatEnd && next !== undefined && next.ending === null && !next.repeatStart;
}

function sectionText(section: Section, meter: Meter): string[] {
  const out = [`${section.label}:`];
  const { bars } = section;
  for (let start = 0; start < bars.length; start += BARS_PER_LINE) {
    let line = "";
    const melody: string[] = [];
    let anyMelody = false;
    for (let i = start; i < Math.min(start + BARS_PER_LINE, bars.length); i++) {
      const bar = bars[i]!;
      const prevClosed = i > start && bars[i - 1]!.repeatEnd;
      const opener = bar.repeatStart ? "|: " : prevClosed ? "" : "| ";
      const ending = endingStarts(bars, i) ? `[${endingPassesOf(bar)!.join(",")} ` : "";
      const content = bar.simile ? "%" : chordText(bar.chords, meter, bar.pickup);
      const close = endingNeedsClose(bars, i) ? " ]" : "";
      const repeat = bar.repeatEnd ? ` :|${bar.repeatTimes && bar.repeatTimes > 2 ? `x${bar.repeatTimes}` : ""}` : "";
      line += `${line ? " " : ""}${opener}${ending}${content}${close}${repeat}`;
      melody.push(bar.melody?.length ? bar.melody.map(formatMelodyNote).join(" ") : "");
      if (bar.melody?.length) anyMelody = true;
    }
    if (!bars[Math.min(start + BARS_PER_LINE, bars.length) - 1]!.repeatEnd) line += " |";
    out.push(line.trim());
    if (anyMelody) {
      while (melody[melody.length - 1] === "") melody.pop();
      out.push(`melody: ${melody.map((m) => (m ? `| ${m} ` : "| ")).join("")}|`);
    }
  }
  return out;
}

export function serializeChart(chart: Chart): string {
  const head = [`title: ${chart.title}`];
  if (chart.composer) head.push(`composer: ${chart.composer}`);
  head.push(`key: ${chart.key}`, `time: ${chart.meter.beats}/${chart.meter.unit}`);
  if (chart.tempo !== null) head.push(`tempo: ${chart.tempo}`);
  if (chart.feel) head.push(`feel: ${chart.feel}`);
  const pickup = (chart.intro ?? chart.sections[0])?.bars[0]?.pickup;
  if (pickup) head.push(`pickup: ${pickup} beat${pickup === 1 ? "" : "s"}`);
  const body: string[] = [];
  if (chart.intro) body.push(...sectionText({ ...chart.intro, label: "Intro" }, chart.meter));
  for (const s of chart.sections) body.push(...sectionText(s, chart.meter));
  return `${head.join("\n")}\n\n${body.join("\n")}\n`;
}
