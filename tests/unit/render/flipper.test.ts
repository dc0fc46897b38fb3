// @vitest-environment happy-dom
import { describe, expect, it } from "vitest";
import { PageFlipper } from "@/components/bandstand/flipper";

function sheets(n: number): HTMLElement {
  const root = document.createElement("div");
  for (let i = 1; i <= n; i++) {
    const s = document.createElement("div");
    s.dataset.sheet = String(i);
    s.appendChild(document.createElementNS("http://www.w3.org/2000/svg", "svg"));
    root.appendChild(s);
  }
  return root;
}

const shownSheets = (root: HTMLElement) => [...root.querySelectorAll<HTMLElement>("[data-sheet].pp-shown")].map((e) => e.dataset.sheet);

describe("PageFlipper", () => {
  it("shows exactly one sheet and stops at both ends", () => {
    const root = sheets(3);
    const live = document.createElement("p");
    const f = new PageFlipper(root, 3, { earlyTurnFractions: [0.5, 0.5, 0.5] }, live, false);
    expect(shownSheets(root)).toEqual(["1"]);
    expect(f.go(-1)).toBe(false);
    expect(f.go(1)).toBe(true);
    expect(f.go(1)).toBe(true);
    expect(f.go(1)).toBe(false);
    expect(shownSheets(root)).toEqual(["3"]);
    expect(root.dataset.page).toBe("3");
    expect(live.textContent).toBe("Page 3 of 3");
  });

  it("passes through an early-turn view that shows copies of both pages", () => {
    const root = sheets(2);
    const f = new PageFlipper(root, 2, { earlyTurnFractions: [0.5, 0.4] }, null, true);
    f.go(1);
    expect(root.dataset.view).toBe("early");
    expect(shownSheets(root)).toEqual([]);
    expect(root.querySelectorAll(".pp-early.pp-shown svg")).toHaveLength(2);
    f.go(1);
    expect(root.dataset.view).toBe("full");
    expect(shownSheets(root)).toEqual(["2"]);
  });

  it("keeps the page when the early turn is switched on", () => {
    const root = sheets(3);
    const f = new PageFlipper(root, 3, { earlyTurnFractions: [0.5, 0.5, 0.5] }, null, false);
    f.go(1);
    f.setEarlyTurn(true);
    expect(root.dataset.page).toBe("2");
    expect(f.view).toEqual({ kind: "full", page: 2 });
  });
});
