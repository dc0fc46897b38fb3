// The key a player reads for a tune, in words: the part's own key first, concert only when labelled.
import { concertToWrittenInterval, INSTRUMENTS, isInstrumentId } from "./instruments";
import { writtenKey } from "./transpose";

/** "B♭" from "Bb", "F♯m" from "F#m": the one way a key is shown. */
export function keyInWords(key: string): string {
  return key.replace(/^([A-G])b/, "$1♭").replace(/^([A-G])#/, "$1♯");
}

/** "B♭ major" from "Bb", "F♯ minor" from "F#m". */
export function keyNameInWords(key: string): string {
  const minor = key.endsWith("m");
  return `${keyInWords(minor ? key.slice(0, -1) : key)} ${minor ? "minor" : "major"}`;
}

/** Whether a part reads at concert pitch (concert, concert-bass) or transposes (bb, eb, f). */
function isConcertPart(instrument: string): boolean {
  return !isInstrumentId(instrument) || concertToWrittenInterval(INSTRUMENTS[instrument].transpose) === "1P";
}

/** "F (concert A♭)" for an E♭ part of a tune in concert A♭; "A♭" for a concert part. */
export function partKeyInWords(concertKey: string, instrument: string): string {
  const concert = keyInWords(concertKey);
  if (isConcertPart(instrument)) return concert;
  return `${keyInWords(writtenKey(concertKey, instrument))} (concert ${concert})`;
}
