// The server's VAPID public key, for PushManager.subscribe's applicationServerKey.
import { route } from "@/lib/server/handler";
import { vapidKeys } from "@/lib/server/push-keys";

export const dynamic = "force-dynamic";

export const GET = route({}, async ({ db }) => ({ publicKey: (await vapidKeys(db)).publicKey }));
