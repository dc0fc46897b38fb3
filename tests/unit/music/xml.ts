// Reads the MusicXML check files in tests/fixtures/musicxml/suite (MIT, see SOURCE.md there).
import fs from "node:fs";
import path from "node:path";
import { XMLParser } from "fast-xml-parser";
import { z } from "zod";

const dir = path.join(import.meta.dirname, "../../fixtures/musicxml/suite");
const parser = new XMLParser({ ignoreAttributes: false, parseTagValue: true });

export function readFixture(name: string): unknown {
  return parser.parse(fs.readFileSync(path.join(dir, name), "utf8"));
}

/** Every value under `key` anywhere in the parsed tree, in document order. */
export function collect(node: unknown, key: string): unknown[] {
  const out: unknown[] = [];
  const walk = (n: unknown) => {
    if (Array.isArray(n)) n.forEach(walk);
    else if (n && typeof n === "object") {
      for (const [k, v] of Object.entries(n)) {
        if (k === key) (Array.isArray(v) ? v : [v]).forEach((x) => out.push(x));
        else walk(v);
      }
    }
  };
  walk(node);
  return out;
}

const TransposeSchema = z.object({ diatonic: z.number(), chromatic: z.number(), "octave-change": z.number().optional() });
export type XmlTranspose = z.infer<typeof TransposeSchema>;

const PartSchema = z.object({ "@_id": z.string() }).passthrough();
const ScorePartSchema = z.object({ "@_id": z.string(), "part-name": z.union([z.string(), z.object({ "#text": z.string() }).passthrough()]) }).passthrough();

/** Each part's name and the <transpose> elements in it, in order. */
export function transposingParts(file: string): { name: string; transposes: XmlTranspose[] }[] {
  const doc = readFixture(file);
  const names = new Map(
    collect(doc, "score-part").map((sp) => {
      const p = ScorePartSchema.parse(sp);
      const name = typeof p["part-name"] === "string" ? p["part-name"] : p["part-name"]["#text"];
      return [p["@_id"], name] as const;
    }),
  );
  return collect(doc, "part").map((raw) => {
    const part = PartSchema.parse(raw);
    return { name: names.get(part["@_id"]) ?? part["@_id"], transposes: collect(part, "transpose").map((t) => TransposeSchema.parse(t)) };
  });
}

const DegreeSchema = z.object({ "degree-value": z.number(), "degree-alter": z.number(), "degree-type": z.string() });
const HarmonySchema = z
  .object({
    root: z.object({ "root-step": z.string(), "root-alter": z.number().optional() }).optional(),
    kind: z.union([z.string(), z.object({ "#text": z.string() }).passthrough()]),
    degree: z.union([DegreeSchema, z.array(DegreeSchema)]).optional(),
  })
  .passthrough();

export interface XmlHarmony {
  root: string;
  kind: string;
  degrees: z.infer<typeof DegreeSchema>[];
}

export function harmonies(file: string): XmlHarmony[] {
  return collect(readFixture(file), "harmony").map((raw) => {
    const h = HarmonySchema.parse(raw);
    const alter = h.root?.["root-alter"] ?? 0;
    const root = (h.root?.["root-step"] ?? "C") + (alter < 0 ? "b" : alter > 0 ? "#" : "");
    const kind = typeof h.kind === "string" ? h.kind : h.kind["#text"];
    const degrees = h.degree === undefined ? [] : Array.isArray(h.degree) ? h.degree : [h.degree];
    return { root, kind, degrees };
  });
}

const KeySchema = z.object({ fifths: z.number(), mode: z.string().optional() }).passthrough();

export function keySignatures(file: string): { fifths: number; mode: string }[] {
  return collect(readFixture(file), "key").map((k) => {
    const p = KeySchema.parse(k);
    return { fifths: p.fifths, mode: p.mode ?? "major" };
  });
}
