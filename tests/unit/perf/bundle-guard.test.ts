// What keeps the engraving out of the first load, checked on the source: VexFlow only as its core
// build (no fonts inside the script) and only through components/chart/vexflow.ts; the engraving
// modules reached from a page only through a dynamic import; the fonts as files the worker precaches.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../../..");
const rel = (f: string) => path.relative(root, f);

function sourceFiles(dir: string): string[] {
  const abs = path.join(root, dir);
  if (!fs.existsSync(abs)) return [];
  return fs
    .readdirSync(abs, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile() && /\.(ts|tsx)$/.test(d.name))
    .map((d) => path.join(d.parentPath, d.name));
}

/** Static (value) imports only: type-only imports and dynamic import() do not load code up front. */
function staticImports(file: string): string[] {
  const text = fs.readFileSync(file, "utf8").replace(/^import type .*$/gm, "").replace(/^import \{ type [^}]*\} from .*$/gm, "");
  return [...text.matchAll(/^(?:import|export)\s[^'"]*?from\s+["']([^"']+)["']/gm), ...text.matchAll(/^import\s+["']([^"']+)["']/gm)].map((m) => m[1] ?? "");
}

const ENGRAVING = ["engrave", "draw-sheets", "melody", "vexflow"];
const isEngraving = (spec: string, file: string) =>
  ENGRAVING.some((m) => spec === `@/components/chart/${m}` || (spec === `./${m}` && rel(path.dirname(file)) === path.join("components", "chart")));
const everywhere = () => ["app", "components", "lib", "scripts"].flatMap(sourceFiles);

describe("the engraving bundle", () => {
  it("takes VexFlow's core build, in components/chart/vexflow.ts alone", () => {
    const offenders = everywhere()
      .flatMap((f) => staticImports(f).filter((s) => s === "vexflow" || s.startsWith("vexflow/")).map((s) => ({ f: rel(f), s })))
      .filter(({ f, s }) => !(f === path.join("components", "chart", "vexflow.ts") && s === "vexflow/core"));
    expect(offenders).toEqual([]);
  });

  it("is reached from pages only by dynamic import", () => {
    const engravingFiles = new Set(ENGRAVING.map((m) => path.join("components", "chart", `${m}.ts`)));
    engravingFiles.add(path.join("components", "chart", "svg-text.ts"));
    const offenders = ["app", "components", "lib"]
      .flatMap(sourceFiles)
      .filter((f) => !engravingFiles.has(rel(f)))
      .flatMap((f) => staticImports(f).filter((s) => isEngraving(s, f)).map((s) => `${rel(f)} → ${s}`));
    expect(offenders).toEqual([]);
  });

  it("loads its fonts as files from public/fonts, with their licences beside them", () => {
    const fonts = fs.readFileSync(path.join(root, "components/chart/music-fonts.ts"), "utf8");
    const urls = [...fonts.matchAll(/url: "(\/fonts\/[^"]+)"/g)].map((m) => m[1]!);
    expect(urls.length).toBeGreaterThanOrEqual(2);
    for (const u of urls) {
      const file = path.join(root, "public", u);
      expect(fs.existsSync(file), u).toBe(true);
      expect(fs.readFileSync(file).subarray(0, 4).toString("latin1"), u).toBe("wOF2");
    }
    for (const l of ["LICENSE-bravura.txt", "LICENSE-academico.txt"]) {
      expect(fs.readFileSync(path.join(root, "public/fonts", l), "utf8")).toContain("SIL Open Font License");
    }
  });

  it("has the worker precache the font files", () => {
    const config = fs.readFileSync(path.join(root, "serwist.config.js"), "utf8");
    expect(config).toMatch(/public\/\*\*\/\*\.\{[^}]*woff2/);
  });
});
