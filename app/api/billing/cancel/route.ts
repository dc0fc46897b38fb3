import { z } from "zod";
import { ready } from "@/db";
import { cancelPlan, getPlanStatus } from "@/lib/server/billing";
import { route } from "@/lib/server/handler";
import { IdSchema } from "@/lib/validation/common";

export const POST = route({ body: z.object({ bandId: IdSchema }).strict() }, async ({ actor, body }) => {
  const db = await ready();
  await cancelPlan(db, actor, body.bandId);
  return { plan: await getPlanStatus(db, actor, body.bandId) };
});
