// The bars in the order a band plays them: the intro, then the form with its repeats taken the
// right number of times and each ending on its own pass, `%` bars filled in, then tonight's ending
// (a tag plays the last bars again; a vamp-out repeats them). Pure.
import type { ChordSlot, PerformanceBar } from "@/lib/chart/model";
import type { EndingChoice } from "@/lib/setlist/model";
import type { PlayedBar } from "./types";

/** A vamp-out lasts until the leader cues the end; playback cannot wait for a cue, so it goes round this many times. */
export const VAMP_OUT_TIMES = 3;
const MAX_PLAYED = 4096;

/** Indices of `bars` in playing order, repeats and endings taken. */
function unrollIndices(bars: PerformanceBar[]): number[] {
  const out: number[] = [];
  let start = 0;
  let pass = 1;
  let finished = false; // a repeat just completed: the next bar outside any ending starts afresh
  for (let i = 0; i < bars.length && out.length < MAX_PLAYED; i++) {
    const b = bars[i]!;
    if (b.repeatStart && (i !== start || finished)) {
      start = i;
      pass = 1;
      finished = false;
    } else if (finished && b.ending === null) {
      start = i;
      pass = 1;
      finished = false;
    }
    if (b.ending !== null && b.ending !== pass) continue; // not this pass's ending
    out.push(i);
    if (b.repeatEnd) {
      const times = b.repeatTimes ?? 2;
      if (pass < times) {
        pass++;
        i = start - 1;
      } else {
        finished = true;
      }
    }
  }
  return out;
}

function sectionName(label: string | null, part: PerformanceBar["part"]): string | null {
  if (label === null) return null;
  return part === "intro" ? "Intro" : label;
}

/** The intro and the form as played, with the ending; numbers 1-based. */
export function playedBars(bars: PerformanceBar[], ending?: EndingChoice | null): PlayedBar[] {
  const intro = bars.filter((b) => b.part === "intro");
  const form = bars.filter((b) => b.part === "form");
  const out: PlayedBar[] = [];
  let chords: ChordSlot[] = [];
  let section = "Intro";
  const play = (b: PerformanceBar, part: PlayedBar["part"]) => {
    // `%` and a bar with no chords both keep the harmony sounding.
    if (!b.simile && b.chords.length > 0) chords = b.chords;
    section = sectionName(b.section, b.part) ?? (b.part === "form" && out.length === 0 ? "A" : section);
    out.push({ number: out.length + 1, index: b.index, part, section: part === "tag" ? "Ending" : section, chords: chords.map((c) => ({ ...c })) });
  };
  for (const i of unrollIndices(intro)) play(intro[i]!, "intro");
  const formOrder = unrollIndices(form);
  for (const i of formOrder) play(form[i]!, "form");
  const extra = endingBars(ending);
  if (extra && formOrder.length > 0) {
    const tail = formOrder.slice(-Math.min(extra.bars, formOrder.length));
    for (let t = 0; t < extra.times; t++) for (const i of tail) play(form[i]!, "tag");
  }
  return out;
}

function endingBars(ending?: EndingChoice | null): { bars: number; times: number } | null {
  if (!ending) return null;
  if (ending.kind === "tag") return { bars: ending.bars, times: ending.times };
  if (ending.kind === "vamp-out") return { bars: ending.bars, times: VAMP_OUT_TIMES };
  return null;
}

export interface PlayedSection {
  label: string;
  /** Which time this section comes round (1 for the first A, 2 for the second…). */
  time: number;
  from: number;
  to: number;
}

/** Runs of played bars in one section, for choosing a loop ("A, 2nd time: bars 13–20"). */
export function playedSections(played: PlayedBar[]): PlayedSection[] {
  const out: PlayedSection[] = [];
  const seen = new Map<string, number>();
  played.forEach((b, i) => {
    const prev = played[i - 1];
    const restart = prev !== undefined && b.index < prev.index && b.part === prev.part; // a repeat went back
    const last = out[out.length - 1];
    if (!last || last.label !== b.section || restart) {
      const time = (seen.get(b.section) ?? 0) + 1;
      seen.set(b.section, time);
      out.push({ label: b.section, time, from: b.number, to: b.number });
    } else {
      last.to = b.number;
    }
  });
  return out;
}
