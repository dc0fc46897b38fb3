// This device's Web Push subscription: saved for the bands it holds, or removed.
import { route } from "@/lib/server/handler";
import { SubscribeSchema, UnsubscribeSchema, subscribeDevice, unsubscribeDevice } from "@/lib/server/push-subscriptions";

export const dynamic = "force-dynamic";

export const POST = route({ body: SubscribeSchema }, async ({ db, actor, body }) => subscribeDevice(db, actor, body));

export const DELETE = route({ body: UnsubscribeSchema }, async ({ db, actor, body }) => {
  await unsubscribeDevice(db, actor, body.endpoint);
  return { ok: true };
});
