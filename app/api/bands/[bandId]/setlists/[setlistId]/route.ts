import { route } from "@/lib/server/handler";
import { announce } from "@/lib/server/push-announce";
import { SETLIST_BODY_BYTES } from "@/lib/server/request-guard";
import { deleteSetlist, getSetlist, updateSetlist } from "@/lib/server/setlists";
import { SetlistUpdateSchema } from "@/lib/setlist";
import { SetlistParams } from "@/lib/validation/params";

export const GET = route({ params: SetlistParams }, async ({ db, actor, params }) => ({
  setlist: await getSetlist(db, actor, params.bandId, params.setlistId),
}));

export const PUT = route({ params: SetlistParams, body: SetlistUpdateSchema, maxBytes: SETLIST_BODY_BYTES }, async ({ db, actor, params, body }) => {
  const setlist = await updateSetlist(db, actor, params.bandId, params.setlistId, body);
  announce(db, { bandId: params.bandId, authorId: actor?.userId ?? null, kind: "setlist", setlistId: params.setlistId });
  return { setlist };
});

export const DELETE = route({ params: SetlistParams }, async ({ db, actor, params }) => {
  await deleteSetlist(db, actor, params.bandId, params.setlistId);
  return { deleted: true };
});
