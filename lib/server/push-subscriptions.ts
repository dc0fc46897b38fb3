import "server-only";
// Each device's push subscription, one row per band it holds. A device subscribes after the player
// said yes to notices; rows go when the push service says the subscription is gone (404/410), when
// the device unsubscribes, and when the member leaves the band.
import { randomUUID } from "node:crypto";
import type { Kysely } from "kysely";
import { z } from "zod";
import type { Database } from "@/db/schema";
import { findMembership, type Actor } from "./access";
import { AppError } from "./errors";

const b64u = z.string().regex(/^[A-Za-z0-9_-]+=*$/, "must be base64url");

export const SubscribeSchema = z
  .object({
    deviceId: z.string().min(8).max(64),
    bandIds: z.array(z.string().min(1).max(64)).min(1).max(50),
    subscription: z.object({
      endpoint: z.string().url().max(1000),
      keys: z.object({ p256dh: b64u.min(80).max(100), auth: b64u.min(16).max(32) }),
    }),
  })
  .strict();
export type SubscribeInput = z.infer<typeof SubscribeSchema>;

export const UnsubscribeSchema = z.object({ endpoint: z.string().url().max(1000) }).strict();

/**
 * Push services are https. The local fake (PUSH_FAKE_ORIGIN, set when it starts) is the one plain-http
 * endpoint allowed, so a subscription cannot make the server call an arbitrary address on its network.
 */
export function endpointAllowed(endpoint: string, fakeOrigin = process.env.PUSH_FAKE_ORIGIN): boolean {
  let url: URL;
  try {
    url = new URL(endpoint);
  } catch {
    return false;
  }
  if (fakeOrigin && url.origin === fakeOrigin) return true;
  return url.protocol === "https:" && !/^(localhost|127\.|10\.|192\.168\.|\[)/.test(url.hostname);
}

/** Saves the device's subscription for each band it names that the caller belongs to. */
export async function subscribeDevice(db: Kysely<Database>, actor: Actor | null, input: SubscribeInput, now = new Date()): Promise<{ bands: string[] }> {
  if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
  const { endpoint, keys } = input.subscription;
  if (!endpointAllowed(endpoint)) throw new AppError("unprocessable", "subscription.endpoint: not a push service address", { fields: [{ field: "subscription.endpoint", message: "not a push service address" }] });
  const bands: string[] = [];
  for (const bandId of new Set(input.bandIds)) {
    if (!(await findMembership(db, actor.userId, bandId, now))) continue;
    // Another account signed in on this browser takes the subscription over.
    await db.deleteFrom("push_subscriptions").where("band_id", "=", bandId).where("endpoint", "=", endpoint).execute();
    await db
      .insertInto("push_subscriptions")
      .values({ id: randomUUID(), band_id: bandId, user_id: actor.userId, device_id: input.deviceId, endpoint, p256dh: keys.p256dh, auth: keys.auth, created_at: now.toISOString(), last_sent_at: null })
      .execute();
    bands.push(bandId);
  }
  if (bands.length === 0) throw new AppError("not_found", "None of those bands was found.");
  return { bands };
}

export async function unsubscribeDevice(db: Kysely<Database>, actor: Actor | null, endpoint: string): Promise<void> {
  if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
  await db.deleteFrom("push_subscriptions").where("endpoint", "=", endpoint).where("user_id", "=", actor.userId).execute();
}

/** A member left or was removed: their devices stop hearing about this band. */
export async function dropMemberSubscriptions(db: Kysely<Database>, bandId: string, userId: string): Promise<void> {
  await db.deleteFrom("push_subscriptions").where("band_id", "=", bandId).where("user_id", "=", userId).execute();
}

/** The push service said this subscription no longer exists: forget it for every band. */
export async function dropEndpoint(db: Kysely<Database>, endpoint: string): Promise<void> {
  await db.deleteFrom("push_subscriptions").where("endpoint", "=", endpoint).execute();
}

export async function hasSubscription(db: Kysely<Database>, bandId: string, userId: string): Promise<boolean> {
  const row = await db.selectFrom("push_subscriptions").select("id").where("band_id", "=", bandId).where("user_id", "=", userId).executeTakeFirst();
  return Boolean(row);
}
