import { route } from "@/lib/server/handler";
import { duplicateSetlist } from "@/lib/server/setlists";
import { SetlistDuplicateSchema } from "@/lib/setlist";
import { SetlistParams } from "@/lib/validation/params";

export const POST = route({ params: SetlistParams, body: SetlistDuplicateSchema }, async ({ db, actor, params, body }) => ({
  setlist: await duplicateSetlist(db, actor, params.bandId, params.setlistId, body),
}));
