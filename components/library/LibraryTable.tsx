"use client";
// The book as a table. On a phone the side columns fold into a second line under the title,
// so the table stays one table (one link per chart) at every width.
import Link from "next/link";
import { formatDate } from "@/components/ui/labels";
import { keyInWords } from "@/lib/music/part-key";
import { cx } from "@/components/ui/cx";
import type { LocalChart } from "@/lib/offline/types";
import type { LibraryQuery, LibraryRow, SortColumn } from "./query";
import { SORT_LABELS } from "./LibraryControls";

/** A row of the table: `conflictOf` is set on a conflict copy (the chart this device's edit was meant to change). */
export type TableChart = LibraryRow & Pick<LocalChart, "unseen" | "updatedBy" | "conflictOf">;

interface Props {
  bandId: string;
  charts: TableChart[];
  query: LibraryQuery;
  canEdit: boolean;
  onSort: (column: SortColumn) => void;
}

function SortHeader({ column, query, onSort, className }: { column: SortColumn; query: LibraryQuery; onSort: Props["onSort"]; className?: string }) {
  const active = query.sort === column;
  const ariaSort = active ? (query.dir === "asc" ? "ascending" : "descending") : "none";
  return (
    <th scope="col" aria-sort={ariaSort} className={cx("px-3 py-2 text-left", className)}>
      <button
        type="button"
        onClick={() => onSort(column)}
        className="inline-flex min-h-11 items-center gap-1 font-semibold hover:underline"
        data-testid={`sort-${column}`}
      >
        {SORT_LABELS[column]}
        <span aria-hidden="true" className={active ? "text-brass-dark" : "text-ink-muted"}>
          {active && query.dir === "desc" ? "▼" : "▲"}
        </span>
      </button>
    </th>
  );
}

export function UpdatedMark() {
  return (
    <span className="ml-2 inline-block rounded-full bg-brass-light px-2 py-0.5 align-middle text-xs font-bold uppercase tracking-wide text-brass-dark" data-testid="updated-mark">
      updated
      <span className="sr-only"> since you last opened it</span>
    </span>
  );
}

export function LibraryTable({ bandId, charts, query, canEdit, onSort }: Props) {
  const base = `/bands/${encodeURIComponent(bandId)}/charts`;
  return (
    <div className="overflow-x-auto rounded-lg border border-paper-dim bg-white">
      <table className="w-full border-collapse text-left" data-testid="library-table">
        <caption className="sr-only">
          Charts in the book, sorted by {SORT_LABELS[query.sort].toLowerCase()}
          {query.dir === "desc" ? ", descending" : ""}
        </caption>
        <thead className="border-b border-paper-dim bg-paper-dim/60 text-sm">
          <tr>
            <SortHeader column="title" query={query} onSort={onSort} />
            <SortHeader column="composer" query={query} onSort={onSort} className="hidden md:table-cell" />
            <SortHeader column="key" query={query} onSort={onSort} />
            <SortHeader column="feel" query={query} onSort={onSort} className="hidden sm:table-cell" />
            <SortHeader column="tempo" query={query} onSort={onSort} className="hidden sm:table-cell" />
            <SortHeader column="updated" query={query} onSort={onSort} className="hidden lg:table-cell" />
            {canEdit ? (
              <th scope="col" className="px-3 py-2">
                <span className="sr-only">Edit</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {charts.map((c) => (
            <tr
              key={c.id}
              className="border-b border-paper-dim last:border-b-0 hover:bg-paper"
              data-testid="library-row"
              data-chart-id={c.id}
              data-updated={c.unseen ? "true" : undefined}
              data-changed={c.unseen ? "true" : undefined}
              data-copy={c.conflictOf ? "true" : undefined}
            >
              <td className="px-3 py-2">
                <Link href={`${base}/${encodeURIComponent(c.id)}`} className="inline-flex min-h-11 items-center font-semibold text-ink underline-offset-4 hover:underline" data-testid="chart-link">
                  {c.title}
                </Link>
                {c.unseen ? <UpdatedMark /> : null}
                {c.conflictOf ? (
                  <span className="ml-2 inline-block rounded-full border border-red-800 px-2 py-0.5 align-middle text-xs font-bold text-red-800" data-testid="copy-mark">
                    your clashing copy
                  </span>
                ) : null}
                <p className="text-sm text-ink-muted md:hidden">
                  {[c.composer, c.feel, c.tempo ? `♩= ${c.tempo}` : ""].filter(Boolean).join(" · ")}
                </p>
              </td>
              <td className="hidden px-3 py-2 text-ink-soft md:table-cell">{c.composer}</td>
              <td className="px-3 py-2 font-semibold" data-testid="cell-key">
                {keyInWords(c.key)}
              </td>
              <td className="hidden px-3 py-2 sm:table-cell" data-testid="cell-feel">
                {c.feel}
              </td>
              <td className="hidden px-3 py-2 tabular-nums sm:table-cell" data-testid="cell-tempo">
                {c.tempo ?? <span className="text-ink-muted">—</span>}
              </td>
              <td className="hidden px-3 py-2 text-sm text-ink-soft lg:table-cell">
                <time dateTime={c.updatedAt}>{formatDate(c.updatedAt)}</time>
                {c.updatedBy.name ? <span className="block text-ink-muted">by {c.updatedBy.name}</span> : null}
              </td>
              {canEdit ? (
                <td className="px-3 py-2 text-right">
                  <Link
                    href={`${base}/${encodeURIComponent(c.id)}/edit`}
                    className="inline-flex min-h-11 items-center rounded-md px-3 font-semibold text-brass-dark underline-offset-4 hover:underline"
                    data-testid="edit-chart"
                  >
                    Edit<span className="sr-only"> {c.title}</span>
                  </Link>
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
