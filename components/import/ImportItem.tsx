"use client";
// One file in an import: its progress, then the preview of what was read and skipped, then saved.
import Link from "next/link";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import type { Chart } from "@/lib/chart/model";
import type { ImportReport } from "@/lib/musicxml";

export interface PreviewData {
  fileName: string;
  chart: Chart;
  sourceText: string;
  report: ImportReport;
}

export type ItemState =
  | { phase: "uploading"; progress: number }
  | { phase: "refused"; message: string }
  | { phase: "ready"; preview: PreviewData; title: string; saving?: boolean; error?: string; planLimit?: boolean }
  | { phase: "saved"; preview: PreviewData; chartId: string; title: string };

export interface ImportEntry {
  id: string;
  fileName: string;
  state: ItemState;
}

export function ImportItem({ entry, bandId, onTitle, onSave }: { entry: ImportEntry; bandId: string; onTitle: (t: string) => void; onSave: () => void }) {
  const s = entry.state;
  return (
    <li className="rounded-lg border border-ink-soft bg-white p-4" data-testid="import-item" data-phase={s.phase}>
      <h2 className="break-all text-lg font-semibold">{entry.fileName}</h2>
      {s.phase === "uploading" ? (
        <div className="mt-2">
          <label className="text-sm text-ink-muted" htmlFor={`p-${entry.id}`}>
            {s.progress < 1 ? "Uploading…" : "Reading the file…"}
          </label>
          <progress id={`p-${entry.id}`} className="block w-full" max={1} value={s.progress} />
        </div>
      ) : null}
      {s.phase === "refused" ? (
        <Notice kind="error" title="Not imported" className="mt-2" testId="import-refused">
          {s.message}
        </Notice>
      ) : null}
      {s.phase === "ready" || s.phase === "saved" ? <Preview preview={s.preview} /> : null}
      {s.phase === "ready" ? (
        <div className="mt-4 flex flex-col gap-3">
          <Field label="Title" value={s.title} maxLength={200} onChange={(e) => onTitle(e.target.value)} data-testid="import-title" />
          {s.error ? (
            <Notice kind="error" testId="import-save-error">
              {s.error}{" "}
              {s.planLimit ? (
                <Link className="underline" href={`/bands/${encodeURIComponent(bandId)}/plan`}>
                  See the band&apos;s plan
                </Link>
              ) : null}
            </Notice>
          ) : null}
          <Button onClick={onSave} disabled={s.saving || !s.title.trim()} data-testid="import-save" className="self-start">
            {s.saving ? "Saving…" : "Save to the book"}
          </Button>
        </div>
      ) : null}
      {s.phase === "saved" ? (
        <Notice kind="success" className="mt-3" testId="import-saved">
          Saved as{" "}
          <Link className="font-semibold underline" href={`/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(s.chartId)}`} data-testid="import-open">
            {s.title}
          </Link>
          .
        </Notice>
      ) : null}
    </li>
  );
}

function Preview({ preview }: { preview: PreviewData }) {
  const { report } = preview;
  const changed = report.changed ?? [];
  return (
    <div className="mt-3 grid gap-4 md:grid-cols-2">
      {changed.length ? (
        <Notice kind="info" title="Imported with changes" className="md:col-span-2" testId="import-changed">
          <p>Chart text could not hold everything in this file as written, so these bars were changed. The rest is as the file has it.</p>
          <ul className="mt-1 list-disc pl-5 text-sm">
            {changed.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
      <section aria-label="What was read">
        <h3 className="font-semibold">Read</h3>
        <ul className="mt-1 list-disc pl-5 text-sm" data-testid="import-read">
          {report.read.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </section>
      <section aria-label="What was left out">
        <h3 className="font-semibold">Left out</h3>
        {report.skipped.length ? (
          <ul className="mt-1 list-disc pl-5 text-sm" data-testid="import-skipped">
            {report.skipped.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        ) : (
          <p className="mt-1 text-sm text-ink-muted">Nothing: every element was read.</p>
        )}
      </section>
      <details className="md:col-span-2">
        <summary className="cursor-pointer font-semibold">Chart text to be saved</summary>
        <pre className="mt-2 max-h-80 overflow-auto rounded-md bg-paper-dim p-3 text-sm" data-testid="import-text">
          {preview.sourceText}
        </pre>
      </details>
    </div>
  );
}
