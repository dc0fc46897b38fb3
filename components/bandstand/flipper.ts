// Page turns as a swap of what is visible: every page is already drawn into its own sheet, so a turn
// changes a few attributes and classes and the browser paints it in the next frame. Nothing here
// re-renders React.
import { step, viewLabel, viewPage, viewSequence, type View } from "@/lib/render/early-turn";

export interface SheetGeometry {
  /** Where each page's early-turn split sits, as a fraction of the page's height (index 0 = page 1). */
  earlyTurnFractions: number[];
}

export class PageFlipper {
  private views: View[];
  private index = 0;
  private earlyHost: HTMLElement | null = null;
  private preparedEarly = -1;

  constructor(
    private readonly root: HTMLElement,
    private readonly pageCount: number,
    private readonly geometry: SheetGeometry,
    private readonly live: HTMLElement | null,
    earlyTurn: boolean,
    private readonly onChange?: (view: View, index: number, views: View[]) => void,
  ) {
    this.views = viewSequence(pageCount, earlyTurn);
    this.apply(false);
  }

  get view(): View {
    return this.views[this.index] ?? { kind: "full", page: 1 };
  }

  get position(): { index: number; count: number } {
    return { index: this.index, count: this.views.length };
  }

  /** Moves one view forward (+1) or back (−1); false at the ends. */
  go(delta: number): boolean {
    const next = step(this.index, delta, this.views.length);
    if (next === this.index) return false;
    this.index = next;
    this.apply(true);
    return true;
  }

  goToPage(page: number): void {
    const i = this.views.findIndex((v) => v.kind === "full" && v.page === page);
    if (i >= 0 && i !== this.index) {
      this.index = i;
      this.apply(true);
    }
  }

  setEarlyTurn(on: boolean): void {
    const page = viewPage(this.view);
    this.views = viewSequence(this.pageCount, on);
    this.index = Math.max(0, this.views.findIndex((v) => v.kind === "full" && v.page === page));
    this.preparedEarly = -1;
    this.apply(false);
  }

  private sheet(page: number): HTMLElement | null {
    return this.root.querySelector<HTMLElement>(`[data-sheet="${page}"]`);
  }

  private apply(announce: boolean): void {
    const view = this.view;
    const shown = view.kind === "full" ? view.page : -1;
    for (const el of this.root.querySelectorAll<HTMLElement>("[data-sheet]")) {
      el.classList.toggle("pp-shown", Number(el.dataset.sheet) === shown);
    }
    if (view.kind === "early") this.showEarly(this.index);
    else this.earlyHost?.classList.remove("pp-shown");
    this.root.dataset.page = String(viewPage(view));
    this.root.dataset.view = view.kind;
    if (announce && this.live) this.live.textContent = viewLabel(view, this.pageCount);
    this.onChange?.(view, this.index, this.views);
    // Build the next early-turn view while the player reads, so that turn is a swap too.
    const ahead = this.views[this.index + 1];
    if (ahead?.kind === "early") setTimeout(() => this.prepareEarly(this.index + 1), 0);
  }

  private showEarly(index: number): void {
    this.prepareEarly(index);
    this.earlyHost?.classList.add("pp-shown");
  }

  private prepareEarly(index: number): void {
    const view = this.views[index];
    if (view?.kind !== "early" || this.preparedEarly === index) return;
    const top = this.sheet(view.top)?.querySelector("svg");
    const bottom = this.sheet(view.bottom)?.querySelector("svg");
    if (!top || !bottom) return;
    if (!this.earlyHost) {
      this.earlyHost = document.createElement("div");
      this.earlyHost.className = "pp-early";
      this.earlyHost.setAttribute("aria-hidden", "true");
      this.root.appendChild(this.earlyHost);
    }
    const split = (p: number) => this.geometry.earlyTurnFractions[p - 1] ?? 0.5;
    const upper = document.createElement("div");
    upper.className = "pp-early-rest";
    upper.style.height = `${(1 - split(view.top)) * 100}%`;
    const topClone = top.cloneNode(true) as SVGSVGElement;
    topClone.style.transform = `translateY(-${split(view.top) * 100}%)`;
    upper.appendChild(wrap(topClone, 1 / (1 - split(view.top))));
    // The next page's first systems, under a thin brass rule with a small "next" in the margin;
    // CSS makes them rise into place each time this view is shown.
    const lower = document.createElement("div");
    lower.className = "pp-early-next";
    lower.style.height = `${split(view.bottom) * 100}%`;
    const rising = wrap(bottom.cloneNode(true) as SVGSVGElement, 1 / split(view.bottom));
    rising.classList.add("pp-early-rise");
    const marker = document.createElement("span");
    marker.className = "pp-early-marker";
    marker.textContent = "next";
    lower.append(rising, marker);
    this.earlyHost.replaceChildren(upper, lower);
    this.preparedEarly = index;
  }
}

/** A box as tall as a whole page (relative to its clipped slot) holding a copy of the page. */
function wrap(svg: SVGSVGElement, scale: number): HTMLElement {
  const box = document.createElement("div");
  box.style.height = `${scale * 100}%`;
  box.style.position = "relative";
  svg.style.position = "absolute";
  svg.style.inset = "0";
  svg.style.width = "100%";
  svg.style.height = "100%";
  box.appendChild(svg);
  return box;
}
