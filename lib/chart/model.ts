// The chart model shared by server, client, renderer and sync. Written in concert pitch.
// One zod schema per shape; types come from z.infer. Pure: no I/O, no React.
import { z } from "zod";

export const MeterSchema = z.object({
  beats: z.number().int().min(1).max(16),
  unit: z.union([z.literal(2), z.literal(4), z.literal(8)]),
});
export type Meter = z.infer<typeof MeterSchema>;

/** One chord in a bar: starts at `beat` (0-based) and lasts `beats`. `symbol` is house style, concert pitch; "N.C." is no chord. */
export const ChordSlotSchema = z.object({
  symbol: z.string().min(1).max(40),
  beat: z.number().min(0),
  beats: z.number().positive(),
});
export type ChordSlot = z.infer<typeof ChordSlotSchema>;

/** A melody note: scientific pitch ("Eb5") in concert pitch, or null for a rest. */
export const MelodyNoteSchema = z.object({
  pitch: z.string().max(6).nullable(),
  duration: z.enum(["w", "h", "q", "8", "16"]),
  dots: z.number().int().min(0).max(2).default(0),
  tie: z.boolean().default(false), // tied into the next note
});
export type MelodyNote = z.infer<typeof MelodyNoteSchema>;

export const BarSchema = z.object({
  chords: z.array(ChordSlotSchema).max(16),
  /** `%` in the text: play the previous bar again (drawn as the one-bar repeat sign). */
  simile: z.boolean().default(false),
  repeatStart: z.boolean().default(false),
  repeatEnd: z.boolean().default(false),
  /** Total times through a repeat when more than two (`:|x3`). */
  repeatTimes: z.number().int().min(2).max(16).optional(),
  /** 1st/2nd ending this bar belongs to; consecutive bars with the same number form one bracket. */
  ending: z.number().int().min(1).max(8).nullable().default(null),
  /**
   * An ending played on more than one pass (`[1,2` in the text, MusicXML `number="1, 2"`): every pass,
   * ascending, the first being `ending`. Absent when the ending is for one pass only.
   */
  endingPasses: z.array(z.number().int().min(1).max(8)).min(2).max(8).optional(),
  melody: z.array(MelodyNoteSchema).max(64).optional(),
  /**
   * A pickup (anacrusis): the chart's first bar is short and lasts this many beats of the meter
   * instead of a full bar (`pickup: 1 beat` in the text). Only ever on the first bar of the chart.
   */
  pickup: z.number().positive().max(16).optional(),
});
export type Bar = z.infer<typeof BarSchema>;

/** A rehearsal section ("A", "B", "Bridge", "Coda"). */
export const SectionSchema = z.object({
  label: z.string().min(1).max(40),
  bars: z.array(BarSchema).max(512),
});
export type Section = z.infer<typeof SectionSchema>;

export const ChartSchema = z.object({
  title: z.string().min(1).max(200),
  composer: z.string().max(200).default(""),
  /** Concert key: "Eb", "F#", minor as "Cm". */
  key: z.string().min(1).max(4),
  meter: MeterSchema,
  tempo: z.number().int().min(20).max(400).nullable().default(null),
  feel: z.string().max(60).default(""),
  /** The tune's own composed intro, if it has one. */
  intro: SectionSchema.nullable().default(null),
  sections: z.array(SectionSchema).min(1).max(64),
});
export type Chart = z.infer<typeof ChartSchema>;

export const INTRO_KINDS = [
  "dominant-pedal",
  "last-bars",
  "vamp",
  "solo-chorus",
  "turnaround",
  "two-five",
  "composed",
] as const;
export const IntroKindSchema = z.enum(INTRO_KINDS);
export type IntroKind = z.infer<typeof IntroKindSchema>;

/** How a tune starts: the choice stored on a set-list entry or in the chart page's address. */
export const IntroChoiceSchema = z.object({
  kind: IntroKindSchema,
  bars: z.number().int().min(1).max(64).optional(),
  repeats: z.number().int().min(1).max(16).optional(),
  tritoneSub: z.boolean().optional(),
  /** For `turnaround`: which one. */
  variant: z.enum(["I-vi-ii-V", "iii-VI-ii-V"]).optional(),
  /** For `vamp`: the two chords, concert pitch. */
  vamp: z.tuple([z.string().max(40), z.string().max(40)]).optional(),
});
export type IntroChoice = z.infer<typeof IntroChoiceSchema>;

export interface IntroResult {
  kind: IntroKind;
  /** The intro's bars in concert pitch. */
  bars: Bar[];
  /** False when this kind does not suit the tune. */
  fits: boolean;
  /** Plain words for a musician: what the intro is, and when it does not fit, why and what would. */
  advice: string;
  /** Kinds that would fit better, when `fits` is false. */
  suggestions: IntroKind[];
  /** The options this intro was built with, defaults filled in. */
  choice?: IntroChoice;
  /** Section labels inside a long intro (a solo chorus shows the form's sections), parallel to `bars`. */
  labels?: (string | null)[];
  /** For `vamp`: the two chords used, concert pitch. */
  vamp?: [string, string];
  /** For `dominant-pedal`: the pedal note the bass holds, concert pitch class ("Bb"). */
  pedal?: string;
  /** For `vamp` with no count: the marking over its repeat ("till cue"). */
  cue?: "till cue";
  /** For `turnaround`: the progression's numerals in the chart's key ("i–viø–iiø–V"). */
  name?: string;
}

export type Barline = "single" | "double" | "final";

/** One bar as a player reads it: transposed, with its labels and barline marks. */
export interface PerformanceBar {
  index: number;
  /** `tag`: the last bars played again after the form (a set list's tag ending). */
  part: "intro" | "form" | "tag";
  /** Label to show when a section starts on this bar ("Intro", "A", "B"), else null. */
  section: string | null;
  chords: ChordSlot[];
  simile: boolean;
  repeatStart: boolean;
  repeatEnd: boolean;
  repeatTimes?: number;
  ending: number | null;
  endingPasses?: number[];
  /** The barline closing this bar: double at a section's end, final at the end of the chart. */
  barline: Barline;
  melody?: MelodyNote[];
  /** A playing direction written under the bar, in the part's key: "C pedal", "till cue". */
  direction?: string;
  /** A short first bar (pickup): its length in beats of the meter. */
  pickup?: number;
  /** Where this bar sits in the chart (for marks); null for generated intro bars. */
  source: { section: number; bar: number } | null;
}

export interface PerformanceOptions {
  instrument?: string; // instrument id; default "concert"
  key?: string; // concert key to play in (a singer's key); default the chart's key
  intro?: IntroChoice | null;
  /** A tag ending: the form's last `bars` bars (as played the last time) played `times` more times. */
  tag?: TagEnding | null;
}

export interface TagEnding {
  bars: number;
  times: number;
}

export interface Arrangement {
  bars: PerformanceBar[];
  instrument: string;
  concertKey: string;
  writtenKey: string;
  meter: Meter;
  intro: IntroResult | null;
}
