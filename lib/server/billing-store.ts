import "server-only";
// Subscription rows and the payment SDK client, shared by the plan, checkout and webhook use cases.
import type { Kysely } from "kysely";
import Stripe from "stripe";
import type { Database, SubscriptionRow } from "@/db/schema";
import { AppError } from "./errors";
import { nowIso } from "./tokens";

export type PlanId = "free" | "band";

/** Signed events older than this are refused (replays). */
export const WEBHOOK_TOLERANCE_SECONDS = 300;
const FAKE_WEBHOOK_SECRET = "whsec_pedalpoint_local_fake"; // the same default as scripts/payment-fake.ts
export const LIVE_STATUSES = new Set(["active", "trialing", "past_due"]);

interface PaymentConfig {
  secretKey: string;
  webhookSecret: string;
  priceId: string;
  host?: string;
  port?: number;
  protocol?: "http" | "https";
}

/** Read at call time so the demo, the tests and production each point the SDK where they need. */
export function paymentConfig(): PaymentConfig {
  const fake = process.env.PAYMENT_FAKE === "1";
  const protocol = process.env.PAYMENT_API_PROTOCOL ?? (fake ? "http" : undefined);
  const port = process.env.PAYMENT_API_PORT ?? (fake ? process.env.PAYMENT_FAKE_PORT ?? "2527" : undefined);
  return {
    secretKey: process.env.STRIPE_SECRET_KEY ?? (fake ? "sk_test_pedalpoint_local_fake" : ""),
    webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? (fake ? FAKE_WEBHOOK_SECRET : ""),
    priceId: process.env.STRIPE_PRICE_ID ?? "price_band_monthly",
    host: process.env.PAYMENT_API_HOST ?? (fake ? "127.0.0.1" : undefined),
    port: port ? Number(port) : undefined,
    protocol: protocol === "http" || protocol === "https" ? protocol : undefined,
  };
}

export function paymentClient(cfg = paymentConfig()): Stripe {
  if (!cfg.secretKey) throw new AppError("conflict", "Payments are not set up on this server, so the plan cannot be changed here.");
  return new Stripe(cfg.secretKey, { host: cfg.host, port: cfg.port, protocol: cfg.protocol, maxNetworkRetries: 1, timeout: 15_000, telemetry: false });
}

export async function subscriptionRow(db: Kysely<Database>, bandId: string): Promise<SubscriptionRow | undefined> {
  return db.selectFrom("subscriptions").selectAll().where("band_id", "=", bandId).executeTakeFirst();
}

/** The plan in force now: a band plan counts while its subscription is live and its period has not run out after a cancel. */
export function effectivePlan(row: SubscriptionRow | undefined, now = new Date()): PlanId {
  if (!row || row.plan !== "band" || !LIVE_STATUSES.has(row.status)) return "free";
  if (row.cancel_at_period_end && row.current_period_end && row.current_period_end <= now.toISOString()) return "free";
  return "band";
}

export async function saveRow(db: Kysely<Database>, bandId: string, fields: Partial<Omit<SubscriptionRow, "band_id">>): Promise<void> {
  const existing = await subscriptionRow(db, bandId);
  const values = { updated_at: nowIso(), ...fields };
  if (existing) await db.updateTable("subscriptions").set(values).where("band_id", "=", bandId).execute();
  else await db.insertInto("subscriptions").values({ band_id: bandId, plan: "free", status: "active", customer_id: null, subscription_id: null, current_period_end: null, cancel_at_period_end: 0, ...values }).execute();
}

function periodEnd(sub: Stripe.Subscription): string | null {
  const fromItem = sub.items?.data?.[0]?.current_period_end;
  const legacy = (sub as unknown as { current_period_end?: number }).current_period_end;
  const secs = fromItem ?? legacy;
  return typeof secs === "number" ? new Date(secs * 1000).toISOString() : null;
}

export async function applySubscription(db: Kysely<Database>, bandId: string, sub: Stripe.Subscription, deleted = false): Promise<void> {
  const live = !deleted && LIVE_STATUSES.has(sub.status);
  await saveRow(db, bandId, {
    plan: live ? "band" : "free",
    status: deleted ? "canceled" : sub.status,
    customer_id: typeof sub.customer === "string" ? sub.customer : sub.customer?.id ?? null,
    subscription_id: sub.id,
    current_period_end: periodEnd(sub),
    cancel_at_period_end: sub.cancel_at_period_end ? 1 : 0,
  });
}

export async function bandFor(db: Kysely<Database>, sub: Stripe.Subscription): Promise<string | null> {
  const fromMeta = sub.metadata?.bandId;
  if (fromMeta) return fromMeta;
  const customer = typeof sub.customer === "string" ? sub.customer : sub.customer?.id;
  const row = await db
    .selectFrom("subscriptions")
    .select("band_id")
    .where((eb) => eb.or([eb("subscription_id", "=", sub.id), ...(customer ? [eb("customer_id", "=", customer)] : [])]))
    .executeTakeFirst();
  return row?.band_id ?? null;
}

