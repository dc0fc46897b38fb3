import { route } from "@/lib/server/handler";
import { revokeShare } from "@/lib/server/shares";
import { ShareParams } from "@/lib/validation/params";

export const DELETE = route({ params: ShareParams }, async ({ db, actor, params }) => ({
  share: await revokeShare(db, actor, params.bandId, params.shareId),
}));
