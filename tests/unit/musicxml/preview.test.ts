import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { zipSync } from "fflate";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { confirmImport, previewImportRequest } from "@/lib/server/imports";
import { hugeUpload, multipart, storedState } from "../attachments/upload-helpers";
import { appError, cleanupDbs, freshDb, makeBand, outcome, type BandCast } from "../server/helpers";
import { fixture, suite } from "./helpers";

let db: Kysely<Database>;
let cast: BandCast;
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-import-"));

beforeAll(async () => {
  process.env.DATA_DIR = dataDir;
  db = await freshDb();
  cast = await makeBand(db);
});
afterAll(cleanupDbs);

async function refusedWithNothingStored(request: Request, status: number, message: RegExp): Promise<void> {
  const before = await storedState(db, dataDir);
  const err = await appError(() => previewImportRequest(db, cast.arranger, cast.bandId, request));
  expect(err.status).toBe(status);
  expect(err.message).toMatch(message);
  expect(await storedState(db, dataDir)).toEqual(before);
}

describe("import preview, then confirm", () => {
  it("previews a MusicXML upload without storing anything, then saves it on confirm", async () => {
    const before = await storedState(db, dataDir);
    const preview = await previewImportRequest(db, cast.arranger, cast.bandId, multipart("cinderpath-nocturne.musicxml", fixture("cinderpath-nocturne.musicxml")));
    expect(preview.chart.title).toBe("Cinderpath Nocturne");
    expect(preview.sourceText).toMatch(/^title: Cinderpath Nocturne/m);
    expect(preview.report.skipped.join("\n")).toMatch(/Piano/);
    expect(await storedState(db, dataDir)).toEqual(before);
    const c = preview.chart;
    const saved = await confirmImport(db, cast.arranger, cast.bandId, {
      fileName: preview.fileName, title: c.title, composer: c.composer, key: c.key, meter: `${c.meter.beats}/${c.meter.unit}`, tempo: c.tempo, feel: c.feel, sourceText: preview.sourceText,
    });
    expect(saved.body.sections.map((s) => s.label)).toEqual(["A", "B"]);
    expect(saved.key).toBe("Fm");
    expect((await storedState(db, dataDir)).charts).toBe(before.charts + 1);
  });

  it("46g-PickupMeasure-Chordnames-FiguredBass.xml, once refused with one sentence, previews with its pickup kept", async () => {
    const preview = await previewImportRequest(db, cast.arranger, cast.bandId, multipart("46g.xml", suite("46g-PickupMeasure-Chordnames-FiguredBass.xml")));
    expect(preview.sourceText).toMatch(/^pickup: 1 beat$/m);
    expect(preview.report.skipped).toContain("figured bass (2) — bars 0 and 1");
  });

  it("71f-AllChordTypes.xml previews with the bar and chord chart text could not keep named, the rest kept", async () => {
    // 71f measure 9: G#/D# at beat 2½, where chart text holds one chord a beat
    const preview = await previewImportRequest(db, cast.arranger, cast.bandId, multipart("71f.xml", suite("71f-AllChordTypes.xml")));
    expect(preview.report.changed.join("\n")).toMatch(/left out \(G#\/D#\) \(1\) — bar 9/);
    expect(preview.chart.sections[0]!.bars).toHaveLength(10);
  });

  it("players may not import", async () => {
    expect(await outcome(() => previewImportRequest(db, cast.player, cast.bandId, multipart("a.musicxml", fixture("cinderpath-nocturne.musicxml"))))).toBe(403);
    expect(await outcome(() => previewImportRequest(db, cast.outsider, cast.bandId, multipart("a.musicxml", fixture("cinderpath-nocturne.musicxml"))))).toBe(404);
  });
});

describe("hostile uploads are refused with a clear error and nothing stored", () => {
  it("billion laughs: 422", () => refusedWithNothingStored(multipart("laughs.musicxml", fixture("billion-laughs.musicxml")), 422, /declares XML entities/));
  it("external entity: 422", () => refusedWithNothingStored(multipart("xxe.xml", fixture("external-entity.musicxml")), 422, /never expands entities/));
  it("zip bomb: 413", () => {
    const container = new TextEncoder().encode(`<container><rootfiles><rootfile full-path="s.musicxml"/></rootfiles></container>`);
    const bomb = zipSync({ "META-INF/container.xml": container, "s.musicxml": new Uint8Array(60 * 1024 * 1024) });
    return refusedWithNothingStored(multipart("bomb.mxl", bomb), 413, /unpacks to more than 5 MB/);
  });
  it("a 50 MB upload: 413 without reading it all", async () => {
    const { request, pulled } = hugeUpload(true);
    await refusedWithNothingStored(request, 413, /larger than 5 MB/);
    expect(pulled()).toBeLessThan(2 * 1024 * 1024);
  });
  it("the wrong type (a PDF renamed .xml, and a .pdf): 415", async () => {
    await refusedWithNothingStored(multipart("score.xml", new TextEncoder().encode("%PDF-1.4 not a score")), 415, /not a MusicXML file/);
    await refusedWithNothingStored(multipart("score.pdf", fixture("cinderpath-nocturne.musicxml")), 415, /not a MusicXML file/);
  });
});
