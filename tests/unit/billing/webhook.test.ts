import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { handleWebhook } from "@/lib/server/billing";
import { FAKE_WEBHOOK_SECRET, signWebhook } from "@/scripts/payment-fake";
import { appError, cleanupDbs, freshDb, makeBand } from "../server/helpers";

beforeAll(() => {
  process.env.PAYMENT_FAKE = "1";
  delete process.env.STRIPE_WEBHOOK_SECRET;
});
afterAll(cleanupDbs);

function subscriptionEvent(bandId: string, status: string, type = "customer.subscription.updated") {
  const end = Math.floor(Date.now() / 1000) + 30 * 86_400;
  return JSON.stringify({
    id: `evt_${randomUUID()}`, object: "event", type, created: Math.floor(Date.now() / 1000), livemode: false,
    data: { object: { id: "sub_test_1", object: "subscription", customer: "cus_test_1", status, cancel_at_period_end: false, metadata: { bandId },
      items: { object: "list", data: [{ id: "si_1", object: "subscription_item", current_period_end: end }] } } },
  });
}

async function planOf(db: Awaited<ReturnType<typeof freshDb>>, bandId: string) {
  return db.selectFrom("subscriptions").selectAll().where("band_id", "=", bandId).executeTakeFirst();
}

describe("webhook signature check", () => {
  it("accepts a correctly signed event and updates the band's plan", async () => {
    const db = await freshDb();
    const { bandId } = await makeBand(db);
    const payload = subscriptionEvent(bandId, "active");
    const result = await handleWebhook(db, payload, signWebhook(payload, FAKE_WEBHOOK_SECRET));
    expect(result).toMatchObject({ received: true, bandId });
    expect(await planOf(db, bandId)).toMatchObject({ plan: "band", status: "active", subscription_id: "sub_test_1", customer_id: "cus_test_1" });
  });

  it("refuses a tampered body and changes nothing", async () => {
    const db = await freshDb();
    const { bandId } = await makeBand(db);
    const signed = subscriptionEvent(bandId, "canceled");
    const tampered = signed.replace('"canceled"', '"active"');
    const err = await appError(() => handleWebhook(db, tampered, signWebhook(signed, FAKE_WEBHOOK_SECRET)));
    expect(err.status).toBe(400);
    expect(err.message).toMatch(/signature does not match/);
    expect(await planOf(db, bandId)).toBeUndefined();
  });

  it("refuses a stale event (a replay older than five minutes)", async () => {
    const db = await freshDb();
    const { bandId } = await makeBand(db);
    const payload = subscriptionEvent(bandId, "active");
    const tenMinutesAgo = Math.floor(Date.now() / 1000) - 600;
    const err = await appError(() => handleWebhook(db, payload, signWebhook(payload, FAKE_WEBHOOK_SECRET, tenMinutesAgo)));
    expect(err.status).toBe(400);
    expect(err.message).toMatch(/too old/);
    expect(await planOf(db, bandId)).toBeUndefined();
  });

  it("refuses a signature made with another secret, and a missing header", async () => {
    const db = await freshDb();
    const { bandId } = await makeBand(db);
    const payload = subscriptionEvent(bandId, "active");
    expect((await appError(() => handleWebhook(db, payload, signWebhook(payload, "whsec_someone_else")))).status).toBe(400);
    expect((await appError(() => handleWebhook(db, payload, null))).message).toMatch(/no signature/);
    expect((await appError(() => handleWebhook(db, payload, "t=1,v1=deadbeef"))).status).toBe(400);
    expect(await planOf(db, bandId)).toBeUndefined();
  });

  it("a deleted subscription puts the band back on the free plan", async () => {
    const db = await freshDb();
    const { bandId } = await makeBand(db);
    const up = subscriptionEvent(bandId, "active");
    await handleWebhook(db, up, signWebhook(up, FAKE_WEBHOOK_SECRET));
    const down = subscriptionEvent(bandId, "canceled", "customer.subscription.deleted");
    await handleWebhook(db, down, signWebhook(down, FAKE_WEBHOOK_SECRET));
    expect(await planOf(db, bandId)).toMatchObject({ plan: "free", status: "canceled" });
  });
});
