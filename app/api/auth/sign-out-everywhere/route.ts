import { route } from "@/lib/server/handler";
import { endAllSessions } from "@/lib/server/session-version";

// Ends every session of the signed-in person on every device (a lost phone, a shared tablet).
export const POST = route({}, async ({ db, actor }) => {
  await endAllSessions(db, actor.userId);
  return { ok: true, message: "Signed out on every device. Sign in again here to go on." };
});
