// Delta sync for one band: GET pulls a page of the feed, POST pushes a device's queued edits.
import { z } from "zod";
import { ready } from "@/db";
import { PullQuerySchema, PushBodySchema } from "@/lib/offline/protocol";
import { route } from "@/lib/server/handler";
import { MB } from "@/lib/server/request-guard";

const PUSH_MAX_BYTES = 2 * MB;
import { pullChanges, pushMutations } from "@/lib/server/sync";

export const dynamic = "force-dynamic";

const Params = z.object({ bandId: z.string().min(1).max(64) });

const utf8 = new TextEncoder();

export const GET = route({ params: Params, query: PullQuerySchema }, async ({ actor, params, query }) => {
  const body = await pullChanges(await ready(), actor, params.bandId, query);
  // Bytes, not a string: a string body is measured (byteLength) and then encoded, two passes over a
  // page that can be a few hundred KB.
  return new Response(utf8.encode(body), { headers: { "content-type": "application/json; charset=utf-8", "cache-control": "no-store" } });
});

// A push is a device's outbox: up to 200 edits, almost all small. 2 MB bounds the work one push can
// ask for (with the 50,000-character limit per chart text) and is refused before it is read.
export const POST = route({ params: Params, body: PushBodySchema, maxBytes: PUSH_MAX_BYTES }, async ({ actor, params, body }) => {
  const out = await pushMutations(await ready(), actor, params.bandId, body.mutations);
  return Response.json(out, { headers: { "cache-control": "no-store" } });
});
