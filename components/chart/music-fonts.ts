// The fonts the engraving uses, as files under public/fonts (precached by the service worker), loaded
// through the FontFace API when a page first draws: no font travels inside a script, and pages that
// never draw a chart never fetch one. "Pedalpoint Music" is the cut of Bravura made by
// scripts/fonts/music-font.py (the licence reserves Bravura's name for the whole font); Academico is
// VexFlow's own text font, as its package ships it.
export const MUSIC_FONT = "Pedalpoint Music";
export const TEXT_FONT_FAMILY = "Academico";

const FACES: { family: string; url: string; descriptors: FontFaceDescriptors }[] = [
  { family: MUSIC_FONT, url: "/fonts/pedalpoint-music.woff2", descriptors: { display: "block" } },
  { family: TEXT_FONT_FAMILY, url: "/fonts/academico.woff2", descriptors: { display: "swap" } },
  { family: TEXT_FONT_FAMILY, url: "/fonts/academico-bold.woff2", descriptors: { display: "swap", weight: "bold" } },
];

let ready: Promise<void> | null = null;

/** Starts loading the music and text fonts (once) and resolves when they are usable or have failed. */
export function musicFontsReady(): Promise<void> {
  ready ??= (async () => {
    if (typeof document === "undefined" || typeof FontFace === "undefined" || !document.fonts) return;
    await Promise.allSettled(
      FACES.map(async ({ family, url, descriptors }) => {
        const face = new FontFace(family, `url(${url}) format("woff2")`, descriptors);
        document.fonts.add(face);
        await face.load();
      }),
    );
  })();
  return ready;
}
