"use client";
// A chart's PDF and image parts: upload one (type and size checked on the server), keep every part
// on this device for reading with no signal, and open one on the stand.
import { useLiveQuery } from "dexie-react-hooks";
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/Button";
import { ConfirmInline } from "@/components/ui/Confirm";
import { Field, SelectField } from "@/components/ui/Field";
import { INSTRUMENT_OPTIONS, instrumentLabel } from "@/components/ui/labels";
import { Notice } from "@/components/ui/Notice";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { chartParts, fetchMissingPartFiles } from "@/lib/offline/parts";
import { getLocalBook } from "@/lib/offline/db";
import { syncNow, useChart, useMembership, useOnline } from "@/lib/offline/hooks";
import { useBandRoute } from "@/lib/offline/route";
import { RIGHTS_CAUTION, uploadFile } from "./upload";
import { apiErrorOf, readApiError } from "@/lib/api-error";
import { can } from "@/lib/band/roles";

const KB = 1024;
const sizeText = (n: number) => (n < KB * KB ? `${Math.max(1, Math.round(n / KB))} KB` : `${(n / KB / KB).toFixed(1)} MB`);

export function PartsScreen() {
  const { bandId } = useBandRoute();
  const params = useSearchParams();
  const router = useRouter();
  const chartId = params.get("chart");
  const online = useOnline();
  const chart = useChart(bandId, chartId);
  const membership = useMembership(bandId ?? "");
  const parts = useLiveQuery(() => (chartId ? chartParts(getLocalBook(), chartId) : []), [chartId]);
  const [upload, setUpload] = useState<{ progress: number } | { error: string } | null>(null);
  // Asked before the file: what the part is called and whom it is for. Replacing keeps both.
  const [partName, setPartName] = useState("");
  const [instrument, setInstrument] = useState<string>("concert");
  const [replacing, setReplacing] = useState<{ id: string; label: string } | null>(null);
  const [deleting, setDeleting] = useState<string | null>(null);
  const [done, setDone] = useState("");

  useEffect(() => {
    if (!bandId || !chartId || !online) return;
    void fetchMissingPartFiles(getLocalBook(), bandId, { chartId }).catch(() => undefined);
  }, [bandId, chartId, online, parts?.length]);

  if (!bandId || !chartId) return null;
  // Parts are read in the bandstand view, with its themes, tap zones and pedal keys.
  const onStand = (part: string) =>
    `/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(chartId)}/bandstand?part=${encodeURIComponent(part)}`;

  const canUpload = can(membership?.role, "editCharts");
  const base = `/api/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(chartId)}/attachments`;
  const named = partName.trim() !== "";
  const onFile = async (file: File | undefined) => {
    if (!file) return;
    if (!named) return setUpload({ error: "Give the part a name first, such as “2nd trumpet”." });
    setUpload({ progress: 0 });
    setDone("");
    try {
      const fields: Record<string, string> = { partName: partName.trim(), instrument, ...(replacing ? { replaces: replacing.id } : {}) };
      const answer = await uploadFile(base, file, (progress) => setUpload({ progress }), fields);
      if (answer.status !== 201) return setUpload({ error: apiErrorOf(answer.body, `The server refused this file (${answer.status}).`).message });
      setUpload(null);
      setDone(replacing ? `${replacing.label} replaced.` : `${partName.trim()} added.`);
      setReplacing(null);
      setPartName("");
      await syncNow(bandId);
      await fetchMissingPartFiles(getLocalBook(), bandId, { chartId });
    } catch (err) {
      setUpload({ error: err instanceof Error ? err.message : "The upload failed." });
    }
  };

  const startReplace = (p: { id: string; partName?: string | null; instrument?: string | null; filename: string }) => {
    setReplacing({ id: p.id, label: p.partName ?? p.filename });
    setPartName(p.partName ?? p.filename.replace(/\.[a-z0-9]+$/i, ""));
    setInstrument(p.instrument ?? "concert");
    setUpload(null);
    setDone("");
    document.getElementById("part-name")?.focus();
  };
  const remove = async (id: string, label: string) => {
    const res = await fetch(`${base}/${encodeURIComponent(id)}`, { method: "DELETE" });
    if (!res.ok) return setUpload({ error: (await readApiError(res, `The part could not be deleted (${res.status}).`)).message });
    setDeleting(null);
    setDone(`${label} deleted.`);
    await syncNow(bandId);
  };

  return (
    <PageColumn>
      <PageTitle lead="Scanned or typeset parts kept beside the chart: PDF, PNG or JPEG, up to 20 MB.">
        Parts{chart ? ` for ${chart.title}` : ""}
      </PageTitle>
      {canUpload ? (
        <section className="mb-6 flex flex-col gap-2" aria-label="Add a part">
          <Notice testId="rights-caution">{RIGHTS_CAUTION}</Notice>
          <h2 className="text-lg font-semibold">{replacing ? `Replace ${replacing.label}` : "Add a part"}</h2>
          <Field id="part-name" label="Part name" value={partName} maxLength={80} required onChange={(e) => setPartName(e.target.value)} placeholder="2nd trumpet" hint="What the players call it; asked before the file." data-testid="part-name" />
          <SelectField label="For" value={instrument} onChange={(e) => setInstrument(e.target.value)} options={INSTRUMENT_OPTIONS} data-testid="part-instrument" />
          <label htmlFor="part-file" className="font-semibold">
            {replacing ? "The new file" : "The file"}
          </label>
          <input id="part-file" type="file" accept="application/pdf,image/png,image/jpeg,.pdf,.png,.jpg,.jpeg" disabled={!online || !named}
            aria-describedby={named ? undefined : "part-file-why"}
            className="block min-h-11 w-full rounded-md border border-ink-muted bg-white p-2" data-testid="part-file"
            onChange={(e) => {
              void onFile(e.target.files?.[0]);
              e.target.value = "";
            }} />
          {!named ? <p id="part-file-why" className="text-sm text-ink-muted">Name the part to choose its file.</p> : null}
          {replacing ? <Button tone="quiet" onClick={() => { setReplacing(null); setPartName(""); }} data-testid="part-replace-cancel">Keep {replacing.label} as it is</Button> : null}
          {upload && "progress" in upload ? <progress className="w-full" max={1} value={upload.progress} aria-label="Upload progress" /> : null}
          {upload && "error" in upload ? <Notice kind="error" testId="part-error">{upload.error}</Notice> : null}
          <p aria-live="polite" className="text-sm" data-testid="part-status">{done}</p>
          {!online ? <p className="text-sm text-ink-muted">Adding a part needs a connection; reading the parts below does not.</p> : null}
        </section>
      ) : null}
      {parts === undefined ? null : parts.length === 0 ? (
        <p className="text-ink-muted" data-testid="no-parts">This chart has no parts yet.</p>
      ) : (
        <ul className="flex flex-col gap-3" data-testid="parts-list">
          {parts.map((p) => (
            <li key={p.id} className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-ink-soft bg-white p-3" data-testid="part-row">
              <div>
                <p className="font-semibold" data-testid="part-title">{p.partName ?? p.filename}</p>
                {p.partName ? <p className="text-sm" data-testid="part-for">For {instrumentLabel(p.instrument ?? "concert")} · {p.filename}</p> : null}
                <p className="text-sm text-ink-muted">
                  {p.type === "application/pdf" ? `PDF${p.pages ? `, ${p.pages} page${p.pages === 1 ? "" : "s"}` : ""}` : "Image"} · {sizeText(p.size)} ·{" "}
                  <span data-testid="part-offline">{p.offline ? "kept on this device" : online ? "downloading…" : "not on this device yet"}</span>
                </p>
              </div>
              <div className="flex flex-wrap gap-2">
                <Button onClick={() => router.push(onStand(p.id))} disabled={!p.offline && !online} data-testid="part-open">
                  Open on the stand
                </Button>
                {canUpload ? (
                  <>
                    <Button tone="secondary" disabled={!online} onClick={() => startReplace(p)} aria-label={`Replace ${p.partName ?? p.filename}`} data-testid="part-replace">
                      Replace
                    </Button>
                    <Button tone="danger" disabled={!online} onClick={() => setDeleting(p.id)} aria-label={`Delete ${p.partName ?? p.filename}`} data-testid="part-delete">
                      Delete
                    </Button>
                  </>
                ) : null}
              </div>
              {deleting === p.id ? (
                <ConfirmInline
                  question={`Delete ${p.partName ?? p.filename} for everyone in the band?`}
                  confirmLabel="Delete the part"
                  onConfirm={() => void remove(p.id, p.partName ?? p.filename)}
                  onCancel={() => setDeleting(null)}
                  testId="part-delete-confirm"
                />
              ) : null}
            </li>
          ))}
        </ul>
      )}
      <p className="mt-8 text-sm">
        <Link className="underline" href={`/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(chartId)}`}>
          Back to the chart
        </Link>
      </p>
    </PageColumn>
  );
}
