import { ready } from "@/db";
import { listRevisions } from "@/lib/server/charts";
import { route } from "@/lib/server/handler";
import { ChartParams } from "@/lib/validation/band";

export const GET = route({ params: ChartParams }, async ({ actor, params }) => ({
  revisions: await listRevisions(await ready(), actor, params.bandId, params.chartId),
}));
