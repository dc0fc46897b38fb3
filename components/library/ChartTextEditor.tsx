"use client";
// The chart text box: monospace, line numbers beside it, and a text problem pinned to its line.
import { useEffect, useId, useMemo, useRef, useState } from "react";
import { cx } from "@/components/ui/cx";
import type { TextProblem } from "./chart-form-model";

interface Props {
  value: string;
  onChange: (value: string) => void;
  problem: TextProblem | null;
  /** Where the problem was found: while typing, or by the server on save. */
  problemSource?: "live" | "server";
  disabled?: boolean;
}

const LINE = "leading-6"; // gutter and text share one line height so numbers line up

/** The value once it has stood still for `ms`: a long paste is checked once, not on every keystroke. */
export function useSettledValue<T>(value: T, ms = 300): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}

/** Line count without building an array of every line (a 5,000-line paste stays cheap). */
function countLines(text: string): number {
  let n = 1;
  for (let at = text.indexOf("\n"); at >= 0; at = text.indexOf("\n", at + 1)) n++;
  return n;
}

/** Offset in the text where a 1-based line starts. */
function lineStart(text: string, line: number): number {
  let at = 0;
  for (let n = 1; n < line; n++) {
    const next = text.indexOf("\n", at);
    if (next < 0) return text.length;
    at = next + 1;
  }
  return at;
}

export function ChartTextEditor({ value, onChange, problem, problemSource = "live", disabled }: Props) {
  const id = useId();
  const area = useRef<HTMLTextAreaElement>(null);
  const gutter = useRef<HTMLDivElement>(null);
  const lines = Math.max(countLines(value), 12);
  const problemLine = problem?.line ?? 0;
  // The gutter is one text block plus one marked line, so its cost does not grow with each keystroke.
  const numbers = useMemo(() => Array.from({ length: lines }, (_, i) => i + 1).join("\n"), [lines]);

  function showProblem() {
    const el = area.current;
    if (!el || !problem) return;
    const start = lineStart(value, problem.line);
    const end = value.indexOf("\n", start);
    el.focus();
    el.setSelectionRange(start + Math.max(0, problem.column - 1), end < 0 ? value.length : end);
  }

  return (
    <div className="flex flex-col gap-1">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <label htmlFor={id} className="font-semibold">
          Chart text
        </label>
        <a
          href="#chart-text-help"
          onClick={() => {
            const help = document.getElementById("chart-text-help");
            if (help instanceof HTMLDetailsElement) help.open = true;
          }}
          className="text-sm font-semibold text-brass-dark underline underline-offset-4">
          How to write chart text
        </a>
      </div>
      <div className={cx("flex overflow-hidden rounded-md border bg-white", problem ? "border-red-800" : "border-ink-muted")}>
        <div
          ref={gutter}
          aria-hidden="true"
          className={cx("select-none overflow-hidden border-r border-paper-dim bg-paper-dim px-2 py-2 text-right font-mono text-sm text-ink-muted", LINE)}
        >
          <div className="relative">
            <pre className={cx("m-0 font-mono", LINE)}>{numbers}</pre>
            {problemLine > 0 && problemLine <= lines ? (
              <div
                className={cx("absolute inset-x-0 bg-red-800 font-bold text-white", LINE)}
                style={{ top: `${(problemLine - 1) * 1.5}rem` }}
                data-testid="chart-text-problem-line"
              >
                {problemLine}
              </div>
            ) : null}
          </div>
        </div>
        <textarea
          ref={area}
          id={id}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          onScroll={(e) => {
            if (gutter.current) gutter.current.scrollTop = e.currentTarget.scrollTop;
          }}
          rows={Math.min(Math.max(lines, 12), 30)}
          spellCheck={false}
          autoCapitalize="off"
          autoCorrect="off"
          wrap="off"
          disabled={disabled}
          aria-invalid={problem ? true : undefined}
          aria-describedby={problem ? `${id}-problem` : undefined}
          className={cx("min-h-64 w-full resize-y bg-white px-3 py-2 font-mono text-sm text-ink outline-offset-0", LINE)}
          data-testid="chart-text"
        />
      </div>
      <div aria-live="polite">
        {problem ? (
          <p
            id={`${id}-problem`}
            className="flex flex-wrap items-center gap-2 text-sm font-semibold text-red-800"
            data-testid="chart-text-error"
            data-line={problem.line}
            data-column={problem.column}
          >
            <span>
              Line {problem.line}, column {problem.column}: {problem.message}
              {problemSource === "server" ? " (found when saving)" : ""}
            </span>
            <button type="button" onClick={showProblem} className="min-h-11 rounded-md px-2 underline underline-offset-4">
              Go to line {problem.line}
            </button>
          </p>
        ) : null}
      </div>
    </div>
  );
}

export function ChartTextHelp() {
  return (
    <details id="chart-text-help" className="rounded-md border border-paper-dim bg-white p-4 text-sm">
      <summary className="min-h-11 cursor-pointer py-2 font-semibold">How to write chart text</summary>
      <div className="mt-2 space-y-2 text-ink-soft">
        <p>Write the chart in concert pitch. Each player&rsquo;s part is transposed for them.</p>
        <ul className="list-disc space-y-1 pl-5">
          <li>
            A section starts with its name and a colon on its own line: <code className="font-mono">A:</code>,{" "}
            <code className="font-mono">Bridge:</code>, <code className="font-mono">Intro:</code> for a written intro.
          </li>
          <li>
            Bars sit between bar lines: <code className="font-mono">| Dm7 G7 | Cmaj7 |</code>. Chords in a bar share its beats
            evenly; a lone <code className="font-mono">/</code> holds the chord one more beat.
          </li>
          <li>
            <code className="font-mono">|:</code> and <code className="font-mono">:|</code> are repeats;{" "}
            <code className="font-mono">[1</code> and <code className="font-mono">[2</code> open 1st and 2nd endings.
          </li>
          <li>
            <code className="font-mono">%</code> plays the previous bar again; <code className="font-mono">N.C.</code> is no chord.
          </li>
        </ul>
        <p>The title, key, time, tempo and feel come from the fields above the text.</p>
      </div>
    </details>
  );
}
