// The facts about a chart a player checks before the count-off. Placed on the chart page.
import type { LocalChart } from "@/lib/offline/types";
import { formatDateTime } from "@/components/ui/labels";
import { keyInWords } from "@/lib/music/part-key";
import { UpdatedMark } from "./LibraryTable";

export function ChartMeta({ chart }: { chart: LocalChart }) {
  const items: Array<[string, string]> = [
    ["Composer", chart.composer || "—"],
    ["Concert key", keyInWords(chart.key)],
    ["Time", chart.meter],
    ["Tempo", chart.tempo ? `${chart.tempo} bpm` : "—"],
    ["Feel", chart.feel || "—"],
  ];
  return (
    <section aria-label="About this chart" className="rounded-lg border border-paper-dim bg-white p-4" data-testid="chart-meta">
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 sm:grid-cols-3 lg:grid-cols-5">
        {items.map(([term, value]) => (
          <div key={term}>
            <dt className="text-sm text-ink-muted">{term}</dt>
            <dd className="font-semibold" data-testid={`meta-${term.toLowerCase().replace(/\s+/g, "-")}`}>
              {value}
            </dd>
          </div>
        ))}
      </dl>
      <p className="mt-3 text-sm text-ink-muted">
        Version {chart.revision || "not yet published"}
        {chart.updatedAt ? (
          <>
            {" "}
            · last changed <time dateTime={chart.updatedAt}>{formatDateTime(chart.updatedAt)}</time>
          </>
        ) : null}
        {chart.updatedBy.name ? ` by ${chart.updatedBy.name}` : ""}
        {chart.unseen ? <UpdatedMark /> : null}
      </p>
    </section>
  );
}
