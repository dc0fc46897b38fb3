import fs from "node:fs";
import path from "node:path";

export const FIXTURES = path.resolve(import.meta.dirname, "../../fixtures/musicxml");

export function fixture(name: string): Uint8Array {
  return new Uint8Array(fs.readFileSync(path.join(FIXTURES, name)));
}

export function suite(name: string): Uint8Array {
  return fixture(`suite/${name}`);
}
