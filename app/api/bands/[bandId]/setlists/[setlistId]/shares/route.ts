import { route } from "@/lib/server/handler";
import { createShare, listShares } from "@/lib/server/shares";
import { ShareCreateSchema } from "@/lib/setlist";
import { SetlistParams } from "@/lib/validation/params";

export const GET = route({ params: SetlistParams }, async ({ db, actor, params }) => ({
  shares: await listShares(db, actor, params.bandId, params.setlistId),
}));

// The link is mailed to the sub and returned to the leader, who may pass it on by hand.
export const POST = route({ params: SetlistParams, body: ShareCreateSchema }, async ({ db, actor, params, body }) =>
  createShare(db, actor, params.bandId, params.setlistId, body),
);
