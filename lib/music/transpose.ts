// Transposition to a part and to another concert key, with the spelling a player reads.
import { Interval, Note } from "tonal";
import { formatChord, parseChord, type Chord } from "./chord";
import { INSTRUMENTS, concertToWrittenInterval, isInstrumentId, type Instrument, type InstrumentId } from "./instruments";
import { keyFifths, movePitchClass, parseKey, simplestKey, type KeyInfo } from "./keys";

export function instrumentOf(id: string): Instrument {
  if (!isInstrumentId(id)) throw new Error(`Unknown instrument "${id}" (use concert, concert-bass, bb, eb or f)`);
  return INSTRUMENTS[id];
}

/** The key a part reads in, e.g. writtenKey("Eb", "bb") === "F"; minor keys as "Cm". */
export function writtenKeyInfo(concertKey: string, instrumentId: InstrumentId | string): KeyInfo {
  const concert = parseKey(concertKey);
  const ivl = concertToWrittenInterval(instrumentOf(instrumentId).transpose);
  if (ivl === "1P") return concert;
  const tonic = Note.transpose(concert.tonic, ivl);
  const raw: KeyInfo = { tonic, minor: concert.minor, name: tonic + (concert.minor ? "m" : "") };
  return simplestKey(raw, keyFifths(concert) > 0);
}

export function writtenKey(concertKey: string, instrumentId: InstrumentId | string): string {
  return writtenKeyInfo(concertKey, instrumentId).name;
}

/** Move a chord from one key to another, keeping its function and spelling it in the new key. */
export function moveChord(chord: Chord, from: KeyInfo, to: KeyInfo): Chord {
  if (chord.kind === "no-chord") return chord;
  return {
    ...chord,
    root: movePitchClass(chord.root, from.tonic, to),
    bass: chord.bass === null ? null : movePitchClass(chord.bass, from.tonic, to),
  };
}

/** The symbol as the player of `instrumentId` reads it: transposeChord("Bb7sus4", "Eb", "bb") === "C7sus4". */
export function transposeChord(symbol: string, concertKey: string, instrumentId: InstrumentId | string): string {
  const from = parseKey(concertKey);
  return formatChord(moveChord(parseChord(symbol), from, writtenKeyInfo(concertKey, instrumentId)));
}

/** A concert-pitch chord moved to another concert key (a singer's key). */
export function transposeChordToKey(symbol: string, fromKey: string, toKey: string): string {
  return formatChord(moveChord(parseChord(symbol), parseKey(fromKey), parseKey(toKey)));
}

/**
 * A concert-pitch melody note ("Eb5") as written for a part: moved by the part's interval, spelled in the
 * written key, with the part's octave change and melody octave applied. Null (a rest) stays null.
 */
export function writtenPitch(pitch: string | null, concertKey: string, instrumentId: InstrumentId | string): string | null {
  if (pitch === null) return null;
  const inst = instrumentOf(instrumentId);
  const from = parseKey(concertKey);
  const to = writtenKeyInfo(concertKey, instrumentId);
  return movePitch(pitch, from, to, -inst.transpose.chromatic - 12 * inst.transpose.octaveChange + 12 * inst.melodyOctave);
}

/** Move a pitch from one key to another by `semitones` overall, spelled in `to`. */
export function movePitch(pitch: string, from: KeyInfo, to: KeyInfo, semitones: number): string {
  const n = Note.get(pitch);
  if (n.empty || n.oct === undefined) throw new Error(`"${pitch}" is not a pitch like Eb5`);
  const pc = movePitchClass(n.pc, from.tonic, to);
  const targetMidi = n.midi! + semitones;
  // Choose the octave number that lands on the target MIDI note with this spelling.
  const base = Note.get(`${pc}4`).midi!;
  const oct = 4 + Math.round((targetMidi - base) / 12);
  return `${pc}${oct}`;
}

/** Semitones from `fromKey`'s tonic up to `toKey`'s, in -6..+5 (the nearer way), for melody moves. */
export function nearestShift(fromTonic: string, toTonic: string): number {
  const s = Interval.semitones(Interval.distance(fromTonic, toTonic)) ?? 0;
  const m = ((s % 12) + 12) % 12;
  return m > 5 ? m - 12 : m;
}
