import { randomUUID } from "node:crypto";
import type { Kysely } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import type { Database } from "@/db/schema";
import { assertPlanAllows, effectivePlan, PLANS } from "@/lib/server/billing";
import { saveRow } from "@/lib/server/billing-store";
import { createChart } from "@/lib/server/charts";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, makeUser, addMember } from "../server/helpers";

afterAll(cleanupDbs);

async function addCharts(db: Kysely<Database>, bandId: string, by: string, n: number): Promise<void> {
  const now = new Date().toISOString();
  for (let i = 0; i < n; i++) {
    await db.insertInto("charts").values({
      id: randomUUID(), band_id: bandId, title: `Tune ${i}`, composer: "", concert_key: "C", meter: "4/4", tempo: null, feel: "",
      body_json: "{}", source_text: "", revision: 1, updated_by: by, updated_at: now, deleted_at: null,
    }).execute();
  }
}

const bandPlan = (db: Kysely<Database>, bandId: string, extra: Record<string, unknown> = {}) =>
  saveRow(db, bandId, { plan: "band", status: "active", subscription_id: "sub_x", current_period_end: new Date(Date.now() + 86_400_000).toISOString(), ...extra });

describe("plan limits", () => {
  it("the free plan holds 25 charts and 8 members", () => {
    expect(PLANS.free).toMatchObject({ charts: 25, members: 8 });
  });

  it("refuses the 26th chart with a 402 naming the free plan", async () => {
    const db = await freshDb();
    const { bandId, leader } = await makeBand(db);
    await addCharts(db, bandId, leader.userId, 24);
    await expect(assertPlanAllows(db, bandId, "chart")).resolves.toBeUndefined();
    await addCharts(db, bandId, leader.userId, 1);
    const err = await appError(() => assertPlanAllows(db, bandId, "chart"));
    expect(err.status).toBe(402);
    expect(err.message).toMatch(/free plan holds up to 25 charts/);
    expect(err.message).toMatch(/band plan/);
  });

  it("deleted charts do not count", async () => {
    const db = await freshDb();
    const { bandId, leader } = await makeBand(db);
    await addCharts(db, bandId, leader.userId, 25);
    await db.updateTable("charts").set({ deleted_at: new Date().toISOString() }).where("title", "=", "Tune 3").execute();
    await expect(assertPlanAllows(db, bandId, "chart")).resolves.toBeUndefined();
  });

  it("the band plan lifts the chart limit", async () => {
    const db = await freshDb();
    const { bandId, leader } = await makeBand(db);
    await addCharts(db, bandId, leader.userId, 40);
    await bandPlan(db, bandId);
    await expect(assertPlanAllows(db, bandId, "chart")).resolves.toBeUndefined();
  });

  it("counts members and open invites against 8", async () => {
    const db = await freshDb();
    const { bandId, leader } = await makeBand(db); // 4 live members (a fifth, a sub, has expired)
    for (const name of ["Five", "Six", "Seven"]) await addMember(db, bandId, await makeUser(db, name), "player");
    await expect(assertPlanAllows(db, bandId, "member")).resolves.toBeUndefined();
    await db.insertInto("invites").values({
      id: randomUUID(), band_id: bandId, token_hash: randomUUID(), email: "eight@band.test", role: "player", instrument: "concert",
      invited_by: leader.userId, expires_at: new Date(Date.now() + 86_400_000).toISOString(), access_expires_at: null, accepted_at: null, created_at: new Date().toISOString(),
    }).execute();
    const err = await appError(() => assertPlanAllows(db, bandId, "member"));
    expect(err.status).toBe(402);
    expect(err.message).toMatch(/free plan allows up to 8 members/);
    await bandPlan(db, bandId);
    await expect(assertPlanAllows(db, bandId, "member")).resolves.toBeUndefined();
  });

  it("a cancelled band plan lasts until its period ends, then the limits return", () => {
    const row = { band_id: "b", plan: "band" as const, status: "active", customer_id: "c", subscription_id: "s", current_period_end: "2030-01-01T00:00:00.000Z", cancel_at_period_end: 1, updated_at: "" };
    expect(effectivePlan(row, new Date("2029-12-31T00:00:00Z"))).toBe("band");
    expect(effectivePlan(row, new Date("2030-01-02T00:00:00Z"))).toBe("free");
    expect(effectivePlan({ ...row, status: "canceled" }, new Date("2029-01-01T00:00:00Z"))).toBe("free");
    expect(effectivePlan({ ...row, status: "past_due", cancel_at_period_end: 0 })).toBe("band");
  });

  it("createChart refuses the 26th chart on the free plan", async () => {
    const db = await freshDb();
    const { bandId, leader } = await makeBand(db);
    await addCharts(db, bandId, leader.userId, 25);
    const err = await appError(() => createChart(db, leader, bandId, chartInput()));
    expect(err.status).toBe(402);
    expect(err.message).toMatch(/free plan/);
    await bandPlan(db, bandId);
    await expect(createChart(db, leader, bandId, chartInput())).resolves.toMatchObject({ title: "Test Tune" });
  });
});
