// The house rules that keep the pure core pure, checked on the source itself.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");

function sourceFiles(dir: string): string[] {
  const abs = path.join(root, dir);
  if (!fs.existsSync(abs)) return [];
  return fs.readdirSync(abs, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile() && /\.(ts|tsx)$/.test(d.name))
    .map((d) => path.join(d.parentPath, d.name));
}

/** Every import, type-only ones too: a type from db/ in browser code still ties it to the database. */
function allImports(file: string): string[] {
  const text = fs.readFileSync(file, "utf8");
  return [...text.matchAll(/(?:import|export)[^'"]*?from\s+["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)/g)].map((m) => m[1] ?? m[2] ?? "");
}

const rel = (f: string) => path.relative(root, f);

function imports(file: string): string[] {
  // Type-only imports vanish at compile time, so they do not count.
  const text = fs.readFileSync(file, "utf8").replace(/^import type .*$/gm, "");
  return [...text.matchAll(/(?:import|export)[^'"]*?from\s+["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)/g)].map((m) => m[1] ?? m[2] ?? "");
}

describe("the pure core", () => {
  for (const dir of ["lib/music", "lib/chart", "lib/render", "lib/setlist", "lib/musicxml", "lib/accompaniment"]) {
    it(`${dir} imports nothing from app, db, components, Dexie, React, audio or Node I/O`, () => {
      const bad = sourceFiles(dir).flatMap((f) =>
        imports(f)
          .filter((s) => /^(@\/(app|db|components|lib\/server|lib\/offline)\b|react\b|react-dom|dexie|vexflow|tone\b|next\b|node:fs|fs$|better-sqlite3)/.test(s))
          .map((s) => `${path.relative(root, f)} → ${s}`),
      );
      expect(bad).toEqual([]);
    });
  }

  it("only components/chart imports VexFlow", () => {
    const offenders = ["app", "components", "lib"].flatMap(sourceFiles)
      .filter((f) => !path.relative(root, f).startsWith(path.join("components", "chart")))
      .filter((f) => imports(f).some((s) => s === "vexflow" || s.startsWith("vexflow/")))
      .map((f) => path.relative(root, f));
    expect(offenders).toEqual([]);
  });

  it("every module that touches the database is marked server-only", () => {
    const unmarked = ["lib/server", "app"].flatMap(sourceFiles)
      .filter((f) => !f.endsWith("route.ts") && !/\/(page|layout|actions)\.tsx?$/.test(f))
      .filter((f) => imports(f).some((s) => s === "@/db" || s.startsWith("@/db/")))
      .filter((f) => !/^import "server-only";/m.test(fs.readFileSync(f, "utf8")))
      .map((f) => path.relative(root, f));
    expect(unmarked).toEqual([]);
  });
});

describe("one way to validate", () => {
  const code = () => ["app", "components", "lib"].flatMap(sourceFiles).map((f) => ({ file: path.relative(root, f), text: fs.readFileSync(f, "utf8") }));

  it("zod issues become field messages in one place, lib/validation/issues.ts", () => {
    const definers = code().filter((f) => /function zodIssues\b|const zodIssues\b/.test(f.text)).map((f) => f.file);
    expect(definers).toEqual([path.join("lib", "validation", "issues.ts")]);
    // A hand-written copy of the conversion (issues mapped to `{ field: path.join(".") … }`) elsewhere.
    const copies = code().filter((f) => /\.path\.join\(\s*["']\.["']\s*\)/.test(f.text)).map((f) => f.file);
    expect(copies).toEqual([]);
  });

  it("route address parameters are declared only in lib/validation/params.ts", () => {
    const inline = code()
      .filter((f) => f.file.startsWith("app"))
      .filter((f) => /params:\s*z\.object\(|const \w*Params\s*=\s*z\./.test(f.text))
      .map((f) => f.file);
    expect(inline).toEqual([]);
  });

  it("no use case casts its actor to non-null; route() and action() hand over a checked one", () => {
    const casts = code().filter((f) => /\bas Actor\b|\bactor!/.test(f.text)).map((f) => f.file);
    expect(casts).toEqual([]);
  });
});

describe("one way to do each thing", () => {
  it("roles and permissions come from lib/band/roles: components and lib/offline import nothing from db/", () => {
    const bad = ["components", "lib/offline"].flatMap(sourceFiles).flatMap((f) =>
      allImports(f).filter((s) => s === "@/db" || s.startsWith("@/db/")).map((s) => `${rel(f)} → ${s}`),
    );
    expect(bad).toEqual([]);
  });

  it("nobody declares the roles or spells out a role check by hand outside lib/band/roles", () => {
    const own = path.join("lib", "band", "roles.ts");
    const offenders = ["app", "components", "lib", "db"].flatMap(sourceFiles)
      .filter((f) => rel(f) !== own && !rel(f).startsWith(path.join("db", "seed")))
      .filter((f) => {
        const text = fs.readFileSync(f, "utf8");
        return /\brole\s*[!=]==\s*["'](leader|arranger|player|sub)["']/.test(text) && !/lastLeader|assertAnotherLeader/.test(text)
          || /["']leader["']\s*\|\s*["']arranger["']/.test(text)
          || /\[\s*["']leader["'],\s*["']arranger["']/.test(text);
      })
      .map(rel);
    expect(offenders).toEqual([]);
  });

  it("only lib/offline writes the device's Dexie tables (pages read them and call lib/offline to write)", () => {
    const write = /(getLocalBook\(\)|\bbook)\s*\.\s*\w+\s*\.\s*(put|bulkPut|add|bulkAdd|update|bulkUpdate|delete|bulkDelete|clear|modify)\(|\.transaction\(\s*["']rw/;
    const offenders = ["app", "components", "worker", "lib"].flatMap(sourceFiles)
      .filter((f) => !rel(f).startsWith(path.join("lib", "offline")))
      .filter((f) => write.test(fs.readFileSync(f, "utf8")) || allImports(f).some((s) => s === "@/lib/offline/outbox" && /\benqueue\b/.test(fs.readFileSync(f, "utf8"))))
      .map(rel);
    expect(offenders).toEqual([]);
  });

  it("each entity has one wire shape, in lib/wire.ts: no …Dto or Wire… type for them elsewhere", () => {
    const entity = /\b(interface|type)\s+(Wire(Chart|Setlist|SetlistEntry|Mark|Annotation|Part|Attachment|Member|Membership)|(Chart|Setlist|Mark|Annotation|Part|Attachment|Member)Dto)\b/;
    const offenders = ["app", "components", "lib", "worker"].flatMap(sourceFiles)
      .filter((f) => rel(f) !== path.join("lib", "wire.ts"))
      .filter((f) => entity.test(fs.readFileSync(f, "utf8")))
      .map(rel);
    expect(offenders).toEqual([]);
  });

  it("no exported use case skips its access check (no exported …Unchecked)", () => {
    const offenders = ["app", "lib"].flatMap(sourceFiles)
      .filter((f) => /export\s+(async\s+)?(function|const)\s+\w*Unchecked\b/.test(fs.readFileSync(f, "utf8")))
      .map(rel);
    expect(offenders).toEqual([]);
  });
});
