// From an arrangement's bars, a tempo and a feel to the timed events a rhythm section plays:
// count-in, piano, bass and drums, the bars in playing order, tonight's ending. Pure and fast
// (a 32-bar chart with its intro in a few milliseconds), so it runs again on every change.
import { Note } from "tonal";
import { parseChord, parseKey, type ChordTones } from "@/lib/music";
import type { EndingChoice } from "@/lib/setlist/model";
import type { Accompaniment, AccompanimentRequest, PlayEvent, PlayedBar, TimedBar } from "./types";
import { feelOf, swingRatio } from "./feel";
import { playedBars } from "./as-played";
import { gridOf, nearestOf } from "./grid";
import { bassLine, BASS_HIGH, BASS_LOW } from "./bass";
import { comping } from "./piano";
import { countIn, drumPart } from "./drums";
import { voiceChord } from "./voicing";

export const COUNT_IN_BARS = 2;
/** A ritardando slows to this share of the tempo by its last bar. */
export const RITARDANDO_END = 0.7;

function timed(bars: PlayedBar[], beats: number, beatSeconds: number, startAt: number, rit: number): TimedBar[] {
  let t = startAt;
  return bars.map((b, i) => {
    const into = i - (bars.length - rit) + 1; // 1..rit over the last bars
    const factor = into > 0 ? 1 - ((1 - RITARDANDO_END) * into) / rit : 1;
    const bar: TimedBar = { ...b, start: t, beatSeconds: beatSeconds / factor, beats };
    t += beats * bar.beatSeconds;
    return bar;
  });
}

function firstChordOf(bars: PlayedBar[]): ChordTones | null {
  for (const b of bars) {
    for (const c of b.chords) {
      const p = parseChord(c.symbol);
      if (p.kind === "chord") return p;
    }
  }
  return null;
}

/** The chord a tune ends on: the key's tonic (a 6/9 in major, m6 in minor; common practice). */
export function finalChordSymbol(key: string): string {
  const k = parseKey(key);
  return k.minor ? `${k.tonic}m6` : `${k.tonic}6/9`;
}

/** The band's last chord on the downbeat after the last bar: held a bar, or short for a cold ending. */
function finalChord(key: string, at: number, beatSeconds: number, beats: number, ending: EndingChoice | null | undefined, previous: number[] | null): PlayEvent[] {
  const symbol = finalChordSymbol(key);
  const cold = ending?.kind === "cold";
  const length = cold ? beatSeconds * 0.5 : beatSeconds * beats;
  const notes = voiceChord(symbol, previous)?.notes ?? [];
  const root = nearestOf(Note.chroma(parseKey(key).tonic), 36, BASS_LOW, BASS_HIGH);
  return [
    ...notes.map((midi): PlayEvent => ({ kind: "note", part: "piano", time: at, duration: length, midi, velocity: 0.6 })),
    { kind: "note", part: "bass", time: at, duration: length, midi: root, velocity: 0.85 },
    { kind: "hit", part: "drums", time: at, duration: length, drum: cold ? "snare" : "crash", velocity: 0.55 },
    { kind: "hit", part: "drums", time: at, duration: 0.1, drum: "kick", velocity: 0.6 },
  ];
}

/** The played bars a request covers, and the chord heard right after them (null at the tune's end). */
function selection(all: PlayedBar[], req: AccompanimentRequest): { bars: PlayedBar[]; after: ChordTones | null; ends: boolean } {
  if (!req.range) return { bars: all, after: null, ends: true };
  const from = Math.max(1, Math.min(req.range.from, all.length));
  const to = Math.max(from, Math.min(req.range.to, all.length));
  const bars = all.slice(from - 1, to);
  if (req.loop) return { bars, after: firstChordOf(bars), ends: false };
  const rest = all.slice(to);
  return { bars, after: firstChordOf(rest), ends: rest.length === 0 };
}

export function generateAccompaniment(req: AccompanimentRequest): Accompaniment {
  const feel = feelOf(req.feel);
  const ratio = feel === "swing" || feel === "ballad" ? swingRatio(req.tempo) : 1;
  const beats = req.meter.beats;
  const beatSeconds = 60 / req.tempo;
  const counting = req.countIn ?? true;
  const countInSeconds = counting ? COUNT_IN_BARS * beats * beatSeconds : 0;
  const { bars: chosen, after, ends } = selection(playedBars(req.bars, req.ending), req);
  const rit = ends && req.ending?.kind === "ritardando" ? Math.min(req.ending.bars, chosen.length) : 0;
  const bars = timed(chosen, beats, beatSeconds, countInSeconds, rit);
  const grid = gridOf(bars);
  const piano = comping(grid, feel, ratio);
  const events: PlayEvent[] = [
    ...(counting ? countIn(beats, beatSeconds) : []),
    ...piano,
    ...bassLine(grid, feel, ends ? parseChord(finalChordSymbol(req.key)) as ChordTones : after),
    ...drumPart(grid, feel, ratio),
  ];
  const last = bars[bars.length - 1];
  const barsEnd = last ? last.start + last.beats * last.beatSeconds : countInSeconds;
  let duration = barsEnd;
  if (ends && last) {
    const lastVoicing = piano.length ? piano.filter((e) => e.time === piano[piano.length - 1]!.time).map((e) => e.midi) : null;
    const tail = finalChord(req.key, barsEnd, last.beatSeconds, beats, req.ending, lastVoicing);
    events.push(...tail);
    duration = Math.max(...tail.map((e) => e.time + e.duration));
  }
  events.sort((a, b) => a.time - b.time);
  return { feel, tempo: req.tempo, swingRatio: ratio, countInSeconds, bars, events, duration, barsEnd };
}
