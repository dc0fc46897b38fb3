import { listRevisions } from "@/lib/server/charts";
import { route } from "@/lib/server/handler";
import { ChartParams } from "@/lib/validation/params";

export const GET = route({ params: ChartParams }, async ({ db, actor, params }) => ({
  revisions: await listRevisions(db, actor, params.bandId, params.chartId),
}));
