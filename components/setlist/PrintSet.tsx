"use client";
// Printing a gig: the set list on one page in large type (for the floor by the monitor), or every
// tune's part for one instrument as one print job, in play order with each tonight's key and intro.
import Link from "next/link";
import { useSearchParams } from "next/navigation";
import { useMemo } from "react";
import { PrintSheets } from "@/components/chart/PrintSheets";
import { buildPerformance } from "@/components/chart/performance";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { instrumentLabel } from "@/components/ui/labels";
import { useBandRoute } from "@/lib/offline/route";
import { endingInWords, entryIntro, entryIntroInWords, groupBySet, playOrder, SHARING_CAUTION, type SetlistEntry } from "@/lib/setlist";
import { useBandCharts, useMembership, useSetlist } from "@/lib/offline/hooks";
import { isInstrumentId } from "@/lib/music/instruments";
import { keyInWords, partKeyInWords } from "@/lib/music/part-key";
import { gigWhen } from "./datetime";


export function PrintSet() {
  const { bandId, setlistId } = useBandRoute();
  const params = useSearchParams();
  const parts = params.get("parts");
  const loaded = useSetlist(setlistId);
  const charts = useBandCharts(bandId, { copies: false });
  const membership = useMembership(bandId);
  // The floor copy names keys in the reader's part (concert labelled), or the part asked for.
  const asked = params.get("instrument");
  const reader = asked && isInstrumentId(asked) ? asked : (membership?.instrument ?? "concert");
  const byId = useMemo(() => new Map((charts ?? []).map((c) => [c.id, c])), [charts]);
  const entries = useMemo(() => (loaded?.entries ?? []) as SetlistEntry[], [loaded]);
  if (!bandId || !setlistId) return null;
  if (loaded === undefined || charts === undefined) return <p className="p-6 text-ink-muted">Opening the set list…</p>;
  if (loaded === null) return <Notice kind="error" className="m-6" title="This set list is not on this device" />;
  const back = `/bands/${encodeURIComponent(bandId)}/setlists/${encodeURIComponent(setlistId)}`;
  const total = entries.length;
  // One page whatever the length: the type shrinks as the list grows.
  const size = total <= 12 ? "text-3xl" : total <= 20 ? "text-2xl" : total <= 30 ? "text-xl" : "text-base";

  return (
    <main id="main" className="mx-auto max-w-4xl p-6 print:p-0">
      <div className="no-print mb-6 flex flex-wrap items-center gap-3">
        <Link href={back} className="underline">← Back to the gig</Link>
        <Button onClick={() => window.print()} data-testid="print-now">
          {parts ? `Print all ${instrumentLabel(parts)} parts` : "Print the set list"}
        </Button>
        <p className="w-full text-sm text-ink-muted">{SHARING_CAUTION}</p>
      </div>
      {parts ? (
        <PartsJob entries={playOrder(entries)} charts={byId} instrument={parts} />
      ) : (
        <article className="print-one-page" data-testid="printable-setlist">
          <header className="mb-4 border-b-2 border-black pb-2">
            <h1 className="text-4xl font-bold">{loaded.setlist.name}</h1>
            <p className="text-xl">{[gigWhen(loaded.setlist.startsAt), loaded.setlist.venue].filter(Boolean).join(" · ")}</p>
          </header>
          <div className={total > 12 ? "grid grid-cols-2 gap-x-8" : ""}>
            {groupBySet(entries).map((s) => (
              <section key={s.setNumber} className="mb-4 break-inside-avoid">
                <h2 className="text-2xl font-bold uppercase tracking-wide">Set {s.setNumber}</h2>
                <ol className={`${size} leading-tight`}>
                  {s.entries.map((e, i) => {
                    const c = byId.get(e.chartId);
                    return (
                      <li key={e.id} className="py-1" data-testid="printed-tune">
                        <span className="font-bold">{i + 1}. {c?.title ?? "?"}</span>{" "}
                        <span className="whitespace-nowrap" data-testid="printed-key">– {partKeyInWords(e.key ?? c?.key ?? "C", reader)}</span>
                        <span className="block text-[0.55em] leading-snug">
                          Intro: {entryIntroInWords(e)}
                          {e.tempo ? ` · ♩ = ${e.tempo}` : ""}
                          {e.ending ? ` · End: ${endingInWords(e.ending)}` : ""}
                        </span>
                      </li>
                    );
                  })}
                </ol>
              </section>
            ))}
          </div>
        </article>
      )}
    </main>
  );
}

function PartsJob({ entries, charts, instrument }: { entries: SetlistEntry[]; charts: Map<string, { title: string; body: import("@/lib/chart/model").Chart }>; instrument: string }) {
  const performances = useMemo(
    () =>
      entries.flatMap((e) => {
        const c = charts.get(e.chartId);
        if (!c) return [];
        try {
          return [{ id: e.id, title: c.title, ...buildPerformance({ chart: c.body, instrument, key: e.key, intro: entryIntro(e), tag: e.ending?.kind === "tag" ? e.ending : null }) }];
        } catch {
          return [];
        }
      }),
    [entries, charts, instrument],
  );
  return (
    <div data-testid="parts-job">
      <ol className="no-print list-decimal pl-6">
        {performances.map((p) => (
          <li key={p.id}>{p.title} — {p.text.partLabel}, written in {keyInWords(p.arrangement.writtenKey)}</li>
        ))}
      </ol>
      {performances.map((p) => (
        <div key={p.id} style={{ breakBefore: "page" }}>
          <PrintSheets arrangement={p.arrangement} text={p.text} />
        </div>
      ))}
    </div>
  );
}
