import "server-only";
// What the leader does with the plan: start a hosted checkout, confirm it on return, cancel, resume.
import type { Kysely } from "kysely";
import type Stripe from "stripe";
import type { Database } from "@/db/schema";
import { requireMember, type Actor, signedIn } from "./access";
import { applySubscription, effectivePlan, paymentClient, paymentConfig, saveRow, subscriptionRow } from "./billing-store";
import { isMissing } from "./billing-webhook";
import { AppError } from "./errors";
import { appUrl } from "./tokens";

export async function startCheckout(db: Kysely<Database>, actor: Actor | null, bandId: string): Promise<{ url: string }> {
  await requireMember(db, actor, bandId, "billing");
  const me = signedIn(actor);
  const row = await subscriptionRow(db, bandId);
  if (effectivePlan(row) === "band" && !row?.cancel_at_period_end) {
    throw new AppError("conflict", "This band is already on the band plan.");
  }
  const cfg = paymentConfig();
  const stripe = paymentClient(cfg);
  const band = await db.selectFrom("bands").select("name").where("id", "=", bandId).executeTakeFirstOrThrow();
  let customer = row?.customer_id ?? null;
  if (!customer) {
    const c = await stripe.customers.create({ email: me.email, name: band.name, metadata: { bandId } });
    customer = c.id;
    await saveRow(db, bandId, { customer_id: customer });
  }
  const session = await stripe.checkout.sessions.create({
    mode: "subscription",
    customer,
    client_reference_id: bandId,
    line_items: [{ price: cfg.priceId, quantity: 1 }],
    metadata: { bandId },
    subscription_data: { metadata: { bandId } },
    success_url: appUrl(`/bands/${bandId}/plan?checkout=done&session={CHECKOUT_SESSION_ID}`),
    cancel_url: appUrl(`/bands/${bandId}/plan?checkout=cancelled`),
  });
  if (!session.url) throw new AppError("conflict", "The payment provider did not return a checkout page. Try again in a moment.");
  return { url: session.url };
}

/** On return from checkout: read the session back, in case the webhook is slow or not set up. */
export async function confirmCheckout(db: Kysely<Database>, actor: Actor | null, bandId: string, sessionId: string): Promise<void> {
  await requireMember(db, actor, bandId, "billing");
  const stripe = paymentClient();
  let session: Stripe.Checkout.Session;
  try {
    session = await stripe.checkout.sessions.retrieve(sessionId);
  } catch (err) {
    if (isMissing(err)) throw new AppError("not_found", "That checkout was not found.");
    throw err;
  }
  const owner = session.metadata?.bandId ?? session.client_reference_id;
  if (owner !== bandId) throw new AppError("not_found", "That checkout was not found.");
  if (session.status !== "complete" || !session.subscription) return;
  const subId = typeof session.subscription === "string" ? session.subscription : session.subscription.id;
  await applySubscription(db, bandId, await stripe.subscriptions.retrieve(subId));
}

async function setCancel(db: Kysely<Database>, actor: Actor | null, bandId: string, cancel: boolean): Promise<void> {
  await requireMember(db, actor, bandId, "billing");
  const row = await subscriptionRow(db, bandId);
  if (!row?.subscription_id || effectivePlan(row) !== "band") {
    throw new AppError("conflict", "This band is on the free plan; there is no band plan to change.");
  }
  const sub: Stripe.Subscription = await paymentClient().subscriptions.update(row.subscription_id, { cancel_at_period_end: cancel });
  await applySubscription(db, bandId, sub);
}

/** Cancels at the end of the paid period: the band keeps the band plan until the renewal date. */
export function cancelPlan(db: Kysely<Database>, actor: Actor | null, bandId: string): Promise<void> {
  return setCancel(db, actor, bandId, true);
}

export function resumePlan(db: Kysely<Database>, actor: Actor | null, bandId: string): Promise<void> {
  return setCancel(db, actor, bandId, false);
}

export interface PlanPrice {
  /** In the currency's smallest unit (cents). */
  amount: number;
  currency: string;
  interval: string;
}

/** The band plan's price from the payment provider, so the leader sees it before checkout. */
export async function planPrice(): Promise<PlanPrice | null> {
  const cfg = paymentConfig();
  const price = await paymentClient(cfg).prices.retrieve(cfg.priceId);
  if (price.unit_amount === null) return null;
  return { amount: price.unit_amount, currency: price.currency, interval: price.recurring?.interval ?? "month" };
}
