import type { Kysely } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Database } from "@/db/schema";
import { assertPlanAllows, cancelPlan, getPlanStatus, handleWebhook, resumePlan, startCheckout } from "@/lib/server/billing";
import { FAKE_WEBHOOK_SECRET, signWebhook, startPaymentFake, type PaymentFake } from "@/scripts/payment-fake";
import { appError, cleanupDbs, freshDb, makeBand, outcome, type BandCast } from "../server/helpers";

let fake: PaymentFake;
let db: Kysely<Database>;
let cast: BandCast;

beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  process.env.PAYMENT_FAKE = "1";
  process.env.NEXTAUTH_URL = "http://localhost:3999";
  // Events go straight to the handler, signed by the fake exactly as over HTTP.
  fake = await startPaymentFake({ port: 0, deliver: async (payload, signature) => void (await handleWebhook(db, payload, signature)) });
  process.env.PAYMENT_FAKE_PORT = String(fake.port);
});
afterAll(async () => {
  await fake.close();
  cleanupDbs();
});

describe("buying and cancelling the band plan through the SDK and the fake", () => {
  it("only the leader may start a checkout; outsiders do not see the band", async () => {
    expect(await outcome(() => startCheckout(db, cast.arranger, cast.bandId))).toBe(403);
    expect(await outcome(() => startCheckout(db, cast.player, cast.bandId))).toBe(403);
    expect(await outcome(() => startCheckout(db, cast.outsider, cast.bandId))).toBe(404);
    expect(await outcome(() => startCheckout(db, null, cast.bandId))).toBe(401);
  });

  it("checkout → pay on the hosted page → signed webhook → band plan with a renewal date", async () => {
    const { url } = await startCheckout(db, cast.leader, cast.bandId);
    expect(url).toMatch(new RegExp(`^http://127\\.0\\.0\\.1:${fake.port}/checkout/cs_test_`));
    const page = await fetch(url);
    expect(await page.text()).toMatch(/nothing is charged/);
    const paid = await fetch(`${url}/pay`, { method: "POST", redirect: "manual" });
    expect(paid.status).toBe(303);
    expect(paid.headers.get("location")).toMatch(new RegExp(`^http://localhost:3999/bands/${cast.bandId}/plan\\?checkout=done&session=cs_test_`));
    const status = await getPlanStatus(db, cast.leader, cast.bandId);
    expect(status).toMatchObject({ plan: "band", status: "active", cancelAtPeriodEnd: false, limits: { charts: null, members: null } });
    const days = (new Date(status.currentPeriodEnd!).getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(29);
    expect(days).toBeLessThan(31);
    const [customer] = [...fake.state.customers.values()];
    expect(customer).toMatchObject({ email: cast.leader.email, metadata: { bandId: cast.bandId } });
  });

  it("refuses a second checkout while the band plan runs", async () => {
    expect((await appError(() => startCheckout(db, cast.leader, cast.bandId))).status).toBe(409);
  });

  it("cancel keeps the band plan until the period ends; resume undoes it", async () => {
    expect(await outcome(() => cancelPlan(db, cast.arranger, cast.bandId))).toBe(403);
    await cancelPlan(db, cast.leader, cast.bandId);
    let status = await getPlanStatus(db, cast.leader, cast.bandId);
    expect(status).toMatchObject({ plan: "band", cancelAtPeriodEnd: true });
    const [sub] = [...fake.state.subscriptions.values()];
    expect(sub).toMatchObject({ cancel_at_period_end: true });
    await resumePlan(db, cast.leader, cast.bandId);
    status = await getPlanStatus(db, cast.leader, cast.bandId);
    expect(status.cancelAtPeriodEnd).toBe(false);
    await cancelPlan(db, cast.leader, cast.bandId);
  });

  it("when the provider ends the subscription the band is back on the free plan and its limits", async () => {
    const [sub] = [...fake.state.subscriptions.values()];
    await fake.endSubscription(String(sub!.id));
    const status = await getPlanStatus(db, cast.leader, cast.bandId);
    expect(status).toMatchObject({ plan: "free", status: "canceled", limits: { charts: 25, members: 8 } });
    await expect(assertPlanAllows(db, cast.bandId, "chart")).resolves.toBeUndefined();
    expect((await appError(() => cancelPlan(db, cast.leader, cast.bandId))).status).toBe(409);
  });

  it("a late, out-of-order 'active' event does not bring the ended plan back", async () => {
    const [sub] = [...fake.state.subscriptions.values()];
    const stale = JSON.stringify({
      id: "evt_late", object: "event", type: "customer.subscription.updated", created: Math.floor(Date.now() / 1000) - 60, livemode: false,
      data: { object: { ...sub, status: "active", cancel_at_period_end: false } },
    });
    await handleWebhook(db, stale, signWebhook(stale, FAKE_WEBHOOK_SECRET));
    expect((await getPlanStatus(db, cast.leader, cast.bandId)).plan).toBe("free");
  });
});
