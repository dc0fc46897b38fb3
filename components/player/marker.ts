// Marks the bar being played on the drawn chart: a tinted box behind the bar's group in the SVG, and
// data-playing / data-playing-bar on the chart-page element for outside checks. Plain DOM: a bar
// change must not wait for (or cause) a React render.
const BOX = "pp-playing-box";

export class BarMarker {
  private marked: Element | null = null;

  /** `index`: the performance bar drawn; `number`: the 1-based bar as played (null during the count-in). */
  show(host: HTMLElement | null, index: number | null, number: number | null): { page: number | null } {
    if (!host) return { page: null };
    host.dataset.playing = "true";
    if (number === null) delete host.dataset.playingBar;
    else host.dataset.playingBar = String(number);
    this.clear();
    if (index === null) return { page: null };
    const group = host.querySelector<SVGGElement>(`[data-sheet] g[data-bar="${index}"]`);
    if (!group) return { page: null };
    const box = group.getBBox();
    const rect = document.createElementNS("http://www.w3.org/2000/svg", "rect");
    rect.setAttribute("class", BOX);
    rect.setAttribute("x", String(box.x - 2));
    rect.setAttribute("y", String(box.y - 2));
    rect.setAttribute("width", String(box.width + 4));
    rect.setAttribute("height", String(box.height + 4));
    rect.setAttribute("rx", "4");
    group.insertBefore(rect, group.firstChild);
    group.classList.add("pp-playing");
    this.marked = group;
    const sheet = group.closest<HTMLElement>("[data-sheet]");
    return { page: sheet ? Number(sheet.dataset.sheet) : null };
  }

  clear(): void {
    if (!this.marked) return;
    this.marked.querySelector(`.${BOX}`)?.remove();
    this.marked.classList.remove("pp-playing");
    this.marked = null;
  }

  done(host: HTMLElement | null): void {
    this.clear();
    if (!host) return;
    delete host.dataset.playing;
    delete host.dataset.playingBar;
  }
}
