import { createHash } from "node:crypto";
import { IDBKeyRange, indexedDB } from "fake-indexeddb";
import { describe, expect, it } from "vitest";
import { chartParts, fetchMissingPartFiles, readPartFile } from "@/lib/offline/parts";
import { LocalBook } from "@/lib/offline/db";
import { makePdf } from "./make-pdf";

function book(): LocalBook {
  return new LocalBook(`parts-${Math.random()}`, { indexedDB, IDBKeyRange });
}

const pdf = makePdf(2);
const meta = (id: string, sha = createHash("sha256").update(pdf).digest("hex")) => ({
  id, bandId: "band1", chartId: "chart1", filename: `${id}.pdf`, sha256: sha, size: pdf.byteLength, type: "application/pdf", pages: 2, createdAt: "2026-12-01T20:00:00.000Z",
});

describe("parts on the device", () => {
  it("downloads missing files after sync, checks their hash, and reads them offline", async () => {
    const b = book();
    await b.attachments.bulkPut([meta("a1"), meta("a2", "0".repeat(64))]);
    const calls: string[] = [];
    const fetcher = async (url: string) => {
      calls.push(url);
      return new Response(pdf as BlobPart, { status: 200 });
    };
    const r = await fetchMissingPartFiles(b, "band1", { fetcher });
    expect(r).toEqual({ fetched: ["a1"], failed: ["a2"] }); // a2's bytes do not match its hash
    expect(calls[0]).toBe("/api/bands/band1/charts/chart1/attachments/a1");
    const blob = await readPartFile(b, "a1");
    expect(new Uint8Array(await blob!.arrayBuffer())).toEqual(pdf);
    expect(blob!.type).toBe("application/pdf");
    expect((await chartParts(b, "chart1")).map((p) => [p.id, p.offline])).toEqual([["a1", true], ["a2", false]]);
  });

  it("does not fetch again what it holds, and keeps going when the network fails", async () => {
    const b = book();
    await b.attachments.bulkPut([meta("a1"), meta("a3")]);
    await b.attachmentFiles.put({ id: "a1", blob: new Blob([pdf as BlobPart]), storedAt: "x" });
    let n = 0;
    const fetcher = async (): Promise<Response> => {
      n++;
      throw new TypeError("Failed to fetch");
    };
    expect(await fetchMissingPartFiles(b, "band1", { fetcher })).toEqual({ fetched: [], failed: ["a3"] });
    expect(n).toBe(1);
    expect(await readPartFile(b, "a3")).toBeNull();
  });
});
