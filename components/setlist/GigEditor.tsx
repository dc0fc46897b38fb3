"use client";
// The leader's gig editor: the gig's details, its sets and each tune's arrangement, saved as one
// set list. Checks run here with the same rules as the server, so a refusal shows before saving.
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field, SelectField, TextAreaField } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import type { LocalChart, LocalSetlist } from "@/lib/offline/types";
import { checkArrangement, groupBySet, MAX_SETS, renumber, SetMinutesSchema, type SetlistEntry } from "@/lib/setlist";
import { newId } from "@/lib/offline/outbox";
import type { SaveResult } from "@/lib/offline/send";
import { saveSetlist } from "@/lib/offline/setlist-mutations";
import type { WireSetlist } from "@/lib/wire";
import { fromLocalInput, toLocalInput } from "./datetime";
import { SetLength } from "./SetLength";
import { SetTunes, type TuneInfo } from "./SetTunes";

export interface Draft {
  name: string;
  startsAt: string | null;
  venue: string;
  notes: string;
  setMinutes: (number | null)[];
  entries: SetlistEntry[];
}

interface Props {
  bandId: string;
  setlist: LocalSetlist;
  initial: SetlistEntry[];
  charts: LocalChart[];
  openHref?: (e: SetlistEntry) => string;
  /** The gig's time as typed, saved or not (the share panel's end follows it). */
  onStartsAt?: (startsAt: string | null) => void;
  /** A new set list was stored for the first time. */
  onFirstSave?: () => void;
}

/**
 * Keeps the editor's draft while the leader is editing, and starts it afresh from the book when a
 * newer revision arrives (their own save, or someone else's) and nothing is unsaved.
 */
export function GigEditorHost(props: Props) {
  const [dirty, setDirty] = useState(false);
  const [seen, setSeen] = useState(props.setlist.revision);
  const [generation, setGeneration] = useState(0);
  const [note, setNote] = useState("");
  if (props.setlist.revision !== seen && !dirty) {
    setSeen(props.setlist.revision);
    setGeneration((g) => g + 1);
  }
  return <GigEditor key={generation} {...props} note={note} onNote={setNote} onDirty={setDirty} />;
}

function GigEditor({ bandId, setlist, initial, charts, openHref, onStartsAt, onFirstSave, note, onNote, onDirty }: Props & { note: string; onNote: (n: string) => void; onDirty: (d: boolean) => void }) {
  const [draft, setDraft] = useState<Draft>({
    name: setlist.name, startsAt: setlist.startsAt, venue: setlist.venue, notes: setlist.notes, setMinutes: setlist.setMinutes ?? [], entries: initial,
  });
  const [extraSets, setExtraSets] = useState(0);
  const [dirty, setDirtyHere] = useState(false);
  const setDirty = (d: boolean) => {
    setDirtyHere(d);
    onDirty(d);
    if (d) onNote("");
  };
  const [saving, setSaving] = useState(false);
  const [outcome, setOutcome] = useState<SaveResult<WireSetlist> | null>(null);
  const [adding, setAdding] = useState<Record<number, string>>({});

  const tunes = useMemo(() => new Map<string, TuneInfo>(charts.map((c) => [c.id, { title: c.title, chart: c.body, changed: c.unseen }])), [charts]);
  const highestSet = draft.entries.reduce((n, e) => Math.max(n, e.setNumber), 1);
  const setCount = Math.min(MAX_SETS, Math.max(highestSet, 1 + extraSets));
  const bySet = new Map(groupBySet(draft.entries).map((s) => [s.setNumber, s.entries]));
  const problems = [
    ...draft.entries.flatMap((e) => checkArrangement(tunes.get(e.chartId)?.chart ?? null, e).issues.map((i) => `${tunes.get(e.chartId)?.title ?? "A tune"}: ${i.message}`)),
    ...setMinutesProblems(draft.setMinutes),
  ];
  // A disabled Save always says why.
  const blocked = !draft.name.trim()
    ? "Give the set list a name to save it."
    : problems.length > 0
      ? `Fix ${problems.length === 1 ? "the problem" : `the ${problems.length} problems`} listed below to save.`
      : null;
  function setTarget(setNumber: number, minutes: number | null) {
    const next = Array.from({ length: Math.max(draft.setMinutes.length, setNumber) }, (_, i) => draft.setMinutes[i] ?? null);
    next[setNumber - 1] = minutes;
    update({ setMinutes: next });
  }

  function update(patch: Partial<Draft>) {
    if ("startsAt" in patch) onStartsAt?.(patch.startsAt ?? null);
    setDraft((d) => ({ ...d, ...patch }));
    setDirty(true);
    setOutcome(null);
  }
  function setEntries(fn: (entries: SetlistEntry[]) => SetlistEntry[]) {
    setDraft((d) => ({ ...d, entries: renumber(playOrderBySet(fn(d.entries))) }));
    setDirty(true);
    setOutcome(null);
  }
  function replaceSet(setNumber: number, list: SetlistEntry[]) {
    setEntries((all) => [...all.filter((e) => e.setNumber !== setNumber), ...list.map((e, i) => ({ ...e, position: i }))]);
  }
  function addTune(setNumber: number) {
    const chartId = adding[setNumber] ?? "";
    if (!chartId) return;
    const position = (bySet.get(setNumber) ?? []).length;
    setEntries((all) => [...all, { id: newId(), chartId, setNumber, position, key: null, tempo: null, intro: null, ending: null, soloOrder: "", choruses: 1, straightIn: false, notes: "" }]);
    setAdding((a) => ({ ...a, [setNumber]: "" }));
  }

  async function save() {
    setSaving(true);
    try {
      const r = await saveSetlist(bandId, { id: setlist.id, revision: setlist.revision, meta: draft, entries: draft.entries });
      setOutcome(r);
      if (r.status === "saved" || r.status === "queued") {
        onNote(r.status === "saved" ? "Saved." : "Saved on this device; it goes to the band when you have signal.");
        setDirty(false);
        if (setlist.revision === 0) onFirstSave?.();
      }
    } finally {
      setSaving(false);
    }
  }

  const options = [{ value: "", label: "Choose a chart from the library…" }, ...charts.map((c) => ({ value: c.id, label: `${c.title} (${c.key})` }))];

  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="gig-details" className="grid gap-4 sm:grid-cols-2">
        <h2 id="gig-details" className="sr-only">Gig details</h2>
        <Field label="Name" value={draft.name} maxLength={120} required placeholder="Friday at the harbour bar" onChange={(e) => update({ name: e.target.value })} data-testid="gig-name" />
        <Field
          label="Date and time (your time zone)"
          type="datetime-local"
          value={toLocalInput(draft.startsAt)}
          onChange={(e) => update({ startsAt: fromLocalInput(e.target.value) })}
          data-testid="gig-when"
        />
        <Field label="Venue" value={draft.venue} maxLength={160} onChange={(e) => update({ venue: e.target.value })} data-testid="gig-venue" />
        <TextAreaField label="Notes for the band" rows={2} value={draft.notes} maxLength={2000} onChange={(e) => update({ notes: e.target.value })} data-testid="gig-notes" />
      </section>

      {Array.from({ length: setCount }, (_, i) => i + 1).map((n) => (
        <section key={n} aria-labelledby={`set-${n}`} className="rounded-lg border border-ink-soft bg-paper-dim p-4" data-testid={`set-${n}`}>
          <h2 id={`set-${n}`} className="mb-3 text-xl font-bold">Set {n}</h2>
          <SetLength setNumber={n} entries={bySet.get(n) ?? []} tunes={tunes} target={draft.setMinutes[n - 1] ?? null} onTarget={(m) => setTarget(n, m)} />
          <SetTunes
            setNumber={n}
            setCount={setCount}
            entries={bySet.get(n) ?? []}
            tunes={tunes}
            editable
            openHref={openHref}
            onReorder={(list) => replaceSet(n, list)}
            onChange={(e) => setEntries((all) => all.map((x) => (x.id === e.id ? e : x)))}
            onRemove={(id) => setEntries((all) => all.filter((x) => x.id !== id))}
            onMoveToSet={(id, to) => setEntries((all) => all.map((x) => (x.id === id ? { ...x, setNumber: to, position: 999 } : x)))}
          />
          <div className="mt-3 flex flex-wrap items-end gap-2">
            <SelectField
              label={`Add a tune to set ${n}`}
              className="min-w-64 flex-1"
              value={adding[n] ?? ""}
              onChange={(e) => setAdding((a) => ({ ...a, [n]: e.target.value }))}
              options={options}
              data-testid={`add-chart-${n}`}
            />
            <Button tone="secondary" onClick={() => addTune(n)} disabled={!adding[n]} data-testid={`add-tune-${n}`}>
              Add to set {n}
            </Button>
          </div>
        </section>
      ))}
      {setCount < MAX_SETS ? (
        <div>
          <Button tone="secondary" onClick={() => setExtraSets(setCount)} data-testid="add-set">
            Add set {setCount + 1}
          </Button>
        </div>
      ) : null}

      <div className="sticky bottom-0 flex flex-wrap items-center gap-3 border-t border-ink-soft bg-paper py-3">
        <Button onClick={save} disabled={saving || blocked !== null} aria-describedby={blocked ? "save-blocked" : undefined} data-testid="save-setlist">
          {saving ? "Saving…" : "Save set list"}
        </Button>
        <span aria-live="polite" className="text-sm" data-testid="save-state">
          {dirty ? "Unsaved changes." : note}
        </span>
        {blocked ? (
          <span id="save-blocked" className="text-sm font-semibold text-red-800" data-testid="save-blocked">
            {blocked}
          </span>
        ) : null}
      </div>
      {problems.length > 0 ? (
        <Notice kind="error" title="Fix these before saving" testId="setlist-problems">
          <ul className="list-disc pl-5">
            {problems.map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
      {outcome?.status === "invalid" || outcome?.status === "conflict" ? (
        <Notice kind="error" title={outcome.status === "conflict" ? "Changed by someone else" : "Not saved"} testId="save-error">
          {outcome.message}
        </Notice>
      ) : null}
    </div>
  );
}

/** Keeps set order first, then the order given inside each set. */
function playOrderBySet(entries: SetlistEntry[]): SetlistEntry[] {
  return [...entries].sort((a, b) => a.setNumber - b.setNumber || a.position - b.position);
}

/** The set lengths refused with the server's own words ("A set runs at least 5 minutes"). */
function setMinutesProblems(minutes: (number | null)[]): string[] {
  const r = SetMinutesSchema.safeParse(minutes);
  return r.success ? [] : r.error.issues.map((i) => `Set ${Number(i.path[0] ?? 0) + 1} length: ${i.message}`);
}
