import { route } from "@/lib/server/handler";
import { announce } from "@/lib/server/push-announce";
import { SETLIST_BODY_BYTES } from "@/lib/server/request-guard";
import { createSetlist, listSetlists } from "@/lib/server/setlists";
import { SetlistCreateSchema } from "@/lib/setlist";
import { BandParams } from "@/lib/validation/params";

export const GET = route({ params: BandParams }, async ({ db, actor, params }) => ({
  setlists: await listSetlists(db, actor, params.bandId),
}));

export const POST = route({ params: BandParams, body: SetlistCreateSchema, maxBytes: SETLIST_BODY_BYTES }, async ({ db, actor, params, body }) => {
  const setlist = await createSetlist(db, actor, params.bandId, body);
  announce(db, { bandId: params.bandId, authorId: actor?.userId ?? null, kind: "setlist", setlistId: setlist.id });
  return { setlist };
});
