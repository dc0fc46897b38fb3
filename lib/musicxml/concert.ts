// How a written part maps to concert pitch, measure by measure: each measure carries the <transpose>
// and key in force at its start, so a part that changes instrument midway is followed (test-suite 72c).
import type { Harmony } from "./kinds";
import {
  fifthsOfKey, keyFromFifths, letterDistance, pitchClass, shift, shiftPitch, simplify, simplifyPitch, transposeKey,
  type KeyName, type Pitch, type Transposition,
} from "./pitch";
import type { RawMeasure } from "./read-part";

export interface ConcertMapping {
  t: Transposition;
  written: KeyName;
  concert: KeyName;
  plain: boolean;
  root: (p: Harmony["root"]) => Harmony["root"];
  pitch: (p: Pitch) => Pitch;
}

function mapping(m: RawMeasure | undefined, hint: KeyName | null): ConcertMapping {
  const t: Transposition = m?.transpose ?? { diatonic: 0, chromatic: 0, octaveChange: 0 };
  const written: KeyName = keyFromFifths(m?.fifths ?? 0, m?.minor ?? false);
  const plain = t.diatonic === 0 && t.chromatic === 0;
  const moved = plain ? written : transposeKey(written, t.diatonic, t.chromatic);
  // an enharmonic tie (F# or Gb) is settled by the concert key the file names, when it is the same key
  const concert = hint && hint.minor === moved.minor && pitchClass(hint.tonic) === pitchClass(moved.tonic) ? hint : moved;
  const expected = shift(written.tonic, t.diatonic, t.chromatic);
  const adj = ((letterDistance(expected, concert.tonic) + 3) % 7) - 3;
  const oct = t.octaveChange ?? 0;
  return {
    t, written, concert, plain,
    root: (p) => (p ? simplify(plain ? p : shift(p, t.diatonic + adj, t.chromatic), fifthsOfKey(concert) < 0) : p),
    pitch: (p) => {
      if (plain && oct === 0) return p;
      return simplifyPitch(shiftPitch(p, t.diatonic + adj + 7 * oct, t.chromatic + 12 * oct), fifthsOfKey(concert) < 0);
    },
  };
}

/** One mapping per distinct key and transposition, shared by the measures that use it. */
export function concertMappings(hint: KeyName | null = null): (m: RawMeasure | undefined) => ConcertMapping {
  const cache = new Map<string, ConcertMapping>();
  return (m) => {
    const t = m?.transpose;
    const id = `${m?.fifths ?? 0}/${m?.minor ?? false}/${t?.diatonic ?? 0}/${t?.chromatic ?? 0}/${t?.octaveChange ?? 0}`;
    let out = cache.get(id);
    if (!out) cache.set(id, (out = mapping(m, hint)));
    return out;
  };
}

export function sameTransposition(a: Transposition | null, b: Transposition | null): boolean {
  return (a?.diatonic ?? 0) === (b?.diatonic ?? 0) && (a?.chromatic ?? 0) === (b?.chromatic ?? 0) && (a?.octaveChange ?? 0) === (b?.octaveChange ?? 0);
}
