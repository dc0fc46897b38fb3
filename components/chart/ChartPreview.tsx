// What a page says before its engraving is ready: the title block and every chord name as plain SVG
// text at the positions the layout gave them, in a box of the page's own size, so the chart can be
// read at once and nothing moves when the engraving takes its place.
import type { Page } from "@/lib/render/types";
import { displayParts } from "@/lib/render/metrics";
import type { PageText } from "./engrave";

const FONT = "Academico, Georgia, serif";

/** The five lines of every system (VexFlow's 10-unit staff space), as one path. */
function staffLines(page: Page): string {
  const d: string[] = [];
  for (const s of page.systems) {
    const first = s.bars[0];
    const last = s.bars[s.bars.length - 1];
    if (!first || !last) continue;
    for (let k = 0; k < 5; k++) d.push(`M${first.x} ${s.staffY + k * 10}H${last.x + last.width}`);
  }
  return d.join("");
}

export function ChartPreview({ page, text }: { page: Page; text: PageText }) {
  const header = page.header;
  return (
    <svg
      viewBox={`0 0 ${page.width} ${page.height}`}
      className="pp-preview"
      aria-hidden="true"
      fill="currentColor"
      fontFamily={FONT}
      data-testid="chart-preview"
    >
      <text x={page.width - 12} y={18} fontSize={16} textAnchor="end" fontWeight="bold">
        {text.partLabel}
      </text>
      {header ? (
        <>
          <text x={header.compact ? 16 : page.width / 2} y={header.y + (header.compact ? 20 : 30)} fontSize={header.compact ? 22 : 28} fontWeight="bold" textAnchor={header.compact ? "start" : "middle"}>
            {text.title}
          </text>
          <text x={16} y={header.y + (header.compact ? 38 : 62)} fontSize={header.compact ? 13 : 15} fontWeight="bold">
            {text.details}
          </text>
        </>
      ) : (
        <text x={12} y={18} fontSize={14}>{`${text.title} · ${page.number}`}</text>
      )}
      <path d={staffLines(page)} stroke="currentColor" strokeOpacity={0.3} strokeWidth={1} fill="none" />
      {page.systems.flatMap((system) =>
        system.bars.flatMap((b) =>
          b.chords.map((box, i) => {
            const p = displayParts(box.symbol);
            return (
              <text key={`${b.bar.index}:${i}`} x={box.x} y={system.staffY - 12} fontSize={box.size} fontWeight="bold">
                {box.symbol === "N.C." ? "N.C." : `${p.root}${p.accidental}${p.quality}${p.superscript}${p.bass ? `/${p.bass}` : ""}`}
              </text>
            );
          }),
        ),
      )}
    </svg>
  );
}
