"use client";
import { useEffect, useId, useRef } from "react";
import { CONTROL } from "@/components/ui/Field";
import { keyInWords } from "@/lib/music/part-key";
import { DEFAULT_QUERY, SORT_COLUMNS, type LibraryQuery, type SortColumn } from "./query";

export const SORT_LABELS: Record<SortColumn, string> = {
  title: "Title",
  composer: "Composer",
  key: "Concert key",
  feel: "Feel",
  tempo: "Tempo",
  updated: "Last update",
};

interface Props {
  query: LibraryQuery;
  keys: string[];
  feels: string[];
  onChange: (next: LibraryQuery) => void;
}

/**
 * Search box, sort and the two filters. Every change goes straight into the address. On a phone the
 * three menus share one row, so the first chart shows without scrolling.
 */
export function LibraryControls({ query, keys, feels, onChange }: Props) {
  const id = useId();
  // The box is uncontrolled so typing stays smooth; the address follows a moment later.
  const box = useRef<HTMLInputElement>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(() => () => {
    if (timer.current) clearTimeout(timer.current);
  }, []);
  function typed(value: string) {
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => onChange({ ...query, q: value }), 150);
  }

  const filtered = query.q || query.key || query.feel;
  return (
    <form role="search" aria-label="Find charts" className="grid grid-cols-3 gap-2 sm:gap-3 lg:grid-cols-[2fr_1fr_1fr_1fr]" onSubmit={(e) => e.preventDefault()}>
      <div className="col-span-3 flex flex-col gap-1 lg:col-span-1">
        <label htmlFor={`${id}-q`} className="font-semibold">
          Search
        </label>
        <div className="flex gap-2">
          <input
            id={`${id}-q`}
            type="search"
            className={CONTROL}
            ref={box}
            defaultValue={query.q}
            placeholder="Title, composer or feel"
            onChange={(e) => typed(e.target.value)}
            data-testid="library-search"
          />
          <button
            type="button"
            className="min-h-11 shrink-0 rounded-md border border-ink-soft px-4 font-semibold disabled:opacity-50"
            disabled={!filtered}
            onClick={() => {
              if (timer.current) clearTimeout(timer.current);
              if (box.current) box.current.value = "";
              onChange({ ...DEFAULT_QUERY, sort: query.sort, dir: query.dir });
            }}
            data-testid="library-clear"
          >
            Clear
          </button>
        </div>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-key`} className="text-sm font-semibold sm:text-base">
          Concert key
        </label>
        <select id={`${id}-key`} className={CONTROL} value={query.key} onChange={(e) => onChange({ ...query, key: e.target.value })} data-testid="library-filter-key">
          <option value="">Any key</option>
          {keys.map((k) => (
            <option key={k} value={k}>
              {keyInWords(k)}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-feel`} className="text-sm font-semibold sm:text-base">
          Feel
        </label>
        <select id={`${id}-feel`} className={CONTROL} value={query.feel} onChange={(e) => onChange({ ...query, feel: e.target.value })} data-testid="library-filter-feel">
          <option value="">Any feel</option>
          {feels.map((f) => (
            <option key={f} value={f}>
              {f}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-sort`} className="text-sm font-semibold sm:text-base">
          Sort by
        </label>
        <select
          id={`${id}-sort`}
          className={CONTROL}
          value={`${query.sort}:${query.dir}`}
          onChange={(e) => {
            const [sort, dir] = e.target.value.split(":") as [SortColumn, "asc" | "desc"];
            onChange({ ...query, sort, dir });
          }}
          data-testid="library-sort"
        >
          {SORT_COLUMNS.flatMap((c) => [
            <option key={`${c}:asc`} value={`${c}:asc`}>
              {SORT_LABELS[c]} {c === "tempo" ? "(slow first)" : c === "updated" ? "(oldest first)" : "(A–Z)"}
            </option>,
            <option key={`${c}:desc`} value={`${c}:desc`}>
              {SORT_LABELS[c]} {c === "tempo" ? "(fast first)" : c === "updated" ? "(newest first)" : "(Z–A)"}
            </option>,
          ])}
        </select>
      </div>
    </form>
  );
}
