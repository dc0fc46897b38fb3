"use client";
// A player's private pencil for one chart: put a short note or a highlight on a bar, change or
// remove it. Marks show on this player's parts in every key, reach their other devices, and no one else's.
import { useId, useMemo, useState } from "react";
import { Button } from "@/components/ui/Button";
import { Field, SelectField } from "@/components/ui/Field";
import type { Chart } from "@/lib/chart/model";
import { anchorFor, MARK_TEXT_MAX, placeAnchor, readMarkBar, readMarkWords, type MarkData } from "@/lib/setlist";
import { useMyMarks } from "@/lib/offline/hooks";
import { deleteMark, saveMark } from "@/lib/offline/setlist-mutations";
import type { LocalMark } from "@/lib/offline/types";

interface Props {
  bandId: string;
  chartId: string;
  chart: Chart;
  chartRevision: number;
}

function sectionNames(chart: Chart): string[] {
  const seen = new Map<string, number>();
  return chart.sections.map((s) => {
    const n = (seen.get(s.label) ?? 0) + 1;
    seen.set(s.label, n);
    const total = chart.sections.filter((x) => x.label === s.label).length;
    return total > 1 ? `${s.label} (${n} of ${total})` : s.label;
  });
}

export function MarksPanel({ bandId, chartId, chart, chartRevision }: Props) {
  const uid = useId();
  const ids = useMemo(() => [chartId], [chartId]);
  const marks = useMyMarks(ids);
  const names = useMemo(() => sectionNames(chart), [chart]);
  const [editing, setEditing] = useState<LocalMark | null>(null);
  const [section, setSection] = useState(0);
  const [bar, setBar] = useState("1");
  const [barError, setBarError] = useState<string | null>(null);
  const [kind, setKind] = useState<MarkData["kind"]>("text");
  const [text, setText] = useState("");
  const [textError, setTextError] = useState<string | null>(null);
  const [status, setStatus] = useState("");
  const bars = chart.sections[section]?.bars.length ?? 0;

  function startEdit(m: LocalMark) {
    const p = placeAnchor(chart, m.data.anchor);
    setEditing(m);
    setSection(p.status === "lost" ? 0 : p.section);
    setBar(String(p.status === "lost" ? 1 : p.bar + 1));
    setBarError(null);
    setStatus("");
    setKind(m.data.kind);
    setText(m.data.text);
  }
  function reset() {
    setEditing(null);
    setText("");
    setTextError(null);
  }

  async function save(e: React.FormEvent) {
    e.preventDefault();
    const picked = readMarkBar(bar, bars);
    if ("error" in picked) {
      setBarError(picked.error);
      return setStatus("");
    }
    setBarError(null);
    const words = readMarkWords(text);
    if ("error" in words) {
      setTextError(words.error);
      return setStatus("");
    }
    setTextError(null);
    const anchor = anchorFor(chart, section, picked.bar - 1);
    if (!anchor) return setStatus("That bar is not in the chart.");
    if (kind === "text" && !words.text) return setStatus("Write a few words, or choose a highlight.");
    const data: MarkData = { anchor, kind, text: words.text, chartRevision, lost: false };
    await saveMark(bandId, { id: editing?.id, chartId, revision: editing?.revision ?? 0, data });
    setStatus(editing ? "Mark changed." : "Mark added.");
    reset();
  }

  return (
    <section aria-labelledby={`${uid}-h`} className="rounded-lg border border-ink-soft p-4" data-testid="marks-panel">
      <h2 id={`${uid}-h`} className="text-lg font-bold">My marks</h2>
      <p className="mb-3 text-sm text-ink-muted">Only you see these, in every key and part, on all your devices.</p>
      <form onSubmit={save} className="grid gap-3" noValidate>
        <SelectField label="Section" value={String(section)} onChange={(e) => { setSection(Number(e.target.value)); setBar("1"); setBarError(null); }} options={names.map((n, i) => ({ value: String(i), label: n }))} data-testid="mark-section" />
        <Field label={`Bar (1–${bars})`} type="number" min={1} max={bars} value={bar} error={barError} onChange={(e) => setBar(e.target.value)} data-testid="mark-bar" />
        <fieldset className="flex gap-4">
          <legend className="font-semibold">Kind</legend>
          {(["text", "highlight"] as const).map((k) => (
            <label key={k} className="flex min-h-11 items-center gap-2">
              <input type="radio" name={`${uid}-kind`} value={k} checked={kind === k} onChange={() => setKind(k)} className="h-5 w-5" />
              {k === "text" ? "A few words" : "Highlight the bar"}
            </label>
          ))}
        </fieldset>
        <Field
          label={kind === "text" ? "Words" : "Words (optional)"}
          value={text}
          error={textError}
          hint={`${text.trim().length} of ${MARK_TEXT_MAX} characters: a mark is a few words over one bar.`}
          onChange={(e) => {
            setText(e.target.value);
            setTextError(null);
          }}
          placeholder="breathe here"
          data-testid="mark-text"
        />
        <div className="flex gap-2">
          <Button type="submit" data-testid="mark-save">{editing ? "Change mark" : "Add mark"}</Button>
          {editing ? <Button tone="quiet" onClick={reset}>Cancel</Button> : null}
        </div>
        <p aria-live="polite" className="text-sm" data-testid="mark-status">{status}</p>
      </form>
      {marks && marks.length > 0 ? (
        <ul className="mt-3 flex flex-col gap-2" aria-label="My marks on this chart">
          {marks.map((m) => {
            const p = placeAnchor(chart, m.data.anchor);
            const where = p.status === "lost" ? `${m.data.anchor.sectionLabel}, bar ${m.data.anchor.bar + 1}` : `${names[p.section] ?? ""}, bar ${p.bar + 1}`;
            return (
              <li key={m.id} className="flex flex-wrap items-center justify-between gap-2 border-b border-ink-soft py-1" data-testid="my-mark">
                <span>
                  {where}: {m.data.kind === "highlight" ? "highlight" : ""} {m.data.text ? `“${m.data.text}”` : ""}
                  {p.status === "lost" || m.data.lost ? <strong className="ml-2 text-red-800">Its bar is gone after a revision</strong> : null}
                </span>
                <span className="flex gap-1">
                  <Button tone="quiet" onClick={() => startEdit(m)}>Edit</Button>
                  <Button tone="quiet" onClick={() => {
                    setStatus("Mark removed.");
                    if (editing?.id === m.id) reset();
                    void deleteMark(bandId, m);
                  }} aria-label={`Remove the mark at ${where}`}>Remove</Button>
                </span>
              </li>
            );
          })}
        </ul>
      ) : null}
    </section>
  );
}
