// A chart as compressed MusicXML (.mxl): the zip layout MusicXML 4.0 gives — an uncompressed
// `mimetype` entry first, META-INF/container.xml naming the score, then the score itself.
import { zipSync } from "fflate";
import type { Chart } from "@/lib/chart/model";
import { exportMusicXml, type ExportOptions } from "./export";
import { esc } from "./xml";

export const MXL_MIME = "application/vnd.recordare.musicxml";

export function containerXml(scorePath: string): string {
  return [
    `<?xml version="1.0" encoding="UTF-8"?>`,
    `<container>`,
    `  <rootfiles>`,
    `    <rootfile full-path="${esc(scorePath)}" media-type="application/vnd.recordare.musicxml+xml"/>`,
    `  </rootfiles>`,
    `</container>`,
    "",
  ].join("\n");
}

export function exportMxl(chart: Chart, scorePath: string, opts: ExportOptions = {}): Uint8Array {
  const enc = new TextEncoder();
  return zipSync({
    mimetype: [enc.encode(MXL_MIME), { level: 0 }],
    "META-INF/container.xml": enc.encode(containerXml(scorePath)),
    [scorePath]: enc.encode(exportMusicXml(chart, opts)),
  });
}
