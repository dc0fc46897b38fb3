// What an import read but did not keep, counted and located: each line names the bars (the file's own
// measure numbers) so the arranger can find them in the notation program.
export class Skipped {
  private readonly items = new Map<string, { count: number; bars: string[] }>();

  /** Counts `n` of `what`, at bar `bar` when it has one. */
  add(what: string, bar?: string, n = 1): void {
    const item = this.items.get(what) ?? { count: 0, bars: [] };
    item.count += n;
    if (bar !== undefined && !item.bars.includes(bar)) item.bars.push(bar);
    this.items.set(what, item);
  }

  /** A line said once, with no count ("other parts: …"). */
  note(what: string): void {
    if (!this.items.has(what)) this.items.set(what, { count: 0, bars: [] });
  }

  has(what: string): boolean {
    return this.items.has(what);
  }

  lines(): string[] {
    return [...this.items.entries()].map(([what, { count, bars }]) => {
      const n = count > 0 ? ` (${count})` : "";
      return `${what}${n}${bars.length ? ` — ${barList(bars)}` : ""}`;
    });
  }
}

/** "bar 3", "bars 1, 2 and 5", "bars 1–12 and 14" for long runs of consecutive numbers. */
export function barList(bars: string[]): string {
  if (bars.length === 1) return `bar ${bars[0]}`;
  const parts: string[] = [];
  for (let i = 0; i < bars.length; ) {
    let j = i;
    while (j + 1 < bars.length && Number(bars[j + 1]) === Number(bars[j]) + 1) j++;
    if (j - i >= 2) parts.push(`${bars[i]}–${bars[j]}`);
    else parts.push(...bars.slice(i, j + 1));
    i = j + 1;
  }
  const last = parts.pop();
  return `bars ${parts.length ? `${parts.join(", ")} and ${last}` : last}`;
}
