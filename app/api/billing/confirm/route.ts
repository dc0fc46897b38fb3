import { z } from "zod";
import { confirmCheckout, getPlanStatus } from "@/lib/server/billing";
import { route } from "@/lib/server/handler";
import { IdSchema } from "@/lib/validation/common";

const Body = z.object({ bandId: IdSchema, sessionId: z.string().regex(/^cs_[\w]{4,200}$/, "Not a checkout session id") }).strict();

export const POST = route({ body: Body }, async ({ db, actor, body }) => {
  await confirmCheckout(db, actor, body.bandId, body.sessionId);
  return { plan: await getPlanStatus(db, actor, body.bandId) };
});
