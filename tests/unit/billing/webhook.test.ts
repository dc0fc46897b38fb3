import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { handleWebhook } from "@/lib/server/billing";
import { FAKE_WEBHOOK_SECRET, signWebhook, startPaymentFake, type PaymentFake } from "@/scripts/payment-fake";
import { appError, cleanupDbs, freshDb, makeBand } from "../server/helpers";

// The webhook acts on the provider's own records, so the subscriptions live in the local fake of
// the provider (as they would at the provider) and the events only point at them.
let fake: PaymentFake;
beforeAll(async () => {
  process.env.PAYMENT_FAKE = "1";
  delete process.env.STRIPE_WEBHOOK_SECRET;
  fake = await startPaymentFake({ port: 0, deliver: async () => undefined });
  process.env.PAYMENT_FAKE_PORT = String(fake.port);
});
afterAll(async () => {
  await fake.close();
  cleanupDbs();
});

function subscriptionObject(bandId: string, status: string, id = "sub_test_1") {
  const end = Math.floor(Date.now() / 1000) + 30 * 86_400;
  return { id, object: "subscription", customer: "cus_test_1", status, cancel_at_period_end: false, metadata: { bandId },
    items: { object: "list", data: [{ id: "si_1", object: "subscription_item", current_period_end: end }] } };
}

/** Records the subscription at the provider (the fake), then makes the event that reports it. */
function subscriptionEvent(bandId: string, status: string, type = "customer.subscription.updated") {
  const object = subscriptionObject(bandId, status);
  fake.state.subscriptions.set(object.id, structuredClone(object));
  return JSON.stringify({ id: `evt_${randomUUID()}`, object: "event", type, created: Math.floor(Date.now() / 1000), livemode: false, data: { object } });
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

  // Issue 10 item 11: the attack sends a well-signed event about a subscription the provider never had.
  it("a signed event for a subscription the provider does not have changes nothing, whatever band it names", async () => {
    const db = await freshDb();
    const { bandId } = await makeBand(db);
    const object = subscriptionObject(bandId, "active", "sub_invented_by_a_stranger");
    for (const type of ["customer.subscription.created", "customer.subscription.updated"]) {
      const payload = JSON.stringify({ id: `evt_${randomUUID()}`, object: "event", type, created: Math.floor(Date.now() / 1000), livemode: false, data: { object } });
      expect(await handleWebhook(db, payload, signWebhook(payload, FAKE_WEBHOOK_SECRET))).toMatchObject({ received: true, bandId: null });
    }
    const checkout = JSON.stringify({ id: `evt_${randomUUID()}`, object: "event", type: "checkout.session.completed", created: Math.floor(Date.now() / 1000), livemode: false,
      data: { object: { id: "cs_test_invented", object: "checkout.session", status: "complete", metadata: { bandId }, subscription: "sub_invented_by_a_stranger" } } });
    expect(await handleWebhook(db, checkout, signWebhook(checkout, FAKE_WEBHOOK_SECRET))).toMatchObject({ received: true, bandId: null });
    expect(await planOf(db, bandId)).toBeUndefined();
  });

  it("the event's copy is not trusted over the provider's: an 'active' event for a canceled subscription stays canceled", async () => {
    const db = await freshDb();
    const { bandId } = await makeBand(db);
    const payload = subscriptionEvent(bandId, "active");
    (fake.state.subscriptions.get("sub_test_1") as { status: string }).status = "canceled";
    await handleWebhook(db, payload, signWebhook(payload, FAKE_WEBHOOK_SECRET));
    expect((await planOf(db, bandId))?.plan).not.toBe("band");
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
