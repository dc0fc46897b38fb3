import { ready } from "@/db";
import { bringBackChart, deleteArchivedChart } from "@/lib/server/chart-archive";
import { route } from "@/lib/server/handler";
import { ChartParams } from "@/lib/validation/params";

// POST brings an archived chart back into the book; DELETE deletes it for good.
export const POST = route({ params: ChartParams }, async ({ actor, params }) => ({
  chart: await bringBackChart(await ready(), actor, params.bandId, params.chartId),
}));

export const DELETE = route({ params: ChartParams }, async ({ actor, params }) => ({
  deleted: await deleteArchivedChart(await ready(), actor, params.bandId, params.chartId),
}));
