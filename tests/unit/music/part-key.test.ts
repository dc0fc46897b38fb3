import { describe, expect, it } from "vitest";
import { partKeyInWords } from "@/lib/music/part-key";

describe("item 18: set lists name each tune's key in the player's part", () => {
  it("reads a concert part at concert pitch, with no label", () => {
    expect(partKeyInWords("Ab", "concert")).toBe("A♭");
    expect(partKeyInWords("F#m", "concert-bass")).toBe("F♯m");
  });
  it("names the written key first and labels concert", () => {
    // Alto (E♭) reads a major 6th above concert; tenor/trumpet (B♭) a major 2nd; horn (F) a perfect 5th (common practice).
    expect(partKeyInWords("Ab", "eb")).toBe("F (concert A♭)");
    expect(partKeyInWords("Eb", "bb")).toBe("F (concert E♭)");
    expect(partKeyInWords("Bb", "f")).toBe("F (concert B♭)");
    expect(partKeyInWords("Cm", "bb")).toBe("Dm (concert Cm)");
  });
});
