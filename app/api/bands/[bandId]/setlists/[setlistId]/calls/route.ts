// Calling the tune: GET the gig's last call and who may call; POST calls a tune of the set list.
import { CallSchema, callTune, gigCallState } from "@/lib/server/calls";
import { route } from "@/lib/server/handler";
import { SetlistParams } from "@/lib/validation/params";

export const dynamic = "force-dynamic";

export const GET = route({ params: SetlistParams }, async ({ db, actor, params }) => gigCallState(db, actor, params.bandId, params.setlistId));

export const POST = route({ params: SetlistParams, body: CallSchema }, async ({ db, actor, params, body }) => ({
  call: await callTune(db, actor, params.bandId, params.setlistId, body.entryId),
}));
