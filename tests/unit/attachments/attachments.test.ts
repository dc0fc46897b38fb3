import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { listParts, openPart, sniffPart, uploadPartRequest } from "@/lib/server/parts";
import { createChart } from "@/lib/server/charts";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, outcome, type BandCast } from "../server/helpers";
import { makePdf } from "./make-pdf";
import { hugeUpload, multipart, storedState } from "./upload-helpers";

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
let dataDir: string;
let db: Kysely<Database>;
let cast: BandCast;
let chartId: string;

beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  chartId = (await createChart(db, cast.leader, cast.bandId, chartInput())).id;
});
beforeEach(() => {
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-data-"));
  process.env.DATA_DIR = dataDir;
});
afterAll(cleanupDbs);

describe("uploading a PDF or image part", () => {
  it("stores a PDF under its sha256, with a row and an attachment change", async () => {
    const pdf = makePdf(3);
    const before = await storedState(db, dataDir);
    const dto = await uploadPartRequest(db, cast.arranger, cast.bandId, chartId, multipart("horn part.pdf", pdf, "text/plain"));
    const sha = createHash("sha256").update(pdf).digest("hex");
    // the type comes from the bytes, not from what the browser claimed
    expect(dto).toMatchObject({ type: "application/pdf", sha256: sha, size: pdf.byteLength, pages: 3, filename: "horn part.pdf" });
    expect(fs.readFileSync(path.join(dataDir, "attachments", sha))).toEqual(Buffer.from(pdf));
    const after = await storedState(db, dataDir);
    expect(after).toMatchObject({ attachments: before.attachments + 1, changes: before.changes + 1, files: 1 });
    const change = await db.selectFrom("changes").selectAll().orderBy("seq", "desc").executeTakeFirstOrThrow();
    expect(change).toMatchObject({ entity: "attachment", entity_id: dto.id, op: "upsert", band_id: cast.bandId });
  });

  it("keeps one file for the same bytes uploaded twice", async () => {
    await uploadPartRequest(db, cast.leader, cast.bandId, chartId, multipart("a.png", PNG));
    await uploadPartRequest(db, cast.leader, cast.bandId, chartId, multipart("b.png", PNG));
    expect(fs.readdirSync(path.join(dataDir, "attachments"))).toHaveLength(1);
  });

  it("lets members who read the book fetch the file; players cannot upload", async () => {
    const dto = await uploadPartRequest(db, cast.leader, cast.bandId, chartId, multipart("c.jpg", new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3])));
    const { stream, dto: got } = await openPart(db, cast.player, cast.bandId, chartId, dto.id);
    expect(got.type).toBe("image/jpeg");
    const bytes = new Uint8Array(await new Response(stream).arrayBuffer());
    expect(bytes.byteLength).toBe(7);
    expect([...bytes]).toEqual([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3]);
    expect((await listParts(db, cast.player, cast.bandId, chartId)).map((a) => a.id)).toContain(dto.id);
    expect(await outcome(() => uploadPartRequest(db, cast.player, cast.bandId, chartId, multipart("d.png", PNG)))).toBe(403);
    expect(await outcome(() => openPart(db, cast.outsider, cast.bandId, chartId, dto.id))).toBe(404);
    // a sub sees only charts on set lists shared with them
    expect(await outcome(() => openPart(db, cast.sub, cast.bandId, chartId, dto.id))).toBe(404);
  });
});

describe("refused uploads store nothing", () => {
  it("the wrong type of file: 415", async () => {
    const before = await storedState(db, dataDir);
    const err = await appError(() => uploadPartRequest(db, cast.leader, cast.bandId, chartId, multipart("notes.pdf", new TextEncoder().encode("just text, named .pdf"), "application/pdf")));
    expect(err.status).toBe(415);
    expect(err.message).toMatch(/PDF, PNG and JPEG/);
    expect(await storedState(db, dataDir)).toEqual(before);
  });

  it("a file over 20 MB: 413", async () => {
    const before = await storedState(db, dataDir);
    const big = new Uint8Array(21 * 1024 * 1024);
    big.set(new TextEncoder().encode("%PDF-1.4"));
    const err = await appError(() => uploadPartRequest(db, cast.leader, cast.bandId, chartId, multipart("big.pdf", big)));
    expect(err.status).toBe(413);
    expect(err.message).toMatch(/larger than 20 MB/);
    expect(await storedState(db, dataDir)).toEqual(before);
  });

  it.each([[true, "with a Content-Length"], [false, "streamed without one"]])("a 50 MB upload %s is refused without reading it all", async (withLength) => {
    const before = await storedState(db, dataDir);
    const { request, pulled } = hugeUpload(withLength as boolean);
    const err = await appError(() => uploadPartRequest(db, cast.leader, cast.bandId, chartId, request));
    expect(err.status).toBe(413);
    expect(pulled()).toBeLessThan(25 * 1024 * 1024);
    expect(await storedState(db, dataDir)).toEqual(before);
  });

  it("an upload to a chart of another band, or with no file field", async () => {
    expect(await outcome(() => uploadPartRequest(db, cast.leader, cast.bandId, "no-such-chart", multipart("a.png", PNG)))).toBe(404);
    const fd = new FormData();
    fd.append("other", "x");
    expect(await outcome(() => uploadPartRequest(db, cast.leader, cast.bandId, chartId, new Request("http://localhost/", { method: "POST", body: fd })))).toBe(400);
    expect(await outcome(() => uploadPartRequest(db, cast.leader, cast.bandId, chartId, new Request("http://localhost/", { method: "POST", body: "raw", headers: { "content-type": "application/pdf" } })))).toBe(415);
  });

  it("sniffs the magic bytes", () => {
    expect(sniffPart(makePdf(1))).toBe("application/pdf");
    expect(sniffPart(PNG)).toBe("image/png");
    expect(sniffPart(new Uint8Array([0xff, 0xd8, 0xff, 0xdb]))).toBe("image/jpeg");
    expect(sniffPart(new TextEncoder().encode("<svg/>"))).toBeNull();
    expect(sniffPart(new Uint8Array([0x50, 0x4b, 3, 4]))).toBeNull();
  });
});
