import { z } from "zod";
import { deleteChart, getChart, updateChart } from "@/lib/server/charts";
import { route } from "@/lib/server/handler";
import { announce } from "@/lib/server/push-announce";
import { CHART_BODY_BYTES } from "@/lib/server/request-guard";
import { ChartParams } from "@/lib/validation/params";
import { ChartUpdateSchema } from "@/lib/validation/chart-input";

export const GET = route({ params: ChartParams }, async ({ db, actor, params }) => ({
  chart: await getChart(db, actor, params.bandId, params.chartId),
}));

export const PUT = route({ params: ChartParams, body: ChartUpdateSchema, maxBytes: CHART_BODY_BYTES }, async ({ db, actor, params, body }) => {
  const chart = await updateChart(db, actor, params.bandId, params.chartId, body);
  announce(db, { bandId: params.bandId, authorId: actor?.userId ?? null, kind: "chart", chartIds: [params.chartId] });
  return { chart };
});

const DeleteQuery = z.object({ baseRevision: z.coerce.number().int().min(1).optional() }).strict();

export const DELETE = route({ params: ChartParams, query: DeleteQuery }, async ({ db, actor, params, query }) => ({
  deleted: await deleteChart(db, actor, params.bandId, params.chartId, { baseRevision: query.baseRevision }),
}));
