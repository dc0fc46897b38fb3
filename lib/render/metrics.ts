// Deterministic size estimates used by the layout, so the same chart always gives the same pages
// and chord symbols never collide. Estimates err wide: a drawn symbol is never wider than its box.
import { chordDisplayParts } from "@/lib/music/chord";

/** Staff space in page units (VexFlow's default), and the heights that make up a system's slot. */
export const STAFF_SPACE = 10;
export const STAFF_HEIGHT = 4 * STAFF_SPACE;
export const MARGIN = 16;
/** Gap between two chord symbols in one bar, and how far a bar's last symbol may reach past its end. */
export const CHORD_GAP = 8;
export const CHORD_END_SLACK = 4;
export const BAR_PAD_START = 10;
export const BAR_PAD_END = 8;
export const MIN_BEAT_SPACE = 20;
/** Rehearsal-label font size, and the width of its box (the engraver draws the box to this). */
export const LABEL_FONT_SIZE = 15;
export function labelBoxWidth(label: string, size = LABEL_FONT_SIZE): number {
  return Math.ceil(textWidth(label, size) * 0.9) + 12;
}
/** The ending's label ("1.", "1, 2.") at the bracket's start: its size, and the room it takes from the bracket's left end. */
export const ENDING_LABEL_SIZE = 14;
export function endingLabelRoom(label: string): number {
  return 5 + Math.ceil(textWidth(label, ENDING_LABEL_SIZE)) + 6;
}
/** Superscript size relative to the chord font. */
export const SUPERSCRIPT_SCALE = 0.62;

export interface SymbolParts {
  root: string;
  accidental: string;
  quality: string;
  superscript: string;
  bass: string;
}

/**
 * A symbol split for drawing: root, accidental, quality at full size; extensions and alterations
 * raised and smaller; an optional slash bass. "N.C." and anything unreadable stay whole in `root`.
 */
export function splitSymbol(symbol: string): SymbolParts {
  const m = /^([A-G])([b#♭♯]?)(maj|min|dim|aug|sus|m|-|ø|°|o|\+|Δ)?([^/]*)(?:\/(.+))?$/.exec(symbol.trim());
  if (!m) return { root: symbol, accidental: "", quality: "", superscript: "", bass: "" };
  const [, root = "", acc = "", qual = "", rest = "", bass = ""] = m;
  // "sus" and "maj" carry their number with them in the raised part.
  const quality = qual === "sus" || qual === "maj" ? "" : qual;
  const superscript = (qual === "sus" || qual === "maj" ? qual : "") + rest;
  return { root, accidental: prettyAccidental(acc), quality, superscript: prettyAlterations(superscript), bass: prettyAccidentalNote(bass) };
}

function prettyAccidental(a: string): string {
  return a === "b" ? "♭" : a === "#" ? "♯" : a;
}

function prettyAccidentalNote(note: string): string {
  return note.replace(/^([A-G])b/, "$1♭").replace(/^([A-G])#/, "$1♯");
}

/** b9 → ♭9, #11 → ♯11 inside extensions. */
export function prettyAlterations(s: string): string {
  return s.replace(/b(?=\d)/g, "♭").replace(/#(?=\d)/g, "♯");
}

/** Width of one character in em, by class: caps, narrow marks, digits and lower case, accidentals. */
/** Ideographs, kana, Hangul and full-width forms take a whole em; emoji a little more. */
const WIDE = /[\u1100-\u115F\u2E80-\uA4CF\uAC00-\uD7A3\uF900-\uFAFF\uFE30-\uFE4F\uFF00-\uFF60\uFFE0-\uFFE6]/u;
const EMOJI = /\p{Extended_Pictographic}/u;

function charEm(ch: string): number {
  if (EMOJI.test(ch)) return 1.2;
  if (WIDE.test(ch)) return 1.0;
  if (/[MW]/.test(ch)) return 1.0;
  if (/[A-Z]/.test(ch)) return 0.76;
  if (/[mw]/.test(ch)) return 0.95;
  if (/[il1.()\/|]/.test(ch)) return 0.4;
  if (/[♭♯°ø+Δ-]/.test(ch)) return 0.62;
  return 0.6;
}

export function textWidth(text: string, fontSize: number): number {
  let em = 0;
  for (const ch of text) em += charEm(ch);
  return em * fontSize;
}

/** The parts as drawn: the music core's split, or our own when the core cannot read the symbol. */
export function displayParts(symbol: string): SymbolParts {
  try {
    return chordDisplayParts(symbol);
  } catch {
    return splitSymbol(symbol);
  }
}

const partsCache = new Map<string, SymbolParts>();

function cachedParts(symbol: string): SymbolParts {
  let p = partsCache.get(symbol);
  if (!p) {
    p = displayParts(symbol);
    // A book has a few hundred distinct symbols; the bound only guards against pathological input.
    if (partsCache.size > 5000) partsCache.clear();
    partsCache.set(symbol, p);
  }
  return p;
}

/** Estimated drawn width of a chord symbol at a font size, following its display parts. */
export function estimateSymbolWidth(symbol: string, fontSize: number): number {
  const p = cachedParts(symbol);
  const main = textWidth(p.root + p.accidental + p.quality, fontSize);
  const sup = textWidth(p.superscript, fontSize * SUPERSCRIPT_SCALE);
  const bass = p.bass ? textWidth("/" + p.bass, fontSize) : 0;
  // Text that is not a chord symbol (a stray word) is set whole and bold; leave it extra room.
  const unread = !/^[A-G]/.test(symbol) && symbol !== "N.C." ? 1.3 : 1;
  return Math.ceil((main + sup + bass + (p.superscript ? 2 : 0)) * unread);
}

/** Width of a line's opening: clef, key signature, and the time signature on the chart's first line. */
export function openingWidth(keyAccidentals: number, withTime: boolean, withClef = true): number {
  return (withClef ? 36 : 0) + (keyAccidentals > 0 ? keyAccidentals * 11 + 6 : 0) + (withTime ? 26 : 0);
}
