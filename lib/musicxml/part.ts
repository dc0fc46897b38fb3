// The export options for one of the band's parts: its <transpose>, clef, name and the octave the app
// draws its melody in, so the file reads like the part on screen.
import { instrumentOf, type InstrumentId } from "@/lib/music";
import type { ExportOptions } from "./export";

export function partExportOptions(instrument: InstrumentId | string): ExportOptions {
  const inst = instrumentOf(instrument);
  return {
    transpose: inst.transpose,
    clef: inst.clef,
    melodyOctave: inst.melodyOctave,
    partName: inst.id === "concert" ? "Lead sheet" : inst.label,
  };
}
