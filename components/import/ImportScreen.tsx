"use client";
// Bring charts in from MusicXML: several files at once, each uploaded with progress, previewed
// (what was read, what was left out) and saved only when the arranger says so.
import Link from "next/link";
import { useRef, useState } from "react";
import { Notice } from "@/components/ui/Notice";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { syncNow, useMembership, useOnline } from "@/lib/offline/hooks";
import { useBandRoute } from "@/lib/offline/route";
import { ImportItem, type ImportEntry, type ItemState, type PreviewData } from "./ImportItem";
import { RIGHTS_CAUTION, uploadFile } from "./upload";
import { apiErrorOf } from "@/lib/api-error";
import { can } from "@/lib/band/roles";

export function ImportScreen() {
  const { bandId } = useBandRoute();
  const membership = useMembership(bandId ?? "");
  const online = useOnline();
  const [entries, setEntries] = useState<ImportEntry[]>([]);
  const counter = useRef(0);

  if (!bandId) return null;
  const base = `/api/bands/${encodeURIComponent(bandId)}/imports`;
  const canImport = can(membership?.role, "editCharts");
  const update = (id: string, fn: (s: ItemState) => ItemState) => setEntries((es) => es.map((e) => (e.id === id ? { ...e, state: fn(e.state) } : e)));

  const readFiles = async (files: FileList | null) => {
    const list = [...(files ?? [])];
    const fresh = list.map((f) => ({ id: `f${++counter.current}`, fileName: f.name, state: { phase: "uploading", progress: 0 } as ItemState }));
    setEntries((es) => [...fresh, ...es]);
    // one at a time: a shared 2-core server, and the order on screen stays the order of the files
    for (const [i, file] of list.entries()) {
      const id = fresh[i]!.id;
      try {
        const answer = await uploadFile(base, file, (progress) => update(id, () => ({ phase: "uploading", progress })));
        const preview = (answer.body as { preview?: PreviewData } | null)?.preview;
        update(id, () =>
          answer.status === 200 && preview
            ? { phase: "ready", preview, title: preview.chart.title }
            : { phase: "refused", message: apiErrorOf(answer.body, `The server refused this file (${answer.status}).`).message },
        );
      } catch (err) {
        update(id, () => ({ phase: "refused", message: err instanceof Error ? err.message : "The upload failed." }));
      }
    }
  };

  const save = async (entry: ImportEntry) => {
    const s = entry.state;
    if (s.phase !== "ready") return;
    update(entry.id, () => ({ ...s, saving: true, error: undefined }));
    const c = s.preview.chart;
    const res = await fetch(`${base}/confirm`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({
        fileName: s.preview.fileName, title: s.title.trim(), composer: c.composer, key: c.key, meter: `${c.meter.beats}/${c.meter.unit}`,
        tempo: c.tempo, feel: c.feel, sourceText: s.preview.sourceText,
      }),
    }).catch(() => null);
    const body: unknown = res ? await res.json().catch(() => null) : null;
    const chartId = (body as { chart?: { id?: string } } | null)?.chart?.id;
    if (res?.status === 201 && chartId) {
      update(entry.id, () => ({ phase: "saved", preview: s.preview, chartId, title: s.title.trim() }));
      void syncNow(bandId).catch(() => undefined);
    } else {
      update(entry.id, () => ({ ...s, saving: false, planLimit: res?.status === 402, error: apiErrorOf(body, res ? `Not saved (${res.status}).` : "Not saved: no connection.").message }));
    }
  };

  return (
    <PageColumn>
      <PageTitle lead="Bring lead sheets in from notation programs as MusicXML (.musicxml, .xml or compressed .mxl).">Import charts</PageTitle>
      <Notice className="mb-4" testId="rights-caution">{RIGHTS_CAUTION}</Notice>
      {!online ? <Notice kind="error" className="mb-4">Importing needs a connection to the server.</Notice> : null}
      {membership && !canImport ? (
        <Notice kind="error">Importing needs the leader or arranger role.</Notice>
      ) : (
        <div className="mb-6 flex flex-col gap-1">
          <label htmlFor="import-files" className="font-semibold">
            MusicXML files
          </label>
          <input
            id="import-files"
            type="file"
            multiple
            accept=".musicxml,.xml,.mxl,application/vnd.recordare.musicxml+xml,application/vnd.recordare.musicxml"
            className="block min-h-11 w-full rounded-md border border-ink-muted bg-white p-2"
            data-testid="import-files"
            disabled={!online}
            onChange={(e) => {
              void readFiles(e.target.files);
              e.target.value = "";
            }}
          />
          <p className="text-sm text-ink-muted">Nothing is saved until you press “Save to the book” on a file. Up to 5 MB each.</p>
        </div>
      )}
      <ul className="flex flex-col gap-4" aria-live="polite">
        {entries.map((e) => (
          <ImportItem
            key={e.id}
            entry={e}
            bandId={bandId}
            onTitle={(title) => update(e.id, (s) => (s.phase === "ready" ? { ...s, title } : s))}
            onSave={() => void save(e)}
          />
        ))}
      </ul>
      <p className="mt-8 text-sm">
        <Link className="underline" href={`/bands/${encodeURIComponent(bandId)}`}>
          Back to the library
        </Link>
      </p>
    </PageColumn>
  );
}
