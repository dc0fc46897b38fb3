"use client";
// "What changed" on the chart page and the bandstand view: a few plain lines from the revision the
// player last read to the one on this device, in their written key, and the two side by side.
import { useMemo, useState } from "react";
import { describeChanges, prettySymbol } from "@/lib/chart/changes";
import type { Chart } from "@/lib/chart/model";
import { transposeChord } from "@/lib/music";
import { cx } from "@/components/ui/cx";
import { useChangeSince } from "./useChangeSince";

interface Props {
  chartId: string;
  instrument: string;
  /** Tonight's concert key when the set list moves the tune. */
  tonightKey?: string | null;
  /** Dark bandstand look instead of the page look. */
  stage?: boolean;
}

function rows(chart: Chart, instrument: string): { label: string; bars: string[] }[] {
  const read = (s: string) => {
    try {
      return prettySymbol(transposeChord(s, chart.key, instrument));
    } catch {
      return s;
    }
  };
  return chart.sections.map((s) => ({ label: s.label, bars: s.bars.map((b) => (b.simile ? "%" : b.chords.map((c) => read(c.symbol)).join(" ") || "–")) }));
}

function Column({ title, chart, instrument }: { title: string; chart: Chart; instrument: string }) {
  return (
    <div className="min-w-0 flex-1">
      <h3 className="mb-1 font-semibold">{title}</h3>
      {rows(chart, instrument).map((s, i) => (
        <p key={i} className="mb-1 break-words font-mono text-sm">
          <span className="font-semibold">{s.label}:</span> | {s.bars.join(" | ")} |
        </p>
      ))}
    </div>
  );
}

export function ChangeSummary({ chartId, instrument, tonightKey, stage }: Props) {
  const since = useChangeSince(chartId);
  const [sideBySide, setSideBySide] = useState(false);
  const lines = useMemo(() => (since?.before ? describeChanges(since.before, since.after, { instrument, tonightKey }) : null), [since, instrument, tonightKey]);
  if (!since) return null;
  return (
    <section
      aria-label="What changed since you last read it"
      data-testid="change-summary"
      data-from={since.from}
      data-to={since.to}
      className={cx("rounded-md border p-3 text-sm", stage ? "border-amber-300/60 bg-black/85 text-amber-100" : "border-brass bg-paper-dim")}
    >
      <p className="font-semibold">
        Changed since you read it (revision {since.from} → {since.to}
        {since.author ? `, by ${since.author}` : ""}):
      </p>
      {lines === null ? (
        <p>The earlier revision is not on this device, so only the new one can be shown.</p>
      ) : lines.length === 0 ? (
        <p>Nothing you read changed (notes or spelling only).</p>
      ) : (
        <ul className="ml-5 list-disc">
          {lines.map((l, i) => (
            <li key={i} data-kind={l.kind}>
              {l.text}
            </li>
          ))}
        </ul>
      )}
      {since.before ? (
        <button type="button" className="mt-2 underline" aria-expanded={sideBySide} onClick={() => setSideBySide((v) => !v)} data-testid="side-by-side">
          {sideBySide ? "Hide the previous revision" : "Previous revision side by side"}
        </button>
      ) : null}
      {sideBySide && since.before ? (
        <div className="mt-2 flex flex-col gap-3 sm:flex-row" data-testid="revision-compare">
          <Column title={`Revision ${since.from}`} chart={since.before} instrument={instrument} />
          <Column title={`Revision ${since.to} (now)`} chart={since.after} instrument={instrument} />
        </div>
      ) : null}
    </section>
  );
}
