import { ready } from "@/db";
import { listRevisions } from "@/lib/server/charts";
import { route } from "@/lib/server/handler";
import { ChartParams } from "@/lib/validation/params";

export const GET = route({ params: ChartParams }, async ({ actor, params }) => ({
  revisions: await listRevisions(await ready(), actor, params.bandId, params.chartId),
}));
