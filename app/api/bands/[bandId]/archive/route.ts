import { z } from "zod";
import { archiveChart, listArchivedCharts } from "@/lib/server/chart-archive";
import { route } from "@/lib/server/handler";
import { BandParams } from "@/lib/validation/params";
import { IdSchema } from "@/lib/validation/common";

// The band's archived charts (leaders and arrangers), and putting one away.
export const GET = route({ params: BandParams }, async ({ db, actor, params }) => ({
  charts: await listArchivedCharts(db, actor, params.bandId),
}));

const ArchiveBody = z.object({ chartId: IdSchema }).strict();

export const POST = route({ params: BandParams, body: ArchiveBody }, async ({ db, actor, params, body }) => ({
  archived: await archiveChart(db, actor, params.bandId, body.chartId),
}));
