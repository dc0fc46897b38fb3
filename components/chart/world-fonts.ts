// Fonts for the scripts Academico lacks (public/fonts/world, copied from Noto's npm packages by
// scripts/fonts/world-fonts.ts). Registered only when a page's words need them: a chart in Latin
// letters never fetches the list. Each face carries its unicode range, so the browser fetches just
// the slices the words touch; the service worker's font cache keeps them for offline reading.

interface WorldFace {
  family: string;
  file: string;
  unicodeRange: string;
}

/** The families, in the order the drawn text falls back through them (after Academico). */
export const WORLD_FAMILIES = ["Noto Serif", "Noto Serif JP", "Noto Emoji"] as const;

// Latin, Latin-1 and Latin Extended-A/B, the punctuation and signs our own words use (dashes,
// quotes, "·", "…", "×", "♩", "♭", "♯"), are Academico's and need none of them.
const OWN_CHAR = /[\s\u0020-\u024F\u2010-\u2027\u2030-\u205E\u2669-\u266F]/u;

/** The characters of `text` that need a world font (so Latin slices of those fonts are never fetched). */
export function worldChars(text: string): string {
  return [...new Set(text)].filter((ch) => !OWN_CHAR.test(ch)).join("");
}

let registered: Promise<void> | null = null;

function register(): Promise<void> {
  registered ??= fetch("/fonts/world/faces.json")
    .then((r) => (r.ok ? (r.json() as Promise<WorldFace[]>) : []))
    .then((faces) => {
      for (const f of faces) {
        const face = new FontFace(f.family, `url(/fonts/world/${f.file}) format("woff2")`, { unicodeRange: f.unicodeRange, display: "swap" });
        document.fonts.add(face);
      }
    })
    .catch(() => {
      // Without the list the device's own fonts are the fallback (TEXT_FONT); retry on the next page.
      registered = null;
    });
  return registered;
}

/** Resolves once the slices `text` needs are loaded (at once for Latin text, or where fonts can't load). */
export async function worldFontsFor(text: string): Promise<void> {
  const chars = worldChars(text);
  if (!chars || typeof document === "undefined" || !document.fonts || typeof FontFace === "undefined") return;
  await register();
  await Promise.allSettled(WORLD_FAMILIES.map((family) => document.fonts.load(`16px "${family}"`, chars)));
}
