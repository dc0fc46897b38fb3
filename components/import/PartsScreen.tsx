"use client";
// A chart's PDF and image parts: upload one (type and size checked on the server), keep every part
// on this device for reading with no signal, and open one on the stand.
import { useLiveQuery } from "dexie-react-hooks";
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { chartParts, fetchMissingAttachmentFiles } from "@/lib/offline/attachments";
import { getLocalBook } from "@/lib/offline/db";
import { syncNow, useChart, useMembership, useOnline } from "@/lib/offline/hooks";
import { useBandRoute } from "@/lib/offline/route";
import { errorMessage, RIGHTS_CAUTION, uploadFile } from "./upload";
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

  useEffect(() => {
    if (!bandId || !chartId || !online) return;
    void fetchMissingAttachmentFiles(getLocalBook(), bandId, { chartId }).catch(() => undefined);
  }, [bandId, chartId, online, parts?.length]);

  if (!bandId || !chartId) return null;
  // Parts are read in the bandstand view, with its themes, tap zones and pedal keys.
  const onStand = (part: string) =>
    `/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(chartId)}/bandstand?part=${encodeURIComponent(part)}`;

  const canUpload = can(membership?.role, "editCharts");
  const onFile = async (file: File | undefined) => {
    if (!file) return;
    setUpload({ progress: 0 });
    try {
      const url = `/api/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(chartId)}/attachments`;
      const answer = await uploadFile(url, file, (progress) => setUpload({ progress }));
      if (answer.status !== 201) return setUpload({ error: errorMessage(answer.body, `The server refused this file (${answer.status}).`) });
      setUpload(null);
      await syncNow(bandId);
      await fetchMissingAttachmentFiles(getLocalBook(), bandId, { chartId });
    } catch (err) {
      setUpload({ error: err instanceof Error ? err.message : "The upload failed." });
    }
  };

  return (
    <PageColumn>
      <PageTitle lead="Scanned or typeset parts kept beside the chart: PDF, PNG or JPEG, up to 20 MB.">
        Parts{chart ? ` for ${chart.title}` : ""}
      </PageTitle>
      {canUpload ? (
        <section className="mb-6 flex flex-col gap-2" aria-label="Add a part">
          <Notice testId="rights-caution">{RIGHTS_CAUTION}</Notice>
          <label htmlFor="part-file" className="font-semibold">
            Add a part
          </label>
          <input id="part-file" type="file" accept="application/pdf,image/png,image/jpeg,.pdf,.png,.jpg,.jpeg" disabled={!online}
            className="block min-h-11 w-full rounded-md border border-ink-muted bg-white p-2" data-testid="part-file"
            onChange={(e) => {
              void onFile(e.target.files?.[0]);
              e.target.value = "";
            }} />
          {upload && "progress" in upload ? <progress className="w-full" max={1} value={upload.progress} aria-label="Upload progress" /> : null}
          {upload && "error" in upload ? <Notice kind="error" testId="part-error">{upload.error}</Notice> : null}
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
                <p className="font-semibold">{p.filename}</p>
                <p className="text-sm text-ink-muted">
                  {p.type === "application/pdf" ? `PDF${p.pages ? `, ${p.pages} page${p.pages === 1 ? "" : "s"}` : ""}` : "Image"} · {sizeText(p.size)} ·{" "}
                  <span data-testid="part-offline">{p.offline ? "kept on this device" : online ? "downloading…" : "not on this device yet"}</span>
                </p>
              </div>
              <Button onClick={() => router.push(onStand(p.id))} disabled={!p.offline && !online} data-testid="part-open">
                Open on the stand
              </Button>
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
