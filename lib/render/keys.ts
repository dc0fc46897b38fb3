// Sharps or flats in a key signature, for the width of a line's opening. Major keys by circle of fifths
// (MusicXML <fifths>); a minor key shares its relative major's signature.
const MAJOR_FIFTHS: Record<string, number> = {
  Cb: -7, Gb: -6, Db: -5, Ab: -4, Eb: -3, Bb: -2, F: -1, C: 0,
  G: 1, D: 2, A: 3, E: 4, B: 5, "F#": 6, "C#": 7,
};
const MINOR_FIFTHS: Record<string, number> = {
  Ab: -7, Eb: -6, Bb: -5, F: -4, C: -3, G: -2, D: -1, A: 0,
  E: 1, B: 2, "F#": 3, "C#": 4, "G#": 5, "D#": 6, "A#": 7,
};

/** Signed fifths of a key written "Eb", "F#", "Cm"; null when the name is not a key. */
export function keyFifths(key: string): number | null {
  const k = key.trim().replace("♭", "b").replace("♯", "#");
  const minor = /m(in)?$/.test(k) && !/maj$/.test(k);
  const tonic = minor ? k.replace(/m(in)?$/, "") : k;
  const v = (minor ? MINOR_FIFTHS : MAJOR_FIFTHS)[tonic];
  return v ?? null;
}

export function keyAccidentalCount(key: string): number {
  return Math.abs(keyFifths(key) ?? 0);
}
