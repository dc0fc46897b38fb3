// What a device needs to trust offline until it can ask again: who is signed in, and their bands.
import type { BootstrapResponse } from "@/lib/offline/protocol";
import { listMyBands } from "@/lib/server/bands";
import { AppError } from "@/lib/server/errors";
import { route } from "@/lib/server/handler";

export const dynamic = "force-dynamic";

export const GET = route({}, async ({ db, actor }) => {
  if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
  const bands = await listMyBands(db, actor);
  const out: BootstrapResponse = {
    user: { id: actor.userId, email: actor.email, name: actor.name },
    bands: bands.map((b) => ({ id: b.id, name: b.name, role: b.role, instrument: b.instrument, expiresAt: b.expiresAt })),
  };
  return Response.json(out, { headers: { "cache-control": "no-store" } });
});
