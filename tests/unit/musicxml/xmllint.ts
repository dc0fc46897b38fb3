// Validates MusicXML against the official MusicXML 4.0 XSD with Debian's xmllint, many files per call
// so the schema is read once. The schema is the one beside the repository (../shared/fixtures, as CI
// sees it) when present, else the copy vendored in tests/fixtures/musicxml/schema.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

const REPO = path.resolve(import.meta.dirname, "../../..");
export const SHARED_SCHEMA_DIR = path.resolve(REPO, "../shared/fixtures/musicxml-schema");
export const VENDORED_SCHEMA_DIR = path.resolve(REPO, "tests/fixtures/musicxml/schema");
export const SCHEMA_DIR = fs.existsSync(path.join(SHARED_SCHEMA_DIR, "musicxml.xsd")) ? SHARED_SCHEMA_DIR : VENDORED_SCHEMA_DIR;

export interface Validation {
  /** File name → xmllint's complaints (empty when the file validates). */
  errors: Map<string, string[]>;
  output: string;
}

/** Writes each document to a temp folder and validates them all in one xmllint call. */
export function validateAll(docs: Record<string, string | Uint8Array>, xsd: "musicxml.xsd" | "container.xsd" = "musicxml.xsd"): Validation {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pp-xmllint-"));
  const names = Object.keys(docs);
  try {
    for (const name of names) fs.writeFileSync(path.join(dir, name), docs[name]!);
    const run = spawnSync("xmllint", ["--noout", "--nonet", "--schema", path.join(SCHEMA_DIR, xsd), ...names], {
      cwd: dir, encoding: "utf8", maxBuffer: 64 * 1024 * 1024,
    });
    if (run.error) throw run.error;
    const output = `${run.stdout}${run.stderr}`;
    const errors = new Map<string, string[]>(names.map((n) => [n, []]));
    const lines = output.split("\n").filter(Boolean);
    for (const name of names) {
      const ok = lines.includes(`${name} validates`);
      const complaints = lines.filter((l) => l.startsWith(`${name}:`));
      errors.set(name, ok ? [] : complaints.length ? complaints : [`no verdict from xmllint for ${name}`]);
    }
    return { errors, output };
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

/** The files that did not validate, with xmllint's first complaints, for a readable failure. */
export function invalid(v: Validation): Record<string, string[]> {
  return Object.fromEntries([...v.errors].filter(([, e]) => e.length > 0).map(([n, e]) => [n, e.slice(0, 3)]));
}
