// MusicXML in and out. Pure: bytes or text in, a chart and a report (or MusicXML text) out.
import { normaliseChord } from "@/lib/music";
import { importMusicXml, type ImportOptions, type ImportResult } from "./import";
import { decodeXmlBytes, scoreFromMxl } from "./mxl";
import { MAX_MUSICXML_BYTES, MusicXmlError, parseXml } from "./xml";

export { exportMusicXml, exportBars, chartBars, type ExportOptions, type ExportBar } from "./export";
export { partExportOptions } from "./part";
export { exportArrangement } from "./performance";
export { exportMxl, containerXml, MXL_MIME } from "./mxl-write";
export { harmonyToSymbol, symbolToHarmony, KIND_VALUES, type Harmony, type KindValue } from "./kinds";
export { MusicXmlError, MAX_MUSICXML_BYTES } from "./xml";
export { MXL_LIMITS } from "./mxl";
export type { ImportReport, ImportResult, ImportOptions } from "./import";

export type ScoreFileKind = "musicxml" | "mxl";

/** Tells a MusicXML file from a zip by its first bytes; anything else is the wrong type. */
export function sniffScoreFile(bytes: Uint8Array): ScoreFileKind | null {
  if (bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04) return "mxl";
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) return "musicxml";
  let i = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  while (i < bytes.length && i < 1024 && (bytes[i] === 0x20 || bytes[i] === 0x0a || bytes[i] === 0x0d || bytes[i] === 0x09)) i++;
  return bytes[i] === 0x3c ? "musicxml" : null;
}

/** A symbol in Pedalpoint's house style, or null when the chord parser cannot read it. */
export function houseStyle(symbol: string): string | null {
  try {
    return normaliseChord(symbol);
  } catch {
    return null;
  }
}

/**
 * Reads an uploaded .musicxml/.xml/.mxl file, chord symbols in house style unless told otherwise.
 * Throws MusicXmlError with a message for the uploader.
 */
export function importScoreFile(bytes: Uint8Array, opts: ImportOptions = {}): ImportResult {
  if (bytes.length > MAX_MUSICXML_BYTES) {
    throw new MusicXmlError("too_large", "This file is larger than 5 MB, the most Pedalpoint reads for MusicXML.");
  }
  const kind = sniffScoreFile(bytes);
  if (!kind) {
    throw new MusicXmlError("wrong_type", "This is not a MusicXML file. Pedalpoint imports .musicxml, .xml and compressed .mxl files.");
  }
  const text = kind === "mxl" ? scoreFromMxl(bytes) : decodeXmlBytes(bytes);
  return importMusicXml(parseXml(text), { normalizeChord: houseStyle, ...opts });
}
