// The library's search, sort and filter, read from and written to the address bar so a view can be
// bookmarked, shared and restored by the back button. Pure: works on any row with these fields.
import type { LocalChart } from "@/lib/offline/types";

export type LibraryRow = Pick<LocalChart, "id" | "title" | "composer" | "key" | "feel" | "tempo" | "updatedAt">;

export const SORT_COLUMNS = ["title", "composer", "key", "feel", "tempo", "updated"] as const;
export type SortColumn = (typeof SORT_COLUMNS)[number];
export type SortDirection = "asc" | "desc";

export interface LibraryQuery {
  q: string;
  sort: SortColumn;
  dir: SortDirection;
  key: string;
  feel: string;
}

export const DEFAULT_QUERY: LibraryQuery = { q: "", sort: "title", dir: "asc", key: "", feel: "" };

interface ParamsLike {
  get(name: string): string | null;
}

export function readQuery(params: ParamsLike): LibraryQuery {
  const sort = params.get("sort");
  const dir = params.get("dir");
  return {
    q: (params.get("q") ?? "").slice(0, 200),
    sort: (SORT_COLUMNS as readonly string[]).includes(sort ?? "") ? (sort as SortColumn) : DEFAULT_QUERY.sort,
    dir: dir === "desc" ? "desc" : "asc",
    key: (params.get("key") ?? "").slice(0, 8),
    feel: (params.get("feel") ?? "").slice(0, 60),
  };
}

/** The query string for a view; defaults are left out so the plain library URL stays plain. */
export function writeQuery(query: LibraryQuery): string {
  const out = new URLSearchParams();
  if (query.q) out.set("q", query.q);
  if (query.sort !== DEFAULT_QUERY.sort) out.set("sort", query.sort);
  if (query.dir !== DEFAULT_QUERY.dir) out.set("dir", query.dir);
  if (query.key) out.set("key", query.key);
  if (query.feel) out.set("feel", query.feel);
  const s = out.toString();
  return s ? `?${s}` : "";
}

const fold = (s: string) => s.normalize("NFD").replace(/\p{M}/gu, "").toLowerCase();

function compare(a: LibraryRow, b: LibraryRow, sort: SortColumn): number {
  switch (sort) {
    case "tempo":
      // Charts without a tempo go last whichever way the column is sorted.
      if (a.tempo === null || b.tempo === null) return 0;
      return a.tempo - b.tempo;
    case "updated":
      return a.updatedAt < b.updatedAt ? -1 : a.updatedAt > b.updatedAt ? 1 : 0;
    case "key":
      return a.key.localeCompare(b.key, "en");
    case "composer":
      return a.composer.localeCompare(b.composer, "en", { sensitivity: "base" });
    case "feel":
      return a.feel.localeCompare(b.feel, "en", { sensitivity: "base" });
    case "title":
      return a.title.localeCompare(b.title, "en", { sensitivity: "base", numeric: true });
  }
}

export function applyQuery<T extends LibraryRow>(rows: readonly T[], query: LibraryQuery): T[] {
  const needle = fold(query.q.trim());
  const kept = rows.filter((r) => {
    if (query.key && r.key !== query.key) return false;
    if (query.feel && fold(r.feel) !== fold(query.feel)) return false;
    if (!needle) return true;
    return fold(`${r.title} ${r.composer} ${r.feel}`).includes(needle);
  });
  const sign = query.dir === "desc" ? -1 : 1;
  return kept.sort((a, b) => {
    if (query.sort === "tempo" && (a.tempo === null) !== (b.tempo === null)) return a.tempo === null ? 1 : -1;
    return sign * compare(a, b, query.sort) || a.title.localeCompare(b.title, "en", { sensitivity: "base" });
  });
}

/** Distinct keys and feels present in the book, for the filter menus. */
export function facets(rows: readonly LibraryRow[]): { keys: string[]; feels: string[] } {
  const keys = [...new Set(rows.map((r) => r.key).filter(Boolean))].sort((a, b) => a.localeCompare(b, "en"));
  const byFold = new Map<string, string>();
  for (const r of rows) if (r.feel && !byFold.has(fold(r.feel))) byFold.set(fold(r.feel), r.feel);
  const feels = [...byFold.values()].sort((a, b) => a.localeCompare(b, "en", { sensitivity: "base" }));
  return { keys, feels };
}
