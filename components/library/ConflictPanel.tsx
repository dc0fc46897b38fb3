"use client";
// Someone published this chart while you were editing. Nothing is overwritten: the current version
// is shown beside yours, and you load it and reapply your change.
import { Button } from "@/components/ui/Button";
import { formatDateTime } from "@/components/ui/labels";
import type { LocalChart } from "@/lib/offline/types";

export type ConflictVersion = Pick<LocalChart, "title" | "composer" | "key" | "meter" | "tempo" | "feel" | "sourceText" | "revision" | "updatedAt" | "updatedBy">;

export function ConflictPanel({ current, mine, onLoad }: { current: ConflictVersion; mine: string; onLoad: () => void }) {
  return (
    <section role="alert" aria-labelledby="conflict-heading" className="rounded-md border-l-4 border-brass bg-brass-light/40 p-4" data-testid="chart-conflict">
      <h2 id="conflict-heading" className="text-lg font-semibold">
        Someone else saved this chart first
      </h2>
      <p className="mt-1 text-sm">
        Version {current.revision}
        {current.updatedBy.name ? ` by ${current.updatedBy.name}` : ""}
        {current.updatedAt ? `, ${formatDateTime(current.updatedAt)}` : ""}. Your edit was not saved. Load their version,
        then make your change again; your text is kept under the chart text box to copy from.
      </p>
      <div className="mt-3 grid gap-3 md:grid-cols-2">
        <div>
          <h3 className="text-sm font-semibold">Their version ({current.title})</h3>
          <pre className="mt-1 max-h-64 overflow-auto rounded border border-paper-dim bg-white p-2 font-mono text-sm" data-testid="conflict-current" tabIndex={0}>
            {current.sourceText}
          </pre>
        </div>
        <div>
          <h3 className="text-sm font-semibold">Your version</h3>
          <pre className="mt-1 max-h-64 overflow-auto rounded border border-paper-dim bg-white p-2 font-mono text-sm" tabIndex={0}>
            {mine}
          </pre>
        </div>
      </div>
      <Button className="mt-3" onClick={onLoad} data-testid="conflict-load">
        Load their version
      </Button>
    </section>
  );
}
