// Copies the text fonts for scripts Academico lacks (Greek, Cyrillic, Vietnamese and other extended
// Latin, Japanese kana and kanji, emoji) from their npm packages into public/fonts/world/, with a list
// of faces and their unicode ranges (faces.json). The app registers the faces only when a page's text
// needs them, and the browser then fetches only the slices whose range the text touches. Run by
// `npm run build` and `npm run dev`; the output is not kept in git.
import fs from "node:fs";
import path from "node:path";

interface Source {
  pkg: string;
  /** Subset names (the part of the file name after the family) to leave out. */
  skip?: RegExp;
}

const SOURCES: Source[] = [
  // Latin itself is Academico's; the serif's mathematical subset is not text a chart header holds.
  { pkg: "@fontsource/noto-serif", skip: /-(latin|math)-400/ },
  { pkg: "@fontsource/noto-serif-jp" },
  { pkg: "@fontsource/noto-emoji" },
];

export interface WorldFace {
  family: string;
  file: string;
  unicodeRange: string;
}

const OUT = path.join("public", "fonts", "world");

function facesOf(source: Source): WorldFace[] {
  const dir = path.join("node_modules", source.pkg);
  const css = fs.readFileSync(path.join(dir, "400.css"), "utf8");
  const faces: WorldFace[] = [];
  for (const block of css.match(/@font-face\s*{[^}]*}/g) ?? []) {
    const family = /font-family:\s*'([^']+)'/.exec(block)?.[1];
    const file = /url\(\.\/files\/([^)]+\.woff2)\)/.exec(block)?.[1];
    const unicodeRange = /unicode-range:\s*([^;]+);/.exec(block)?.[1]?.trim();
    if (!family || !file || !unicodeRange || source.skip?.test(file)) continue;
    fs.copyFileSync(path.join(dir, "files", file), path.join(OUT, file));
    faces.push({ family, file, unicodeRange });
  }
  fs.copyFileSync(path.join(dir, "LICENSE"), path.join(OUT, `LICENSE-${path.basename(source.pkg)}.txt`));
  return faces;
}

fs.rmSync(OUT, { recursive: true, force: true });
fs.mkdirSync(OUT, { recursive: true });
const faces = SOURCES.flatMap(facesOf);
fs.writeFileSync(path.join(OUT, "faces.json"), JSON.stringify(faces));
console.log(`world fonts: ${faces.length} faces in ${OUT}`);
