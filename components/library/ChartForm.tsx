"use client";
// Create or edit a chart: the metadata, the chart text (checked as you type) and a change message.
// Saving goes through the offline layer, which publishes at once or queues the edit without signal.
import { useRouter } from "next/navigation";
import { useMemo, useState, type FormEvent } from "react";
import { Button, LinkButton } from "@/components/ui/Button";
import { Field, SelectField } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { MAJOR_KEYS, MINOR_KEYS } from "@/lib/music/keys";
import { keyNameInWords } from "@/lib/music/part-key";
import { ChartTextError, parseChartText } from "@/lib/chart";
import { saveChart } from "@/lib/offline/mutations";
import { ChartTextEditor, ChartTextHelp, useSettledValue } from "./ChartTextEditor";
import { ConflictPanel, type ConflictVersion } from "./ConflictPanel";
import {
  FEEL_SUGGESTIONS,
  METER_CHOICES,
  composeText,
  fromServerFields,
  placeProblem,
  toInput,
  valuesFrom,
  type ChartFormValues,
  type FieldErrors,
  type TextProblem,
} from "./chart-form-model";

interface Props {
  bandId: string;
  initial: ChartFormValues;
  /** Set when editing: the chart and the revision this edit starts from. */
  editing?: { chartId: string; revision: number };
}

type Placed = ReturnType<typeof placeProblem>;

/** Parses the text as it would be saved, and says where in the form the first problem is. */
function liveProblem(values: ChartFormValues): Placed | null {
  // An empty title is the title field's own error on save; it should not point into the text.
  const composed = composeText({ ...values, title: values.title.trim() || "Untitled" });
  try {
    parseChartText(composed.text);
    return null;
  } catch (err) {
    if (err instanceof ChartTextError) return placeProblem(composed, { line: err.line, column: err.column, message: err.message });
    return null;
  }
}

function keyOptions(current: string) {
  const all: string[] = [...MAJOR_KEYS, ...MINOR_KEYS];
  const list = all.includes(current) || !current ? all : [current, ...all];
  return list.map((k) => ({ value: k, label: keyNameInWords(k) }));
}

export function ChartForm({ bandId, initial, editing }: Props) {
  const router = useRouter();
  const [values, setValues] = useState<ChartFormValues>(initial);
  const [baseRevision, setBaseRevision] = useState(editing?.revision ?? 0);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [serverProblem, setServerProblem] = useState<TextProblem | null>(null);
  const [conflict, setConflict] = useState<ConflictVersion | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const [earlier, setEarlier] = useState<string | null>(null);

  // Checked once typing settles, so a long paste costs one parse instead of one per keystroke.
  const deferred = useSettledValue(values);
  const live = useMemo(() => liveProblem(deferred), [deferred]);
  const liveText = live && !("field" in live) ? live : null;
  const liveField = live && "field" in live ? live : null;
  // A server finding stands until the text is touched again; then the live check takes over.
  const problem = serverProblem ?? liveText;
  const fieldError = (name: keyof ChartFormValues) => errors[name] ?? (liveField?.field === name ? liveField.message : undefined);

  const set = (name: keyof ChartFormValues) => (value: string) => {
    setValues((v) => ({ ...v, [name]: value }));
    if (name === "sourceText") setServerProblem(null);
    setErrors((e) => ({ ...e, [name]: undefined }));
  };

  const back = editing
    ? `/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(editing.chartId)}`
    : `/bands/${encodeURIComponent(bandId)}`;

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFailure(null);
    const checked = toInput(values);
    if (!checked.ok) {
      setErrors(checked.errors);
      return;
    }
    const now = liveProblem(values);
    if (now) {
      setFailure("field" in now ? `Check the ${now.field} field: ${now.message}` : `The chart text has a problem on line ${now.line}. Fix it before saving.`);
      return;
    }
    setSaving(true);
    try {
      const result = await saveChart(bandId, editing ? { ...checked.input, id: editing.chartId, baseRevision } : checked.input);
      if (result.status === "saved" || result.status === "queued") {
        const id = result.row.id;
        router.push(id ? `/bands/${encodeURIComponent(bandId)}/charts/${encodeURIComponent(id)}` : back);
        return;
      }
      if (result.status === "conflict") {
        setConflict(result.current);
        return;
      }
      const { errors: fieldErrors, text } = fromServerFields(result.fields, composeText(values));
      setErrors(fieldErrors);
      setServerProblem(text);
      setFailure(result.message || "The server did not accept this chart. Check the marked fields.");
    } catch (err) {
      console.error(err);
      setFailure("The chart could not be saved on this device. Try again.");
    } finally {
      setSaving(false);
    }
  }

  function loadCurrent(current: ConflictVersion) {
    setEarlier(values.sourceText);
    setValues({ ...valuesFrom(current), message: values.message });
    setBaseRevision(current.revision);
    setConflict(null);
    setFailure(null);
    setErrors({});
    setServerProblem(null);
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5" data-testid="chart-form" aria-busy={saving}>
      {conflict ? <ConflictPanel current={conflict} mine={values.sourceText} onLoad={() => loadCurrent(conflict)} /> : null}
      <div aria-live="assertive">{failure ? <Notice kind="error" title="Not saved" testId="chart-form-error">{failure}</Notice> : null}</div>

      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Title" name="title" value={values.title} onChange={(e) => set("title")(e.target.value)} error={fieldError("title")} required maxLength={200} data-testid="chart-title" />
        <Field label="Composer" name="composer" value={values.composer} onChange={(e) => set("composer")(e.target.value)} error={fieldError("composer")} maxLength={200} data-testid="chart-composer" />
        <SelectField label="Concert key" name="key" value={values.key} onChange={(e) => set("key")(e.target.value)} error={fieldError("key")} options={keyOptions(values.key)} data-testid="chart-key" />
        <SelectField
          label="Time signature"
          name="meter"
          value={values.meter}
          onChange={(e) => set("meter")(e.target.value)}
          error={fieldError("meter")}
          options={(METER_CHOICES.includes(values.meter) ? METER_CHOICES : [values.meter, ...METER_CHOICES]).map((m) => ({ value: m, label: m }))}
          data-testid="chart-meter"
        />
        <Field
          label="Tempo (beats per minute)"
          name="tempo"
          inputMode="numeric"
          value={values.tempo}
          onChange={(e) => set("tempo")(e.target.value)}
          error={fieldError("tempo")}
          hint="Leave empty to count it off by feel."
          data-testid="chart-tempo"
        />
        <Field label="Feel" name="feel" list="feel-suggestions" value={values.feel} onChange={(e) => set("feel")(e.target.value)} error={fieldError("feel")} maxLength={60} hint="For example medium swing, ballad, bossa." data-testid="chart-feel" />
        <datalist id="feel-suggestions">
          {FEEL_SUGGESTIONS.map((f) => (
            <option key={f} value={f} />
          ))}
        </datalist>
      </div>

      <ChartTextEditor value={values.sourceText} onChange={set("sourceText")} problem={problem} problemSource={serverProblem ? "server" : "live"} />
      {errors.sourceText ? <p className="text-sm font-semibold text-red-800">{errors.sourceText}</p> : null}
      {earlier !== null ? (
        <details className="rounded-md border border-paper-dim bg-white p-4 text-sm" open>
          <summary className="min-h-11 cursor-pointer py-2 font-semibold">Your text from before the reload</summary>
          <pre className="mt-2 max-h-64 overflow-auto font-mono" tabIndex={0} data-testid="conflict-earlier">
            {earlier}
          </pre>
        </details>
      ) : null}
      <ChartTextHelp />

      <Field
        label="What changed"
        name="message"
        value={values.message}
        onChange={(e) => set("message")(e.target.value)}
        error={fieldError("message")}
        maxLength={200}
        hint="A few words for the band's history, such as “new intro” or “fixed bar 12”."
        data-testid="chart-message"
      />

      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={saving} data-testid="chart-save">
          {saving ? "Saving…" : editing ? "Save changes" : "Add to the book"}
        </Button>
        <LinkButton href={back} tone="secondary">
          Cancel
        </LinkButton>
      </div>
    </form>
  );
}
