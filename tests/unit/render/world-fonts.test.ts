// Issue 14 (item 14 of issue 16): the fonts for other scripts are asked for only by characters that need them.
import { describe, expect, it } from "vitest";
import { worldChars } from "@/components/chart/world-fonts";

describe("item 14: only characters outside Latin ask for the served world fonts", () => {
  it("asks nothing for a header in Latin letters with our own signs (♩ ♭ ♯ · – × …)", () => {
    expect(worldChars("Lanternfish · medium swing · ♩ = 160 · Key of E♭ · F♯ part – Odile Marchbank × … “Baía”")).toBe("");
  });

  it("asks for Greek, Cyrillic, kana, kanji and emoji, each character once, never the Latin around them", () => {
    expect(worldChars("Ωδή — 夜の港 🎷 Ночь, Ωδή")).toBe("Ωδή夜の港🎷Ночь");
  });
});
