import { zipSync } from "fflate";
import { describe, expect, it } from "vitest";
import { importScoreFile, MusicXmlError } from "@/lib/musicxml";
import { fixture } from "./helpers";

function refusal(bytes: Uint8Array): MusicXmlError {
  try {
    importScoreFile(bytes);
  } catch (err) {
    if (err instanceof MusicXmlError) return err;
    throw err;
  }
  throw new Error("the file was accepted");
}

const container = new TextEncoder().encode(
  `<?xml version="1.0"?><container><rootfiles><rootfile full-path="score.musicxml"/></rootfiles></container>`,
);

/** Rewrites the uncompressed-size fields of every local and central header (a lying zip). */
function understateSizes(zip: Uint8Array, size: number): Uint8Array {
  const out = zip.slice();
  const view = new DataView(out.buffer);
  for (let i = 0; i + 4 <= out.length; i++) {
    const sig = view.getUint32(i, true);
    if (sig === 0x04034b50) view.setUint32(i + 22, size, true);
    if (sig === 0x02014b50) view.setUint32(i + 24, size, true);
  }
  return out;
}

describe("hostile MusicXML is refused with a clear error", () => {
  it("a billion-laughs entity file", () => {
    const err = refusal(fixture("billion-laughs.musicxml"));
    expect(err.code).toBe("entities");
    expect(err.message).toMatch(/declares XML entities/);
  });

  it("a file with external entities (nothing is fetched or read)", () => {
    const err = refusal(fixture("external-entity.musicxml"));
    expect(err.code).toBe("entities");
    expect(err.message).toMatch(/never expands entities or fetches external references/);
  });

  it("a DOCTYPE with only a public identifier is fine (no fetch, no expansion)", () => {
    const xml = `<?xml version="1.0"?><!DOCTYPE score-partwise PUBLIC "-//Recordare//DTD MusicXML 4.0 Partwise//EN" "http://127.0.0.1:9/partwise.dtd"><score-partwise><part-list><score-part id="P1"><part-name>P</part-name></score-part></part-list><part id="P1"><measure number="1"><harmony><root><root-step>C</root-step></root><kind>major</kind></harmony></measure></part></score-partwise>`;
    expect(importScoreFile(new TextEncoder().encode(xml)).chart.sections[0]!.bars[0]!.chords[0]!.symbol).toBe("C");
  });

  it("character references are decoded but never entities we did not define", () => {
    const xml = `<score-partwise><work><work-title>Rain &amp; Rust &#x2013; take &#50;&unknown;</work-title></work><part-list/><part id="P1"><measure number="1"/></part></score-partwise>`;
    expect(importScoreFile(new TextEncoder().encode(xml)).chart.title).toBe("Rain & Rust – take 2&unknown;");
  });

  it("a zip bomb (.mxl that unpacks to 40 MB)", () => {
    const zip = zipSync({ "META-INF/container.xml": container, "score.musicxml": new Uint8Array(40 * 1024 * 1024) });
    expect(zip.length).toBeLessThan(200_000);
    const err = refusal(zip);
    expect(err.code).toBe("zip_limits");
    expect(err.message).toMatch(/unpacks to more than 5 MB/);
  });

  it("a zip bomb whose headers lie about its size is stopped by counting real bytes", () => {
    const zip = understateSizes(zipSync({ "META-INF/container.xml": container, "score.musicxml": new Uint8Array(40 * 1024 * 1024) }), 1000);
    const err = refusal(zip);
    expect(err.code).toBe("zip_limits");
  });

  it("a zip with thousands of entries", () => {
    const files: Record<string, Uint8Array> = { "META-INF/container.xml": container };
    for (let i = 0; i < 2000; i++) files[`junk/${i}.txt`] = new Uint8Array(1);
    const err = refusal(zipSync(files));
    expect(err.code).toBe("zip_limits");
    expect(err.message).toMatch(/more than 64 files/);
  });

  it("a file over 5 MB", () => {
    const big = new TextEncoder().encode(`<score-partwise>${" ".repeat(5 * 1024 * 1024)}</score-partwise>`);
    const err = refusal(big);
    expect(err.code).toBe("too_large");
    expect(err.message).toMatch(/larger than 5 MB/);
  });

  it("the wrong type of file (a PDF, a PNG, plain text)", () => {
    for (const head of ["%PDF-1.7\n", "\x89PNG\r\n\x1a\n", "just some words"]) {
      const err = refusal(new TextEncoder().encode(head + "x".repeat(100)));
      expect(err.code).toBe("wrong_type");
      expect(err.message).toMatch(/not a MusicXML file/);
    }
  });

  it("XML that is not a score, and broken XML", () => {
    expect(refusal(new TextEncoder().encode("<html><body/></html>")).code).toBe("not_musicxml");
    expect(refusal(new TextEncoder().encode("<score-partwise><part>")).code).toBe("not_xml");
    expect(refusal(new TextEncoder().encode("<score-timewise/>")).code).toBe("unsupported");
  });

  it("a damaged zip", () => {
    const zip = zipSync({ "META-INF/container.xml": container, "score.musicxml": new TextEncoder().encode("<score-partwise/>".repeat(500)) });
    const broken = zip.slice(0, 60);
    expect(["bad_zip", "not_musicxml"]).toContain(refusal(broken).code);
  });
});
