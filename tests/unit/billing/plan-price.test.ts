// Item 23: the plan page shows the price before checkout, as the payment provider states it.
import type { Kysely } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Database } from "@/db/schema";
import { getPlanStatus } from "@/lib/server/billing";
import { priceInWords } from "@/components/plan/PlanFacts";
import { startPaymentFake, type PaymentFake } from "@/scripts/payment-fake";
import { cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";

let fake: PaymentFake;
let db: Kysely<Database>;
let cast: BandCast;

beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  process.env.PAYMENT_FAKE = "1";
  fake = await startPaymentFake({ port: 0, deliver: async () => undefined });
  process.env.PAYMENT_FAKE_PORT = String(fake.port);
});
afterAll(async () => {
  await fake.close();
  cleanupDbs();
});

describe("the band plan's price before checkout (item 23)", () => {
  it("comes from the payment provider's price, on the free plan's status", async () => {
    const status = await getPlanStatus(db, cast.leader, cast.bandId);
    expect(status.plan).toBe("free");
    // The local fake sells the band plan at 900 cents a month in euros (scripts/payment-fake.ts).
    expect(status.price).toEqual({ amount: 900, currency: "eur", interval: "month" });
    expect(priceInWords(status.price!)).toMatch(/9\.00.* a month$/);
  });

  it("is null, not an error, when the provider cannot be asked", async () => {
    process.env.PAYMENT_FAKE_PORT = "1";
    const status = await getPlanStatus(db, cast.leader, cast.bandId);
    process.env.PAYMENT_FAKE_PORT = String(fake.port);
    expect(status.price).toBeNull();
  });
});
