import { describe, expect, it } from "vitest";
import { indexOfPage, step, viewPage, viewSequence } from "@/lib/render/half";

describe("page-turn views", () => {
  it("steps page by page without half turns", () => {
    expect(viewSequence(3, false).map(viewPage)).toEqual([1, 2, 3]);
  });

  it("puts a half view between pages with half turns", () => {
    expect(viewSequence(3, true)).toEqual([
      { kind: "full", page: 1 },
      { kind: "half", top: 1, bottom: 2 },
      { kind: "full", page: 2 },
      { kind: "half", top: 2, bottom: 3 },
      { kind: "full", page: 3 },
    ]);
  });

  it("stops at the first and last view", () => {
    expect(step(0, -1, 3)).toBe(0);
    expect(step(2, 1, 3)).toBe(2);
    expect(step(1, 1, 3)).toBe(2);
  });

  it("finds a page's full view", () => {
    expect(indexOfPage(viewSequence(3, true), 3)).toBe(4);
  });
});
