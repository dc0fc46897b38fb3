// Issue 14: an upload streams from the request into the part store (never held whole), with the size
// limit enforced while streaming and the PDF's pages counted on the way, across chunk boundaries.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import v8 from "node:v8";
import vm from "node:vm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { MAX_PART_BYTES, PdfPageCounter, openPart, uploadPartRequest } from "@/lib/server/parts";
import { createChart } from "@/lib/server/charts";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";
import { makePdf } from "./make-pdf";
import { storedState } from "./upload-helpers";

const MB = 1024 * 1024;
const BOUNDARY = "pedalpointstreamboundary";
let db: Kysely<Database>;
let cast: BandCast;
let chartId: string;
let dataDir: string;

beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  chartId = (await createChart(db, cast.leader, cast.bandId, chartInput())).id;
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-stream-"));
  process.env.DATA_DIR = dataDir;
});
afterAll(() => {
  fs.rmSync(dataDir, { recursive: true, force: true });
  cleanupDbs();
});

function counted(bytes: Uint8Array, chunk: number): number | null {
  const counter = new PdfPageCounter();
  for (let at = 0; at < bytes.length; at += chunk) counter.feed(bytes.subarray(at, at + chunk));
  return counter.pages();
}

/** A multipart request whose file part (a PDF head, then `size` bytes of filler) is made as it is read. */
function streamedUpload(size: number): { request: Request; pulled: () => number } {
  const head = new TextEncoder().encode(`--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="long.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-1.4\n`);
  const tail = new TextEncoder().encode(`\r\n--${BOUNDARY}--\r\n`);
  const filler = new Uint8Array(256 * 1024).fill(0x20);
  let sent = 0;
  let stage: "head" | "body" | "tail" | "done" = "head";
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (stage === "head") {
        stage = "body";
        return controller.enqueue(head);
      }
      if (stage === "body") {
        const n = Math.min(filler.length, size - sent);
        sent += n;
        if (sent >= size) stage = "tail";
        return controller.enqueue(filler.subarray(0, n));
      }
      if (stage === "tail") {
        stage = "done";
        return controller.enqueue(tail);
      }
      controller.close();
    },
  });
  const init = { method: "POST", body, headers: { "content-type": `multipart/form-data; boundary=${BOUNDARY}` }, duplex: "half" } as RequestInit;
  return { request: new Request("http://localhost/upload", init), pulled: () => sent };
}

v8.setFlagsFromString("--expose-gc");
const gc = vm.runInNewContext("gc") as () => void;
const memory = () => process.memoryUsage().heapUsed + process.memoryUsage().arrayBuffers;

describe("counting a PDF's pages as it streams", () => {
  it("counts the same in 1-byte, 7-byte and whole chunks, and never counts the page tree (/Pages)", () => {
    const pdf = makePdf(3);
    expect(counted(pdf, pdf.length)).toBe(3);
    expect(counted(pdf, 7)).toBe(3);
    expect(counted(pdf, 1)).toBe(3);
    // "/Type /Page" at a chunk's end, the "s" of "/Pages" in the next chunk: still not a page.
    const tree = new TextEncoder().encode("<< /Type /Pages >> << /Type /Page >>");
    expect(counted(tree, 14)).toBe(1);
  });
});

describe("a streamed upload", () => {
  it("stores a 19 MB part through the route without holding it: memory grows far less than the file", async () => {
    const { request } = streamedUpload(19 * MB);
    gc();
    const start = memory();
    let peak = start;
    const timer = setInterval(() => {
      gc();
      peak = Math.max(peak, memory());
    }, 100);
    const dto = await uploadPartRequest(db, cast.leader, cast.bandId, chartId, request).finally(() => clearInterval(timer));
    gc();
    peak = Math.max(peak, memory());
    console.log(`19 MB upload through the route: memory growth ${((peak - start) / MB).toFixed(1)} MB`);
    expect(dto.size).toBe(19 * MB + "%PDF-1.4\n".length);
    expect(peak - start).toBeLessThan(8 * MB);
    const body = await openPart(db, cast.leader, cast.bandId, chartId, dto.id);
    expect(body.stream ? body.size : -1).toBe(dto.size);
    await body.stream?.cancel();
  }, 60_000);

  it("past the limit it answers 413 while streaming, stops reading, and stores nothing", async () => {
    const before = await storedState(db, dataDir);
    const { request, pulled } = streamedUpload(MAX_PART_BYTES + 30 * MB);
    const err = await appError(() => uploadPartRequest(db, cast.leader, cast.bandId, chartId, request));
    expect(err.status).toBe(413);
    expect(pulled()).toBeLessThan(MAX_PART_BYTES + 2 * MB);
    expect(await storedState(db, dataDir)).toEqual(before);
    const leftovers = fs.readdirSync(path.join(dataDir, "attachments")).filter((f) => f.endsWith(".part"));
    expect(leftovers).toEqual([]);
  }, 60_000);
});
