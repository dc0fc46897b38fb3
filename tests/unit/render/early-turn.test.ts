import { describe, expect, it } from "vitest";
import { indexOfPage, step, viewPage, viewSequence } from "@/lib/render/early-turn";

describe("page-turn views", () => {
  it("steps page by page without the early turn", () => {
    expect(viewSequence(3, false).map(viewPage)).toEqual([1, 2, 3]);
  });

  it("puts an early-turn view between pages with the early turn on", () => {
    expect(viewSequence(3, true)).toEqual([
      { kind: "full", page: 1 },
      { kind: "early", top: 1, bottom: 2 },
      { kind: "full", page: 2 },
      { kind: "early", top: 2, bottom: 3 },
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
