import { listMyBands } from "@/lib/server/bands";
import { AppError } from "@/lib/server/errors";
import { route } from "@/lib/server/handler";
import { findUserById, toPublicUser } from "@/lib/server/users";

// Who am I and where do I play: what a device keeps to work offline.
export const GET = route({}, async ({ db, actor }) => {
  const user = actor ? await findUserById(db, actor.userId) : undefined;
  if (!user) throw new AppError("unauthenticated", "Please sign in first.");
  return { user: toPublicUser(user), bands: await listMyBands(db, actor) };
});
