// Reads the MusicXML check files copied beside these tests (see fixtures/SOURCE.md).
import fs from "node:fs";
import path from "node:path";
import { XMLParser } from "fast-xml-parser";

const dir = path.join(import.meta.dirname, "fixtures");

const ARRAYS = new Set(["score-part", "part", "measure", "harmony", "degree", "note", "attributes"]);
const parser = new XMLParser({ ignoreAttributes: false, isArray: (name) => ARRAYS.has(name) });

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the XML's shape is checked by the tests that read it
export type Xml = any;

export function readFixture(name: string): Xml {
  return parser.parse(fs.readFileSync(path.join(dir, name), "utf8"));
}
