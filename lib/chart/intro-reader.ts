// How an intro's advice names what it talks about. The advice is worked out in concert pitch; a
// player reads it in their own part, so the chart page passes a reader that moves each chord, note
// and key into the part's key and spelling. Nothing is said in concert unless labelled as such.
export interface IntroReader {
  chord: (concertSymbol: string) => string;
  note: (concertPitchClass: string) => string;
  key: (concertKey: string) => string;
}

/** b → ♭ and # → ♯ where they are accidentals (after a note letter or before a degree). */
export function prettyMusic(s: string): string {
  return s.replace(/([A-G])b/g, "$1♭").replace(/([A-G])#/g, "$1♯").replace(/b(?=\d)/g, "♭").replace(/#(?=\d)/g, "♯");
}

export const CONCERT_READER: IntroReader = { chord: prettyMusic, note: prettyMusic, key: prettyMusic };
