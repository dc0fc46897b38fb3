import { bringBackChart, deleteArchivedChart } from "@/lib/server/chart-archive";
import { route } from "@/lib/server/handler";
import { ChartParams } from "@/lib/validation/params";

// POST brings an archived chart back into the book; DELETE deletes it for good.
export const POST = route({ params: ChartParams }, async ({ db, actor, params }) => ({
  chart: await bringBackChart(db, actor, params.bandId, params.chartId),
}));

export const DELETE = route({ params: ChartParams }, async ({ db, actor, params }) => ({
  deleted: await deleteArchivedChart(db, actor, params.bandId, params.chartId),
}));
