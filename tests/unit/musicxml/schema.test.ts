// Every export validates against the official MusicXML 4.0 XSD (W3C Music Notation Community Group),
// checked with Debian's xmllint in one call per group of files.
import fs from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { unzipSync } from "fflate";
import { describe, expect, it } from "vitest";
import { DEMO_CHARTS } from "@/db/demo-charts";
import { parseChartText } from "@/lib/chart";
import { INSTRUMENT_IDS } from "@/lib/music";
import { exportMusicXml, exportMxl, importScoreFile, partExportOptions } from "@/lib/musicxml";
import { chartArb } from "../chart/arbitrary";
import { FIXTURES } from "./helpers";
import { invalid, SHARED_SCHEMA_DIR, validateAll, VENDORED_SCHEMA_DIR } from "./xmllint";

const SUITE = path.join(FIXTURES, "suite");

describe("MusicXML 4.0 schema (musicxml.xsd) accepts every export", () => {
  it("every demo chart, for every part (13 charts × 5 parts)", () => {
    const docs: Record<string, string> = {};
    for (const demo of DEMO_CHARTS) {
      const chart = parseChartText(demo.text);
      for (const id of INSTRUMENT_IDS) docs[`${demo.slug}-${id}.musicxml`] = exportMusicXml(chart, partExportOptions(id));
    }
    expect(Object.keys(docs)).toHaveLength(DEMO_CHARTS.length * INSTRUMENT_IDS.length);
    expect(invalid(validateAll(docs))).toEqual({});
  });

  it("generated charts (the chart-text property arbitraries), for every part", () => {
    const charts = fc.sample(chartArb, { numRuns: 40, seed: 12 });
    const docs: Record<string, string> = {};
    charts.forEach((chart, i) => {
      for (const id of INSTRUMENT_IDS) docs[`gen-${i}-${id}.musicxml`] = exportMusicXml(chart, partExportOptions(id));
    });
    expect(invalid(validateAll(docs))).toEqual({});
  }, 60_000);

  it("every test-suite fixture, imported and exported again, for every part", () => {
    const docs: Record<string, string> = {};
    for (const file of fs.readdirSync(SUITE).filter((f) => /\.(xml|mxl)$/.test(f))) {
      const { chart } = importScoreFile(new Uint8Array(fs.readFileSync(path.join(SUITE, file))));
      for (const id of INSTRUMENT_IDS) docs[`${file.replace(/\.\w+$/, "")}-${id}.musicxml`] = exportMusicXml(chart, partExportOptions(id));
    }
    expect(Object.keys(docs).length).toBe(15 * INSTRUMENT_IDS.length);
    expect(invalid(validateAll(docs))).toEqual({});
  });

  it("the test-suite files themselves validate (the checker is the standard's)", () => {
    const docs: Record<string, Uint8Array> = {};
    for (const file of fs.readdirSync(SUITE).filter((f) => f.endsWith(".xml"))) docs[file] = fs.readFileSync(path.join(SUITE, file));
    const result = validateAll(docs);
    expect(invalid(result)).toEqual({});
  });

  it("refuses a file that breaks the schema (the check can fail)", () => {
    const broken = exportMusicXml(parseChartText(DEMO_CHARTS[0]!.text)).replace("<divisions>48</divisions>", "<divisions>-1</divisions>");
    expect(Object.keys(invalid(validateAll({ "broken.musicxml": broken })))).toEqual(["broken.musicxml"]);
  });
});

describe("compressed .mxl (container.xsd)", () => {
  it("META-INF/container.xml of an exported .mxl validates, and its score validates too", () => {
    const chart = parseChartText(DEMO_CHARTS[1]!.text);
    const files = unzipSync(exportMxl(chart, "lantern.musicxml", partExportOptions("bb")));
    expect(Object.keys(files)).toEqual(["mimetype", "META-INF/container.xml", "lantern.musicxml"]);
    expect(new TextDecoder().decode(files.mimetype)).toBe("application/vnd.recordare.musicxml");
    expect(invalid(validateAll({ "container.xml": files["META-INF/container.xml"]! }, "container.xsd"))).toEqual({});
    expect(invalid(validateAll({ "lantern.musicxml": files["lantern.musicxml"]! }))).toEqual({});
  });

  it("the test suite's 90a container.xml validates against the same schema", () => {
    const files = unzipSync(new Uint8Array(fs.readFileSync(path.join(SUITE, "90a-Compressed-MusicXML.mxl"))));
    expect(invalid(validateAll({ "container.xml": files["META-INF/container.xml"]! }, "container.xsd"))).toEqual({});
  });
});

describe("the vendored schema", () => {
  it.runIf(fs.existsSync(SHARED_SCHEMA_DIR))("is byte for byte the shared copy beside the repository", () => {
    for (const f of ["musicxml.xsd", "container.xsd", "xml.xsd", "xlink.xsd"]) {
      expect(fs.readFileSync(path.join(VENDORED_SCHEMA_DIR, f)).equals(fs.readFileSync(path.join(SHARED_SCHEMA_DIR, f)))).toBe(true);
    }
  });
});
