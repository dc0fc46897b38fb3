// This device's Web Push subscription: saved for the bands it holds, or removed.
import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { SubscribeSchema, UnsubscribeSchema, subscribeDevice, unsubscribeDevice } from "@/lib/server/push-subscriptions";

export const dynamic = "force-dynamic";

export const POST = route({ body: SubscribeSchema }, async ({ actor, body }) => subscribeDevice(await ready(), actor, body));

export const DELETE = route({ body: UnsubscribeSchema }, async ({ actor, body }) => {
  await unsubscribeDevice(await ready(), actor, body.endpoint);
  return { ok: true };
});
