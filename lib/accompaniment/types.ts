// The accompaniment's data: what the generator is asked for and the timed events it gives back.
// Times are in seconds from the first click of the count-in; pitches are MIDI numbers, concert pitch.
import type { ChordSlot, Meter, PerformanceBar } from "@/lib/chart/model";
import type { EndingChoice } from "@/lib/setlist/model";

/** How the rhythm section plays: walking in four, a ballad in two, a latin groove or straight eighths. */
export type Feel = "swing" | "ballad" | "latin" | "straight";

export type Part = "piano" | "bass" | "drums" | "count";
export const MUTABLE_PARTS = ["piano", "bass", "drums"] as const;
export type MutablePart = (typeof MUTABLE_PARTS)[number];

export type DrumVoice = "ride" | "hat" | "kick" | "snare" | "stick" | "brush" | "crash";

export interface NoteEvent {
  kind: "note";
  part: "piano" | "bass";
  time: number;
  duration: number;
  /** MIDI note number (60 = middle C), concert pitch. */
  midi: number;
  /** 0–1. */
  velocity: number;
}

export interface HitEvent {
  kind: "hit";
  part: "drums" | "count";
  time: number;
  duration: number;
  drum: DrumVoice;
  velocity: number;
}

export type PlayEvent = NoteEvent | HitEvent;

/** One bar as the band plays it: repeats taken, endings chosen, `%` filled in, tag bars added. */
export interface PlayedBar {
  /** 1-based, in playing order, intro bars first. */
  number: number;
  /** Index of the performance bar it comes from (where it is drawn). */
  index: number;
  part: "intro" | "form" | "tag";
  /** The section this bar is played in ("Intro", "A", "B"…). */
  section: string;
  /** Chords with `%` and empty bars resolved to what sounds. */
  chords: ChordSlot[];
}

/** A played bar placed in time. */
export interface TimedBar extends PlayedBar {
  /** Seconds from the count-in's first click. */
  start: number;
  /** Seconds one beat lasts in this bar (longer in a ritardando). */
  beatSeconds: number;
  beats: number;
}

export interface AccompanimentRequest {
  /** The arrangement's performance bars at concert pitch (instrument "concert"). */
  bars: PerformanceBar[];
  meter: Meter;
  /** Beats a minute, the meter's beat (a quarter in 4/4 and 3/4). */
  tempo: number;
  /** The chart's feel text ("medium swing", "bossa", "ballad"…) or a Feel. */
  feel: string;
  /** The concert key, for the final chord. */
  key: string;
  ending?: EndingChoice | null;
  /** Play only these played bars (1-based, inclusive): a loop or the intro alone. */
  range?: { from: number; to: number } | null;
  /** The range is looped: its last bar leads back into its first instead of ending. */
  loop?: boolean;
  /** Two bars of clicks before the first bar (default true). */
  countIn?: boolean;
}

export interface Accompaniment {
  feel: Feel;
  tempo: number;
  /** Long–short ratio of swung eighths (1 = even). */
  swingRatio: number;
  /** Seconds the count-in takes (0 without one). */
  countInSeconds: number;
  bars: TimedBar[];
  events: PlayEvent[];
  /** Seconds from the first click to the end of the last sound. */
  duration: number;
  /** Where the played bars end (the loop's end when looping). */
  barsEnd: number;
}
