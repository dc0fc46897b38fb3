import { z } from "zod";
import { route } from "@/lib/server/handler";
import { acceptInvite } from "@/lib/server/members";
import { IdSchema } from "@/lib/validation/common";
import { TokenParams } from "@/lib/validation/params";

// The band may be named in the query (the invite page knows it) so a link used for the wrong band fails.
const AcceptQuery = z.object({ bandId: IdSchema.optional() }).strict();

export const POST = route({ params: TokenParams, query: AcceptQuery }, async ({ db, actor, params, query }) =>
  acceptInvite(db, actor, params.token, { bandId: query.bandId }),
);
