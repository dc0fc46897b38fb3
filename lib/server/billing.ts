import "server-only";
// The band's plan. Free: a limited book and band; band plan: no limits, bought by the leader through
// the payment provider's hosted checkout (its official SDK; a local fake in the demo and tests).
// The webhook is the source of truth for the subscription; every event is verified by signature.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { requireMember, type Actor } from "./access";
import { effectivePlan, subscriptionRow, type PlanId } from "./billing-store";
import { AppError } from "./errors";
import { planPrice, type PlanPrice } from "./billing-actions";

export type { PlanId } from "./billing-store";
export type LimitedThing = "chart" | "member";

export const PLANS = {
  free: { id: "free", label: "Free plan", charts: 25, members: 8 },
  band: { id: "band", label: "Band plan", charts: Number.POSITIVE_INFINITY, members: Number.POSITIVE_INFINITY },
} as const;

export async function planUsage(db: Kysely<Database>, bandId: string, now = new Date()): Promise<{ charts: number; members: number }> {
  const charts = await db.selectFrom("charts").select((eb) => eb.fn.countAll<number>().as("n")).where("band_id", "=", bandId).where("deleted_at", "is", null).executeTakeFirstOrThrow();
  const members = await db
    .selectFrom("memberships")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("band_id", "=", bandId)
    .where((eb) => eb.or([eb("expires_at", "is", null), eb("expires_at", ">", now.toISOString())]))
    .executeTakeFirstOrThrow();
  const invites = await db
    .selectFrom("invites")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("band_id", "=", bandId)
    .where("accepted_at", "is", null)
    .where("expires_at", ">", now.toISOString())
    .executeTakeFirstOrThrow();
  return { charts: Number(charts.n), members: Number(members.n) + Number(invites.n) };
}

/** Refuses one more chart or member beyond the free plan, with a message naming the plan (402). */
export async function assertPlanAllows(db: Kysely<Database>, bandId: string, what: LimitedThing, now = new Date()): Promise<void> {
  const plan = PLANS[effectivePlan(await subscriptionRow(db, bandId), now)];
  const usage = await planUsage(db, bandId, now);
  if (what === "chart" && usage.charts >= plan.charts) {
    throw new AppError(
      "payment_required",
      `The ${plan.label.toLowerCase()} holds up to ${plan.charts} charts and this band's book has ${usage.charts}. The leader can move the band to the band plan for an unlimited book.`,
      { plan: plan.id, limit: plan.charts, used: usage.charts },
    );
  }
  if (what === "member" && usage.members >= plan.members) {
    throw new AppError(
      "payment_required",
      `The ${plan.label.toLowerCase()} allows up to ${plan.members} members (open invites count) and this band has ${usage.members}. The leader can move the band to the band plan for unlimited members.`,
      { plan: plan.id, limit: plan.members, used: usage.members },
    );
  }
}

export interface PlanStatus {
  plan: PlanId;
  label: string;
  status: string;
  /** Renewal date, or the day the band plan ends after a cancel. */
  currentPeriodEnd: string | null;
  cancelAtPeriodEnd: boolean;
  limits: { charts: number | null; members: number | null };
  usage: { charts: number; members: number };
  /** The band plan's price as the payment provider states it; null when it cannot be asked. */
  price: PlanPrice | null;
}

async function bandPlanPrice(): Promise<PlanPrice | null> {
  try {
    return await planPrice();
  } catch (err) {
    console.warn("the band plan's price could not be read", err);
    return null;
  }
}

export async function getPlanStatus(db: Kysely<Database>, actor: Actor | null, bandId: string, now = new Date()): Promise<PlanStatus> {
  await requireMember(db, actor, bandId, "billing");
  const row = await subscriptionRow(db, bandId);
  const plan = effectivePlan(row, now);
  const p = PLANS[plan];
  return {
    plan,
    label: p.label,
    status: plan === "band" ? (row?.status ?? "active") : row?.status === "canceled" ? "canceled" : "active",
    currentPeriodEnd: plan === "band" ? (row?.current_period_end ?? null) : null,
    cancelAtPeriodEnd: plan === "band" && !!row?.cancel_at_period_end,
    limits: { charts: Number.isFinite(p.charts) ? p.charts : null, members: Number.isFinite(p.members) ? p.members : null },
    usage: await planUsage(db, bandId, now),
    price: await bandPlanPrice(),
  };
}

export { startCheckout, confirmCheckout, cancelPlan, resumePlan } from "./billing-actions";
export type { PlanPrice } from "./billing-actions";
export { handleWebhook } from "./billing-webhook";
export { effectivePlan, paymentConfig, WEBHOOK_TOLERANCE_SECONDS } from "./billing-store";
