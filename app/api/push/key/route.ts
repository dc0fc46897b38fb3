// The server's VAPID public key, for PushManager.subscribe's applicationServerKey.
import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { vapidKeys } from "@/lib/server/push-keys";

export const dynamic = "force-dynamic";

export const GET = route({}, async () => ({ publicKey: (await vapidKeys(await ready())).publicKey }));
