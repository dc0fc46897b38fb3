"use client";
// The new-chart and edit-chart screens: band shells that read ids from the address and the chart
// from the local book. Only leaders and arrangers get the form; the server checks again on save.
import type { ReactNode } from "react";
import { LinkButton } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { useChart, useMembership } from "@/lib/offline/hooks";
import { useBandRoute } from "@/lib/offline/route";
import { ChartForm } from "./ChartForm";
import { ChartRemoval } from "./ChartRemoval";
import { emptyValues, valuesFrom } from "./chart-form-model";
import { can } from "@/lib/band/roles";

function EditorsOnly({ bandId, children }: { bandId: string; children: ReactNode }) {
  const membership = useMembership(bandId);
  if (membership === undefined) return <p className="text-ink-muted">Opening the book…</p>;
  if (!can(membership?.role, "editCharts")) {
    return (
      <Notice title="Only the leader and arrangers edit charts" testId="edit-refused">
        <p>Ask the leader if a chart needs fixing.</p>
        <LinkButton href={`/bands/${encodeURIComponent(bandId)}`} tone="secondary" className="mt-3">
          Back to the library
        </LinkButton>
      </Notice>
    );
  }
  return <>{children}</>;
}

export function NewChartScreen() {
  const { bandId } = useBandRoute();
  if (!bandId) return null;
  return (
    <PageColumn>
      <PageTitle lead="Write it in concert pitch; every player reads it in their own key.">New chart</PageTitle>
      <EditorsOnly bandId={bandId}>
        <ChartForm bandId={bandId} initial={emptyValues()} />
      </EditorsOnly>
    </PageColumn>
  );
}

function EditLoaded({ bandId, chartId }: { bandId: string; chartId: string }) {
  const chart = useChart(bandId, chartId);
  if (chart === undefined) return <p className="text-ink-muted">Opening the chart…</p>;
  if (chart === null || chart.bandId !== bandId) {
    return (
      <Notice kind="error" title="That chart is not in this band's book">
        <LinkButton href={`/bands/${encodeURIComponent(bandId)}`} tone="secondary" className="mt-3">
          Back to the library
        </LinkButton>
      </Notice>
    );
  }
  // Keyed by chart, not revision: a newer version arriving mid-edit must not wipe what is typed;
  // saving then meets the conflict and shows both versions.
  return (
    <>
      <ChartForm key={chart.id} bandId={bandId} initial={valuesFrom(chart)} editing={{ chartId: chart.id, revision: chart.revision }} />
      <ChartRemoval bandId={bandId} chartId={chart.id} revision={chart.revision} title={chart.title} />
    </>
  );
}

export function EditChartScreen() {
  const { bandId, chartId } = useBandRoute();
  if (!bandId || !chartId) return null;
  return (
    <PageColumn>
      <PageTitle>Edit chart</PageTitle>
      <EditorsOnly bandId={bandId}>
        <EditLoaded bandId={bandId} chartId={chartId} />
      </EditorsOnly>
    </PageColumn>
  );
}
