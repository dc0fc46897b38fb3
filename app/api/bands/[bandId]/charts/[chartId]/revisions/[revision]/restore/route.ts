import { ready } from "@/db";
import { restoreRevision } from "@/lib/server/charts";
import { route } from "@/lib/server/handler";
import { RevisionParams } from "@/lib/validation/band";

export const POST = route({ params: RevisionParams }, async ({ actor, params }) => ({
  chart: await restoreRevision(await ready(), actor, params.bandId, params.chartId, params.revision),
}));
