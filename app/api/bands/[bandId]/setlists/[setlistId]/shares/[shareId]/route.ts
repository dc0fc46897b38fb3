import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { revokeShare } from "@/lib/server/shares";
import { ShareParams } from "@/lib/validation/params";

export const DELETE = route({ params: ShareParams }, async ({ actor, params }) => ({
  share: await revokeShare(await ready(), actor, params.bandId, params.shareId),
}));
