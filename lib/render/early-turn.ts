// The sequence of views a reader steps through. With the early turn, between two pages the screen keeps
// the rest of the page being read on top while the next page's first systems rise into place below
// it, so the player can read on while the turn happens; the full turn follows.
export type View =
  | { kind: "full"; page: number }
  | { kind: "early"; top: number; bottom: number };

export function viewSequence(pageCount: number, earlyTurn: boolean): View[] {
  const views: View[] = [];
  for (let p = 1; p <= Math.max(1, pageCount); p++) {
    if (earlyTurn && p > 1) views.push({ kind: "early", top: p - 1, bottom: p });
    views.push({ kind: "full", page: p });
  }
  return views;
}

/** Step forward (+1) or back (−1), stopping at the ends. */
export function step(index: number, delta: number, length: number): number {
  return Math.min(Math.max(index + delta, 0), Math.max(0, length - 1));
}

/** The page a view counts as, for the page counter and `data-page`: an early-turn view counts as the page it leads into. */
export function viewPage(view: View): number {
  return view.kind === "full" ? view.page : view.bottom;
}

export function viewLabel(view: View, pageCount: number): string {
  return view.kind === "full" ? `Page ${view.page} of ${pageCount}` : `Turning to page ${view.bottom} of ${pageCount}`;
}

/** Index of the view showing a page in full. */
export function indexOfPage(views: View[], page: number): number {
  const i = views.findIndex((v) => v.kind === "full" && v.page === page);
  return i < 0 ? 0 : i;
}
