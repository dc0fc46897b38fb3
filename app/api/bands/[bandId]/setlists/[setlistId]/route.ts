import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { SETLIST_BODY_BYTES } from "@/lib/server/request-guard";
import { deleteSetlist, getSetlist, updateSetlist } from "@/lib/server/setlists";
import { SetlistUpdateSchema } from "@/lib/setlist";
import { SetlistParams } from "../params";

export const GET = route({ params: SetlistParams }, async ({ actor, params }) => ({
  setlist: await getSetlist(await ready(), actor, params.bandId, params.setlistId),
}));

export const PUT = route({ params: SetlistParams, body: SetlistUpdateSchema, maxBytes: SETLIST_BODY_BYTES }, async ({ actor, params, body }) => ({
  setlist: await updateSetlist(await ready(), actor, params.bandId, params.setlistId, body),
}));

export const DELETE = route({ params: SetlistParams }, async ({ actor, params }) => {
  await deleteSetlist(await ready(), actor, params.bandId, params.setlistId);
  return { deleted: true };
});
