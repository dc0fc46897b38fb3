import { describe, expect, it } from "vitest";
import { estimateSymbolWidth, splitSymbol, textWidth } from "@/lib/render/metrics";
import { keyFifths } from "@/lib/render/keys";

describe("chord-symbol estimates", () => {
  it("raises extensions and alterations, keeps root, accidental and quality full size", () => {
    expect(splitSymbol("Bb7sus4")).toEqual({ root: "B", accidental: "♭", quality: "", superscript: "7sus4", bass: "" });
    expect(splitSymbol("Ebm7b5/A")).toEqual({ root: "E", accidental: "♭", quality: "m", superscript: "7♭5", bass: "A" });
    expect(splitSymbol("N.C.").root).toBe("N.C.");
  });

  it("grows with the symbol and the font size", () => {
    expect(estimateSymbolWidth("C7(b9)", 24)).toBeGreaterThan(estimateSymbolWidth("C7", 24));
    expect(estimateSymbolWidth("C7", 30)).toBeGreaterThan(estimateSymbolWidth("C7", 24));
  });
});

describe("key signatures", () => {
  // Gardner 1912 / MusicXML <fifths> (REFERENCES.md): F one flat, Eb three flats, Cm three flats, A major three sharps.
  it.each([["F", -1], ["Eb", -3], ["Cm", -3], ["A", 3], ["C", 0], ["F#m", 3]])("%s has %d fifths", (k, f) => {
    expect(keyFifths(k)).toBe(f);
  });
});

describe("item 14: titles in other scripts and emoji are measured at their width", () => {
  it("counts an ideograph or kana as a whole em and an emoji as more, so a fitted title stays on the page", () => {
    // CJK characters are full-width (one em square) in every CJK font: Unicode East Asian Width "W" (UAX #11).
    expect(textWidth("夜の港", 10)).toBeCloseTo(30);
    expect(textWidth("🎷", 10)).toBeGreaterThan(10);
    expect(textWidth("夜の港", 10)).toBeGreaterThan(textWidth("abc", 10));
  });
});
