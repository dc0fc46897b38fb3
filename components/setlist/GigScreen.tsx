"use client";
// One gig: leaders and arrangers edit it; players and subs read it. Everyone can play it on the
// bandstand and print it, in their own instrument, from what this device holds.
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { useMemo, useState } from "react";
import { Button, LinkButton } from "@/components/ui/Button";
import { ConfirmInline } from "@/components/ui/Confirm";
import { SelectField } from "@/components/ui/Field";
import type { LocalSetlist } from "@/lib/offline/types";
import { Notice } from "@/components/ui/Notice";
import { PageColumn } from "@/components/ui/Page";
import { INSTRUMENT_OPTIONS } from "@/components/ui/labels";
import { chartQuery } from "@/components/chart/params";
import { useBandRoute } from "@/lib/offline/route";
import { entryIntro, groupBySet, type SetlistEntry } from "@/lib/setlist";
import { useBandCharts, useHasSynced, useMembership, useSetlist } from "@/lib/offline/hooks";
import { newId } from "@/lib/offline/outbox";
import { deleteSetlist, saveSetlist } from "@/lib/offline/setlist-mutations";
import { gigWhen } from "./datetime";
import { GigEditorHost } from "./GigEditor";
import { SetLength } from "./SetLength";
import { SetTunes, type TuneInfo } from "./SetTunes";
import { SharePanel } from "./SharePanel";
import { PushPrompt } from "@/components/push/PushPrompt";
import { ReadinessPanel } from "@/components/readiness/ReadinessPanel";
import { can } from "@/lib/band/roles";

function plain(e: Omit<SetlistEntry, "choruses" | "straightIn"> & { choruses?: number; straightIn?: boolean }): SetlistEntry {
  return {
    id: e.id, chartId: e.chartId, setNumber: e.setNumber, position: e.position, key: e.key, tempo: e.tempo,
    intro: e.intro, ending: e.ending, soloOrder: e.soloOrder, choruses: e.choruses ?? 1, straightIn: e.straightIn ?? false, notes: e.notes,
  };
}

export function GigScreen() {
  const { bandId, setlistId } = useBandRoute();
  const router = useRouter();
  const loaded = useSetlist(setlistId);
  const charts = useBandCharts(bandId, { copies: false });
  const membership = useMembership(bandId);
  const synced = useHasSynced(bandId);
  const fresh = useSearchParams().get("new") === "1";
  const [instrument, setInstrument] = useState<string | null>(null);
  const [asking, setAsking] = useState(false);
  const [removeProblem, setRemoveProblem] = useState<string | null>(null);
  // The gig's time as it stands in the editor, saved or not: a share's end follows it at once.
  const [shownStart, setShownStart] = useState<{ id: string; startsAt: string | null } | null>(null);
  const part = instrument ?? membership?.instrument ?? "concert";
  const entries = useMemo(() => (loaded?.entries ?? []).map((e) => plain({ ...e, ending: e.ending as SetlistEntry["ending"] })), [loaded]);
  const tunes = useMemo(() => new Map<string, TuneInfo>((charts ?? []).map((c) => [c.id, { title: c.title, chart: c.body, changed: c.unseen }])), [charts]);

  if (!bandId || !setlistId) return null;
  if (loaded === undefined || charts === undefined || membership === undefined) {
    return <PageColumn><p className="py-8 text-center text-ink-muted">Opening the set list…</p></PageColumn>;
  }
  const base = `/bands/${encodeURIComponent(bandId)}/setlists`;
  // "New set list" opens an empty draft: nothing is stored until the leader saves it.
  const draft = loaded === null && fresh && can(membership?.role, "editSetlists") ? blankSetlist(setlistId, bandId) : null;
  if (loaded === null && !draft && !synced) {
    return <PageColumn><p className="py-8 text-center text-ink-muted" role="status">Bringing the set list to this device…</p></PageColumn>;
  }
  if (loaded === null && !draft) {
    return (
      <PageColumn>
        <Notice kind="error" title="This set list is not on this device">
          It may have been deleted, or your access to it ended. <Link className="underline" href={base}>Back to the set lists</Link>
        </Notice>
      </PageColumn>
    );
  }
  const setlist = loaded?.setlist ?? draft!;
  const saved = setlist.revision > 0;
  const editable = can(membership?.role, "editSetlists");
  const startsAt = shownStart?.id === setlist.id ? shownStart.startsAt : setlist.startsAt;
  const here = `${base}/${encodeURIComponent(setlist.id)}`;
  const openHref = (e: SetlistEntry) =>
    `/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(e.chartId)}${chartQuery({ instrument: part, key: e.key, tempo: e.tempo, intro: entryIntro(e), tag: e.ending?.kind === "tag" ? e.ending : null, list: setlist.id })}`;

  async function duplicate() {
    const id = newId();
    const copy = entries.map((e) => ({ ...e, id: newId() }));
    await saveSetlist(bandId!, { id, revision: 0, meta: { name: `${setlist.name} (next gig)`, startsAt: null, venue: setlist.venue, notes: setlist.notes, setMinutes: setlist.setMinutes }, entries: copy });
    router.push(`${base}/${encodeURIComponent(id)}`);
  }
  async function remove() {
    setAsking(false);
    const r = await deleteSetlist(bandId!, setlist);
    if (r.status === "saved" || r.status === "queued") router.push(base);
    else setRemoveProblem(r.message);
  }

  return (
    <PageColumn wide>
      <p className="mb-2"><Link href={base} className="underline">← Set lists</Link></p>
      <div className="mb-4">
        <h1 className="text-2xl font-bold tracking-tight sm:text-3xl" data-testid="gig-title">{setlist.name || "New set list"}</h1>
        <p className="text-ink-muted">{[gigWhen(setlist.startsAt), setlist.venue].filter(Boolean).join(" · ")}</p>
        {!editable && setlist.notes ? <p className="mt-2">{setlist.notes}</p> : null}
      </div>

      <PushPrompt context="setlist" />
      {editable ? <div className="mb-4"><ReadinessPanel bandId={bandId} setlistId={setlist.id} canNudge={can(membership?.role, "nudgeBand")} /></div> : null}
      <div className="mb-6 flex flex-wrap items-end gap-3 rounded-lg border border-ink-soft p-3">
        <SelectField label="Read as" value={part} onChange={(e) => setInstrument(e.target.value)} options={INSTRUMENT_OPTIONS} className="min-w-64" data-testid="play-instrument" />
        <LinkButton href={`${here}/play?instrument=${encodeURIComponent(part)}`} data-testid="play-set">Play this set</LinkButton>
        <LinkButton tone="secondary" href={`${here}/print`} data-testid="print-list">Print the set list</LinkButton>
        <LinkButton tone="secondary" href={`${here}/print?parts=${encodeURIComponent(part)}`} data-testid="print-parts">Print all parts</LinkButton>
        {editable && saved ? (
          <>
            <Button tone="secondary" onClick={duplicate} data-testid="duplicate-setlist">Duplicate for the next gig</Button>
            {asking ? null : <Button tone="danger" onClick={() => setAsking(true)} data-testid="delete-setlist">Delete</Button>}
          </>
        ) : null}
        {asking ? (
          <ConfirmInline
            question={`Delete “${setlist.name}” for the whole band?`}
            confirmLabel="Yes, delete it"
            onConfirm={remove}
            onCancel={() => setAsking(false)}
            testId="delete-setlist-confirm"
          />
        ) : null}
      </div>
      {removeProblem ? <div className="mb-4"><Notice kind="error" title="Not deleted" testId="delete-setlist-error">{removeProblem}</Notice></div> : null}

      {editable ? (
        <GigEditorHost
          key={setlist.id}
          bandId={bandId}
          setlist={setlist}
          initial={entries}
          charts={charts}
          openHref={openHref}
          onStartsAt={(s) => setShownStart({ id: setlist.id, startsAt: s })}
          onFirstSave={() => router.replace(here)}
        />
      ) : (
        <ReadOnlySets entries={entries} tunes={tunes} openHref={openHref} setMinutes={setlist.setMinutes ?? []} part={part} />
      )}

      {can(membership?.role, "shareWithSubs") ? (
        <div className="mt-8">
          {saved ? (
            <SharePanel bandId={bandId} setlistId={setlist.id} startsAt={startsAt} />
          ) : (
            <Notice title="Share with a sub">Save the set list first; then you can send it to a sub.</Notice>
          )}
        </div>
      ) : null}
    </PageColumn>
  );
}

function ReadOnlySets({ entries, tunes, openHref, setMinutes, part }: { entries: SetlistEntry[]; tunes: Map<string, TuneInfo>; openHref: (e: SetlistEntry) => string; setMinutes: (number | null)[]; part: string }) {
  const sets = groupBySet(entries);
  if (sets.length === 0) return <Notice title="No tunes yet">The leader has not put any tunes on this set list yet.</Notice>;
  const noop = () => undefined;
  return (
    <div className="flex flex-col gap-4">
      {sets.map((s) => (
        <section key={s.setNumber} aria-labelledby={`set-${s.setNumber}`} className="rounded-lg border border-ink-soft bg-paper-dim p-4" data-testid={`set-${s.setNumber}`}>
          <h2 id={`set-${s.setNumber}`} className="mb-3 text-xl font-bold">Set {s.setNumber}</h2>
          <SetLength setNumber={s.setNumber} entries={s.entries} tunes={tunes} target={setMinutes[s.setNumber - 1] ?? null} />
          <SetTunes setNumber={s.setNumber} setCount={sets.length} entries={s.entries} tunes={tunes} editable={false} openHref={openHref} part={part} onReorder={noop} onChange={noop} onRemove={noop} onMoveToSet={noop} />
        </section>
      ))}
    </div>
  );
}

function blankSetlist(id: string, bandId: string): LocalSetlist {
  return { id, bandId, name: "", startsAt: null, venue: "", notes: "", setMinutes: [], revision: 0, updatedAt: "", updatedBy: "" };
}
