// Delta sync for one band: GET pulls a page of the feed, POST pushes a device's queued edits.
import { PullQuerySchema, PushBodySchema } from "@/lib/offline/protocol";
import { route } from "@/lib/server/handler";
import { MB } from "@/lib/server/request-guard";
import { announceApplied } from "@/lib/server/push-announce";
import { pushMutations } from "@/lib/server/sync";
import { pullBody } from "@/lib/server/sync-pull";
import { pullResponse } from "@/lib/server/sync-response";
import { BandParams as Params } from "@/lib/validation/params";

const PUSH_MAX_BYTES = 2 * MB;

export const dynamic = "force-dynamic";

export const GET = route({ params: Params, query: PullQuerySchema }, async ({ db, actor, params, query }) => {
  return pullResponse(await pullBody(db, actor, params.bandId, query));
});

// A push is a device's outbox: up to 200 edits, almost all small. 2 MB bounds the work one push can
// ask for (with the 50,000-character limit per chart text) and is refused before it is read.
export const POST = route({ params: Params, body: PushBodySchema, maxBytes: PUSH_MAX_BYTES }, async ({ db, actor, params, body }) => {
  const out = await pushMutations(db, actor, params.bandId, body.mutations);
  announceApplied(db, actor, params.bandId, body.mutations, out.results);
  return Response.json(out, { headers: { "cache-control": "no-store" } });
});
