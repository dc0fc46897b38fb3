// The bars in the order a band plays them: the intro, then the form with its repeats taken the
// right number of times and each ending on its own pass, `%` bars filled in, then tonight's ending
// (a tag plays the last bars again; a vamp-out repeats them). Pure.
import { playingOrder } from "@/lib/chart/as-played";
import type { ChordSlot, PerformanceBar } from "@/lib/chart/model";
import type { EndingChoice } from "@/lib/setlist/model";
import type { PlayedBar } from "./types";

/** A vamp-out lasts until the leader cues the end; playback cannot wait for a cue, so it goes round this many times. */
export const VAMP_OUT_TIMES = 3;
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
  for (const i of playingOrder(intro)) play(intro[i]!, "intro");
  const formOrder = playingOrder(form);
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
