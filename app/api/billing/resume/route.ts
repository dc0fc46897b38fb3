import { z } from "zod";
import { resumePlan, getPlanStatus } from "@/lib/server/billing";
import { route } from "@/lib/server/handler";
import { IdSchema } from "@/lib/validation/common";

export const POST = route({ body: z.object({ bandId: IdSchema }).strict() }, async ({ db, actor, body }) => {
  await resumePlan(db, actor, body.bandId);
  return { plan: await getPlanStatus(db, actor, body.bandId) };
});
