// The words in the corner of every page that say whose part this is, and the part's clef.
import { INSTRUMENTS, isInstrumentId } from "@/lib/music/instruments";

export function partLabel(instrument: string): string {
  return isInstrumentId(instrument) ? INSTRUMENTS[instrument].label : instrument;
}

export function clefFor(instrument: string): "treble" | "bass" {
  return isInstrumentId(instrument) ? INSTRUMENTS[instrument].clef : "treble";
}
