import "server-only";
// Events from the payment provider. Nothing is trusted before the signature is checked with the
// SDK's verifier (HMAC of timestamp and body; events older than 5 minutes are refused as replays).
// Even a signed event is only a hint: what the band gets comes from the provider's own records
// (the checkout session and the subscription looked up through the SDK), never from the event's
// copy, so an event about a subscription the provider does not have changes nothing.
import type { Kysely } from "kysely";
import type Stripe from "stripe";
import type { Database } from "@/db/schema";
import { sendMail } from "@/lib/mail";
import { receiptMail } from "./billing-mail";
import { applySubscription, bandFor, effectivePlan, paymentClient, paymentConfig, subscriptionRow, WEBHOOK_TOLERANCE_SECONDS } from "./billing-store";
import { AppError } from "./errors";
import { appUrl } from "./tokens";

export interface WebhookResult {
  received: true;
  type: string;
  bandId: string | null;
}

export async function handleWebhook(db: Kysely<Database>, payload: string, signature: string | null, now = new Date()): Promise<WebhookResult> {
  const cfg = paymentConfig();
  if (!cfg.webhookSecret) throw new AppError("conflict", "Payments are not set up on this server.");
  if (!signature) throw new AppError("bad_request", "This webhook call has no signature header.");
  const stripe = paymentClient(cfg);
  let event: Stripe.Event;
  try {
    event = stripe.webhooks.constructEvent(payload, signature, cfg.webhookSecret, WEBHOOK_TOLERANCE_SECONDS, undefined, now.getTime());
  } catch (err) {
    const stale = err instanceof Error && /tolerance/i.test(err.message);
    throw new AppError("bad_request", stale ? "This webhook event is too old to accept." : "The webhook signature does not match; the event was ignored.");
  }
  switch (event.type) {
    case "checkout.session.completed": {
      const session = await fromProvider(() => stripe.checkout.sessions.retrieve(event.data.object.id));
      if (!session) return { received: true, type: event.type, bandId: null };
      const bandId = session.metadata?.bandId ?? session.client_reference_id ?? null;
      if (!bandId || !session.subscription || session.status !== "complete") return { received: true, type: event.type, bandId: null };
      const subId = typeof session.subscription === "string" ? session.subscription : session.subscription.id;
      const sub = await fromProvider(() => stripe.subscriptions.retrieve(subId));
      if (!sub) return { received: true, type: event.type, bandId: null };
      await applySubscription(db, bandId, sub);
      await sendReceipt(db, stripe, bandId, session, sub);
      return { received: true, type: event.type, bandId };
    }
    case "customer.subscription.created":
    case "customer.subscription.updated":
    case "customer.subscription.deleted": {
      // Events can arrive late and out of order, and may name anything: act on the subscription as
      // the provider has it now, and on the band its own metadata names.
      const sub = await fromProvider(() => stripe.subscriptions.retrieve(event.data.object.id));
      if (!sub) return { received: true, type: event.type, bandId: null };
      const bandId = await bandFor(db, sub);
      if (!bandId || !(await bandExists(db, bandId))) return { received: true, type: event.type, bandId: null };
      const row = await subscriptionRow(db, bandId);
      // An event about an older subscription must not touch the band's current one.
      if (row?.subscription_id && row.subscription_id !== sub.id && effectivePlan(row) === "band") return { received: true, type: event.type, bandId };
      await applySubscription(db, bandId, sub, sub.status === "canceled" || event.type === "customer.subscription.deleted");
      return { received: true, type: event.type, bandId };
    }
    default:
      return { received: true, type: event.type, bandId: null };
  }
}

/** A record from the provider; null when it has no such record. Unreachable: 503, so it retries. */
async function fromProvider<T>(look: () => Promise<T>): Promise<T | null> {
  try {
    return await look();
  } catch (err) {
    if (isMissing(err)) return null;
    console.error("payment provider look-up failed", err);
    throw new AppError("unavailable", "The payment provider could not be reached to check this event; send it again later.");
  }
}

export function isMissing(err: unknown): boolean {
  const e = err as { statusCode?: unknown; code?: unknown } | null;
  return !!e && (e.statusCode === 404 || e.code === "resource_missing");
}

async function bandExists(db: Kysely<Database>, bandId: string): Promise<boolean> {
  return Boolean(await db.selectFrom("bands").select("id").where("id", "=", bandId).executeTakeFirst());
}

async function sendReceipt(db: Kysely<Database>, stripe: Stripe, bandId: string, session: Stripe.Checkout.Session, sub: Stripe.Subscription): Promise<void> {
  try {
    const band = await db.selectFrom("bands").select("name").where("id", "=", bandId).executeTakeFirst();
    const customerId = typeof session.customer === "string" ? session.customer : session.customer?.id;
    const customer = customerId ? await stripe.customers.retrieve(customerId) : null;
    const to = session.customer_email ?? (customer && !customer.deleted ? customer.email : null);
    if (!band || !to) return;
    const cents = session.amount_total ?? 0;
    const amount = `${(cents / 100).toFixed(2)} ${(session.currency ?? "eur").toUpperCase()}`;
    const end = sub.items?.data?.[0]?.current_period_end;
    await sendMail(receiptMail({ to, bandName: band.name, amount, renewsAt: end ? new Date(end * 1000).toISOString() : null, link: appUrl(`/bands/${bandId}/plan`) }));
  } catch (err) {
    // The plan is in place; a lost receipt must not make the provider retry the event.
    console.error("receipt mail failed", err);
  }
}
