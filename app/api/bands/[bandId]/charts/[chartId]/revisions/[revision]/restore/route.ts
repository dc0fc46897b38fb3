import { restoreRevision } from "@/lib/server/charts";
import { route } from "@/lib/server/handler";
import { announce } from "@/lib/server/push-announce";
import { RevisionParams } from "@/lib/validation/params";

export const POST = route({ params: RevisionParams }, async ({ db, actor, params }) => {
  const chart = await restoreRevision(db, actor, params.bandId, params.chartId, params.revision);
  announce(db, { bandId: params.bandId, authorId: actor?.userId ?? null, kind: "chart", chartIds: [params.chartId] });
  return { chart };
});
