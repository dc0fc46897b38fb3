// The parts a chart can be read in. `transpose` has MusicXML 4.0 <transpose> meaning: what is added to
// a written pitch to give the sounding pitch (written → sounding).

export const INSTRUMENT_IDS = ["concert", "concert-bass", "bb", "eb", "f"] as const;
export type InstrumentId = (typeof INSTRUMENT_IDS)[number];

export interface Transpose {
  diatonic: number;
  chromatic: number;
  octaveChange: number;
}

export interface Instrument {
  id: InstrumentId;
  /** The words in the corner of a page: "B♭ part". */
  label: string;
  /** In a sentence or a tight space: "B♭", "Bass clef". */
  short: string;
  /** Who reads it, for the pickers. */
  readBy: string;
  clef: "treble" | "bass";
  transpose: Transpose;
  /**
   * Octaves added to the written melody after transposing, so that a lead-sheet melody sits on this
   * part's staff (an E♭ part written a 6th up would sit high above the treble staff).
   */
  melodyOctave: number;
}

export const INSTRUMENTS: Record<InstrumentId, Instrument> = {
  concert: { id: "concert", label: "Concert", short: "Concert", readBy: "piano, guitar, voice, vibes", clef: "treble", transpose: { diatonic: 0, chromatic: 0, octaveChange: 0 }, melodyOctave: 0 },
  "concert-bass": {
    id: "concert-bass",
    label: "Concert, bass clef",
    short: "Bass clef",
    readBy: "bass, trombone",
    clef: "bass",
    transpose: { diatonic: 0, chromatic: 0, octaveChange: 0 },
    melodyOctave: -1,
  },
  bb: { id: "bb", label: "B♭ part", short: "B♭", readBy: "trumpet, tenor sax, clarinet", clef: "treble", transpose: { diatonic: -1, chromatic: -2, octaveChange: 0 }, melodyOctave: 0 },
  eb: { id: "eb", label: "E♭ part", short: "E♭", readBy: "alto and baritone sax", clef: "treble", transpose: { diatonic: -5, chromatic: -9, octaveChange: 0 }, melodyOctave: -1 },
  f: { id: "f", label: "F part", short: "F", readBy: "horn", clef: "treble", transpose: { diatonic: -4, chromatic: -7, octaveChange: 0 }, melodyOctave: 0 },
};

export function isInstrumentId(x: unknown): x is InstrumentId {
  return typeof x === "string" && (INSTRUMENT_IDS as readonly string[]).includes(x);
}

const DEGREE_NAMES: Record<number, string> = { 1: "1", 2: "2", 3: "3", 4: "4", 5: "5", 6: "6", 7: "7" };
const PERFECT = new Set([1, 4, 5]);

/**
 * The interval from concert (sounding) pitch up to written pitch, as a tonal interval name
 * ("2M" for a B♭ part), from the inverse of the <transpose> element; octave changes excluded.
 */
export function concertToWrittenInterval(t: Transpose): string {
  const steps = ((-t.diatonic % 7) + 7) % 7;
  const semis = ((-t.chromatic % 12) + 12) % 12;
  if (steps === 0 && semis === 0) return "1P";
  const num = steps + 1;
  const major: Record<number, number> = { 1: 0, 2: 2, 3: 4, 4: 5, 5: 7, 6: 9, 7: 11 };
  const diff = semis - major[num]!;
  const q = PERFECT.has(num)
    ? { [-1]: "d", 0: "P", 1: "A" }[diff]
    : { [-2]: "d", [-1]: "m", 0: "M", 1: "A" }[diff];
  if (!q) throw new Error(`Unsupported transposition ${JSON.stringify(t)}`);
  return `${DEGREE_NAMES[num]}${q}`;
}
