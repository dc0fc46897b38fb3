"use client";
// One gig: leaders and arrangers edit it; players and subs read it. Everyone can play it on the
// bandstand and print it, in their own instrument, from what this device holds.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { Button, LinkButton } from "@/components/ui/Button";
import { SelectField } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { PageColumn } from "@/components/ui/Page";
import { INSTRUMENT_OPTIONS } from "@/components/ui/labels";
import { chartQuery } from "@/components/chart/params";
import { useBandRoute } from "@/lib/offline/route";
import { groupBySet, type SetlistEntry } from "@/lib/setlist";
import { canEditSetlists, deleteSetlistEverywhere, newId, saveSetlist, useBookCharts, useHasSynced, useMyMembership, useSetlist } from "./data";
import { gigWhen } from "./datetime";
import { GigEditorHost } from "./GigEditor";
import { SetTunes, type TuneInfo } from "./SetTunes";
import { SharePanel } from "./SharePanel";
import { PushPrompt } from "@/components/push/PushPrompt";
import { ReadinessPanel } from "@/components/readiness/ReadinessPanel";

function plain(e: SetlistEntry): SetlistEntry {
  return { id: e.id, chartId: e.chartId, setNumber: e.setNumber, position: e.position, key: e.key, tempo: e.tempo, intro: e.intro, ending: e.ending, soloOrder: e.soloOrder, notes: e.notes };
}

export function GigScreen() {
  const { bandId, setlistId } = useBandRoute();
  const router = useRouter();
  const loaded = useSetlist(setlistId);
  const charts = useBookCharts(bandId);
  const membership = useMyMembership(bandId);
  const synced = useHasSynced(bandId);
  const [instrument, setInstrument] = useState<string | null>(null);
  const part = instrument ?? membership?.instrument ?? "concert";
  const entries = useMemo(() => (loaded?.entries ?? []).map((e) => plain({ ...e, ending: e.ending as SetlistEntry["ending"] })), [loaded]);
  const tunes = useMemo(() => new Map<string, TuneInfo>((charts ?? []).map((c) => [c.id, { title: c.title, chart: c.body, changed: c.unseen }])), [charts]);

  if (!bandId || !setlistId) return null;
  if (loaded === undefined || charts === undefined || membership === undefined) {
    return <PageColumn><p className="py-8 text-center text-ink-muted">Opening the set list…</p></PageColumn>;
  }
  const base = `/bands/${encodeURIComponent(bandId)}/setlists`;
  if (loaded === null && !synced) {
    return <PageColumn><p className="py-8 text-center text-ink-muted" role="status">Bringing the set list to this device…</p></PageColumn>;
  }
  if (loaded === null) {
    return (
      <PageColumn>
        <Notice kind="error" title="This set list is not on this device">
          It may have been deleted, or your access to it ended. <Link className="underline" href={base}>Back to the set lists</Link>
        </Notice>
      </PageColumn>
    );
  }
  const { setlist } = loaded;
  const editable = canEditSetlists(membership);
  const here = `${base}/${encodeURIComponent(setlist.id)}`;
  const openHref = (e: SetlistEntry) =>
    `/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(e.chartId)}${chartQuery({ instrument: part, key: e.key, tempo: e.tempo, intro: e.intro ?? undefined, list: setlist.id })}`;

  async function duplicate() {
    const id = newId();
    const copy = entries.map((e) => ({ ...e, id: newId() }));
    await saveSetlist(bandId!, id, 0, { name: `${setlist.name} (next gig)`, startsAt: null, venue: setlist.venue, notes: setlist.notes }, copy);
    router.push(`${base}/${encodeURIComponent(id)}`);
  }
  async function remove() {
    if (!window.confirm(`Delete “${setlist.name}” for the whole band?`)) return;
    await deleteSetlistEverywhere(bandId!, setlist.id, setlist.revision, setlist.name);
    router.push(base);
  }

  return (
    <PageColumn wide>
      <p className="mb-2"><Link href={base} className="underline">← Set lists</Link></p>
      <div className="mb-4">
        <h1 className="text-2xl font-bold tracking-tight sm:text-3xl" data-testid="gig-title">{setlist.name}</h1>
        <p className="text-ink-muted">{[gigWhen(setlist.startsAt), setlist.venue].filter(Boolean).join(" · ")}</p>
        {!editable && setlist.notes ? <p className="mt-2">{setlist.notes}</p> : null}
      </div>

      <PushPrompt context="setlist" />
      {editable ? <div className="mb-4"><ReadinessPanel bandId={bandId} setlistId={setlist.id} canNudge={membership?.role === "leader"} /></div> : null}
      <div className="mb-6 flex flex-wrap items-end gap-3 rounded-lg border border-ink-soft p-3">
        <SelectField label="Read as" value={part} onChange={(e) => setInstrument(e.target.value)} options={INSTRUMENT_OPTIONS} className="min-w-64" data-testid="play-instrument" />
        <LinkButton href={`${here}/play?instrument=${encodeURIComponent(part)}`} data-testid="play-set">Play this set</LinkButton>
        <LinkButton tone="secondary" href={`${here}/print`} data-testid="print-list">Print the set list</LinkButton>
        <LinkButton tone="secondary" href={`${here}/print?parts=${encodeURIComponent(part)}`} data-testid="print-parts">Print all parts</LinkButton>
        {editable ? (
          <>
            <Button tone="secondary" onClick={duplicate} data-testid="duplicate-setlist">Duplicate for the next gig</Button>
            <Button tone="danger" onClick={remove}>Delete</Button>
          </>
        ) : null}
      </div>

      {editable ? (
        <GigEditorHost key={setlist.id} bandId={bandId} setlist={setlist} initial={entries} charts={charts} openHref={openHref} />
      ) : (
        <ReadOnlySets entries={entries} tunes={tunes} openHref={openHref} />
      )}

      {membership?.role === "leader" ? (
        <div className="mt-8">
          <SharePanel bandId={bandId} setlistId={setlist.id} startsAt={setlist.startsAt} />
        </div>
      ) : null}
    </PageColumn>
  );
}

function ReadOnlySets({ entries, tunes, openHref }: { entries: SetlistEntry[]; tunes: Map<string, TuneInfo>; openHref: (e: SetlistEntry) => string }) {
  const sets = groupBySet(entries);
  if (sets.length === 0) return <Notice title="No tunes yet">The leader has not put any tunes on this set list yet.</Notice>;
  const noop = () => undefined;
  return (
    <div className="flex flex-col gap-4">
      {sets.map((s) => (
        <section key={s.setNumber} aria-labelledby={`set-${s.setNumber}`} className="rounded-lg border border-ink-soft bg-paper-dim p-4" data-testid={`set-${s.setNumber}`}>
          <h2 id={`set-${s.setNumber}`} className="mb-3 text-xl font-bold">Set {s.setNumber}</h2>
          <SetTunes setNumber={s.setNumber} setCount={sets.length} entries={s.entries} tunes={tunes} editable={false} openHref={openHref} onReorder={noop} onChange={noop} onRemove={noop} onMoveToSet={noop} />
        </section>
      ))}
    </div>
  );
}
