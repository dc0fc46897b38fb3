"use client";
// The band's library: read from the local book (never straight from the network), so it looks and
// works the same with and without signal. Search, sort and filters live in the address.
import { JoinedPrompt } from "@/components/push/JoinedPrompt";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useCallback, useMemo } from "react";
import { LinkButton } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { PageColumn } from "@/components/ui/Page";
import { useBandCharts, useMembership, useMyBands } from "@/lib/offline/hooks";
import { useBandRoute } from "@/lib/offline/route";
import { ArchivedCharts } from "./ArchivedCharts";
import { DigestButton } from "./DigestButton";
import { LibraryControls } from "./LibraryControls";
import { LibraryTable } from "./LibraryTable";
import { SubEmptyBook } from "./SubNotices";
import { applyQuery, facets, readQuery, writeQuery, type LibraryQuery, type SortColumn } from "./query";
import { can } from "@/lib/band/roles";

export function LibraryScreen() {
  const { bandId } = useBandRoute();
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  const query = useMemo(() => readQuery(params), [params]);
  const charts = useBandCharts(bandId ?? "");
  const membership = useMembership(bandId ?? "");
  const bands = useMyBands();
  const band = bands?.find((b) => b.id === bandId);
  const canEdit = can(membership?.role, "editCharts");

  const setQuery = useCallback(
    (next: LibraryQuery) => router.replace(`${pathname}${writeQuery(next)}`, { scroll: false }),
    [router, pathname],
  );
  const onSort = useCallback(
    (column: SortColumn) =>
      setQuery({ ...query, sort: column, dir: query.sort === column && query.dir === "asc" ? "desc" : "asc" }),
    [query, setQuery],
  );

  const all = useMemo(() => charts ?? [], [charts]);
  const shown = useMemo(() => applyQuery(all, query), [all, query]);
  const { keys, feels } = useMemo(() => facets(all), [all]);
  const updated = all.filter((c) => c.unseen).length;
  const copies = all.filter((c) => c.conflictOf).length;

  if (!bandId) return null;
  return (
    <PageColumn wide>
      <JoinedPrompt />
      <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold tracking-tight sm:text-3xl">Library</h1>
          <p className="text-ink-muted" data-testid="library-summary">
            {band ? `${band.name} · ` : ""}
            {charts === undefined ? "Opening the book…" : `${all.length} ${all.length === 1 ? "chart" : "charts"}`}
            {updated ? ` · ${updated} updated since you last opened them` : ""}
            {copies ? ` · ${copies} ${copies === 1 ? "copy" : "copies"} of your edits that clashed with a newer version` : ""}
          </p>
        </div>
        {canEdit ? (
          <div className="flex flex-wrap items-start gap-3">
            <DigestButton bandId={bandId} />
            <LinkButton href={`/bands/${encodeURIComponent(bandId)}/charts/new`} data-testid="new-chart">
              New chart
            </LinkButton>
          </div>
        ) : null}
      </div>

      <LibraryControls query={query} keys={keys} feels={feels} onChange={setQuery} />

      <p className="sr-only" aria-live="polite" data-testid="library-count">
        {charts === undefined ? "" : `${shown.length} of ${all.length} charts shown`}
      </p>

      <div className="mt-4">
        {charts === undefined ? (
          <LibrarySkeleton />
        ) : all.length === 0 && membership && !can(membership.role, "readBook") ? (
          <SubEmptyBook bandId={bandId} />
        ) : all.length === 0 ? (
          <Notice title="The book is empty">
            {canEdit
              ? "Add the band's first chart with “New chart”."
              : "When the leader or an arranger adds charts, they will appear here."}
          </Notice>
        ) : shown.length === 0 ? (
          <Notice title="No chart matches">Try another search, or clear the filters.</Notice>
        ) : (
          <LibraryTable bandId={bandId} charts={shown} query={query} canEdit={canEdit} onSort={onSort} />
        )}
      </div>
      {canEdit ? <ArchivedCharts bandId={bandId} /> : null}
    </PageColumn>
  );
}

/** Rows' shapes while the device's copy opens, so the page never sits blank. */
function LibrarySkeleton() {
  return (
    <div role="status" aria-busy="true" data-testid="library-skeleton">
      <span className="sr-only">Opening the book…</span>
      <ul aria-hidden="true" className="flex flex-col gap-2">
        {Array.from({ length: 6 }, (_, i) => (
          <li key={i} className="h-14 animate-pulse rounded-md border border-paper-dim bg-paper-dim" />
        ))}
      </ul>
    </div>
  );
}
