import { NextResponse } from "next/server";
import { z } from "zod";
import { createChart, listCharts } from "@/lib/server/charts";
import { route } from "@/lib/server/handler";
import { CHART_BODY_BYTES } from "@/lib/server/request-guard";
import { BandParams } from "@/lib/validation/params";
import { ChartCreateSchema } from "@/lib/validation/chart-input";

const ListQuery = z.object({ includeDeleted: z.enum(["0", "1", "true", "false"]).optional() }).strict();

export const GET = route({ params: BandParams, query: ListQuery }, async ({ db, actor, params, query }) => ({
  charts: await listCharts(db, actor, params.bandId, {
    includeDeleted: query.includeDeleted === "1" || query.includeDeleted === "true",
  }),
}));

export const POST = route({ params: BandParams, body: ChartCreateSchema, maxBytes: CHART_BODY_BYTES }, async ({ db, actor, params, body }) =>
  NextResponse.json({ chart: await createChart(db, actor, params.bandId, body) }, { status: 201 }),
);
