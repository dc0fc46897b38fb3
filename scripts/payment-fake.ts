// A local stand-in for the payment provider, for the demo and the tests. It answers the API calls
// the official Node SDK makes (customers, checkout sessions, subscriptions) and serves a hosted
// checkout page; "paying" there creates the subscription, sends a correctly signed webhook event to
// the app and redirects back. No card, no network: everything stays on this machine.
import { createHmac, randomBytes } from "node:crypto";
import http from "node:http";
import type { AddressInfo } from "node:net";

/** The webhook secret both sides use in fake mode (never a real one). */
export const FAKE_WEBHOOK_SECRET = "whsec_pedalpoint_local_fake";
const PLAN_AMOUNT = 900; // cents a month, shown on the fake checkout page
const PLAN_CURRENCY = "eur";

type Obj = Record<string, unknown>;

export interface PaymentFakeOptions {
  port: number;
  /** Where webhook events go; default the app's /api/billing/webhook. */
  webhookUrl?: string;
  webhookSecret?: string;
  /** Tests deliver events straight to a handler instead of over HTTP. */
  deliver?: (payload: string, signature: string) => Promise<void>;
}

export interface PaymentFake {
  port: number;
  url: string;
  close: () => Promise<void>;
  /** Ends a subscription that was set to cancel at its period end, as the provider would at renewal. */
  endSubscription: (id: string) => Promise<void>;
  state: { customers: Map<string, Obj>; sessions: Map<string, Obj>; subscriptions: Map<string, Obj> };
}

/** The provider's signature scheme: t=<unix seconds>,v1=<HMAC-SHA256 of "t.payload"> */
export function signWebhook(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const v1 = createHmac("sha256", secret).update(`${timestamp}.${payload}`, "utf8").digest("hex");
  return `t=${timestamp},v1=${v1}`;
}

const id = (prefix: string) => `${prefix}_${randomBytes(12).toString("hex")}`;
const now = () => Math.floor(Date.now() / 1000);

/** Form bodies with bracketed keys (a[b][0][c]=v), as the SDK encodes them. */
export function parseForm(body: string): Obj {
  const out: Obj = {};
  for (const [rawKey, value] of new URLSearchParams(body)) {
    const keys = rawKey.split(/\[|\]\[|\]/).filter((k) => k !== "");
    let node: Obj = out;
    keys.forEach((k, i) => {
      if (i === keys.length - 1) node[k] = value;
      else node = (node[k] ??= {}) as Obj;
    });
  }
  return out;
}

function html(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${title}</title>
<style>body{font-family:system-ui,sans-serif;background:#f4f1ea;color:#15171c;margin:0}main{max-width:28rem;margin:3rem auto;background:#fff;border-radius:12px;padding:2rem;box-shadow:0 1px 4px #0002}
h1{font-size:1.3rem}.note{background:#fff4d6;border-radius:8px;padding:.75rem;font-size:.9rem}button{font:inherit;font-weight:600;background:#1d4e89;color:#fff;border:0;border-radius:8px;padding:.8rem 1.2rem;cursor:pointer;width:100%}a{color:#1d4e89}</style></head>
<body><main>${body}</main></body></html>`;
}

export async function startPaymentFake(opts: PaymentFakeOptions): Promise<PaymentFake> {
  const customers = new Map<string, Obj>();
  const sessions = new Map<string, Obj>();
  const subscriptions = new Map<string, Obj>();
  const secret = opts.webhookSecret ?? process.env.STRIPE_WEBHOOK_SECRET ?? FAKE_WEBHOOK_SECRET;
  const appBase = (process.env.NEXTAUTH_URL ?? `http://localhost:${process.env.PORT ?? 3000}`).replace(/\/+$/, "");
  const webhookUrl = opts.webhookUrl ?? process.env.PAYMENT_WEBHOOK_URL ?? `${appBase}/api/billing/webhook`;
  let base = "";

  async function send(type: string, object: Obj): Promise<void> {
    const event = { id: id("evt"), object: "event", api_version: null, created: now(), livemode: false, pending_webhooks: 1, request: { id: null, idempotency_key: null }, type, data: { object } };
    const payload = JSON.stringify(event);
    const signature = signWebhook(payload, secret);
    if (opts.deliver) return opts.deliver(payload, signature);
    try {
      const res = await fetch(webhookUrl, { method: "POST", headers: { "content-type": "application/json", "stripe-signature": signature }, body: payload });
      if (!res.ok) console.warn(`payment fake: webhook ${type} answered ${res.status}`);
    } catch (err) {
      console.warn(`payment fake: webhook ${type} could not be delivered`, err);
    }
  }

  function newSubscription(session: Obj): Obj {
    const start = now();
    const end = start + 30 * 86_400;
    const sd = (session.subscription_data ?? {}) as Obj;
    const items = (session.line_items ?? {}) as Record<string, Obj>;
    const priceId = String(items["0"]?.price ?? "price_band_monthly");
    const sub: Obj = {
      id: id("sub"), object: "subscription", customer: session.customer, status: "active", livemode: false,
      cancel_at_period_end: false, cancel_at: null, canceled_at: null, ended_at: null, start_date: start, created: start,
      current_period_start: start, current_period_end: end, metadata: (sd.metadata ?? session.metadata ?? {}) as Obj,
      items: { object: "list", has_more: false, data: [{ id: id("si"), object: "subscription_item", quantity: 1, current_period_start: start, current_period_end: end,
        price: { id: priceId, object: "price", currency: PLAN_CURRENCY, unit_amount: PLAN_AMOUNT, recurring: { interval: "month", interval_count: 1 } } }] },
    };
    subscriptions.set(sub.id as string, sub);
    return sub;
  }

  async function endSubscription(subId: string): Promise<void> {
    const sub = subscriptions.get(subId);
    if (!sub) return;
    Object.assign(sub, { status: "canceled", ended_at: now(), canceled_at: sub.canceled_at ?? now() });
    await send("customer.subscription.deleted", sub);
  }

  async function api(method: string, path: string, body: Obj): Promise<[number, Obj]> {
    const parts = path.split("/").filter(Boolean); // v1, resource, id, …
    const [, resource, sub1, sub2] = parts;
    const missing = (what: string): [number, Obj] => [404, { error: { type: "invalid_request_error", code: "resource_missing", message: `No such ${what}: '${parts.at(-1)}'` } }];
    if (resource === "customers" && method === "POST" && !sub1) {
      const c: Obj = { id: id("cus"), object: "customer", created: now(), email: body.email ?? null, name: body.name ?? null, metadata: body.metadata ?? {} };
      customers.set(c.id as string, c);
      return [200, c];
    }
    // The one price the app sells, so the plan page can state it before checkout.
    if (resource === "prices" && method === "GET" && sub1) {
      return [200, { id: sub1, object: "price", active: true, currency: PLAN_CURRENCY, unit_amount: PLAN_AMOUNT, recurring: { interval: "month", interval_count: 1 } }];
    }
    if (resource === "customers" && method === "GET" && sub1) return customers.has(sub1) ? [200, customers.get(sub1)!] : missing("customer");
    if (resource === "checkout" && sub1 === "sessions" && method === "POST" && !sub2) {
      if (!body.success_url) return [400, { error: { type: "invalid_request_error", param: "success_url", message: "Missing required param: success_url." } }];
      const s: Obj = {
        id: id("cs_test"), object: "checkout.session", created: now(), mode: body.mode ?? "subscription", status: "open", payment_status: "unpaid",
        customer: body.customer ?? null, customer_email: body.customer_email ?? null, client_reference_id: body.client_reference_id ?? null,
        metadata: body.metadata ?? {}, success_url: body.success_url, cancel_url: body.cancel_url ?? null, subscription: null,
        amount_total: PLAN_AMOUNT, currency: PLAN_CURRENCY, line_items: body.line_items, subscription_data: body.subscription_data,
      };
      s.url = `${base}/checkout/${s.id as string}`;
      sessions.set(s.id as string, s);
      return [200, s];
    }
    if (resource === "checkout" && sub1 === "sessions" && method === "GET" && sub2) return sessions.has(sub2) ? [200, sessions.get(sub2)!] : missing("checkout.session");
    if (resource === "subscriptions" && sub1) {
      const s = subscriptions.get(sub1);
      if (!s) return missing("subscription");
      if (method === "GET") return [200, s];
      if (method === "POST") {
        if (body.cancel_at_period_end !== undefined) {
          const cancel = body.cancel_at_period_end === "true";
          Object.assign(s, { cancel_at_period_end: cancel, cancel_at: cancel ? s.current_period_end : null, canceled_at: cancel ? now() : null });
        }
        if (body.metadata) s.metadata = { ...(s.metadata as Obj), ...(body.metadata as Obj) };
        await send("customer.subscription.updated", s);
        return [200, s];
      }
      if (method === "DELETE") {
        await endSubscription(sub1);
        return [200, s];
      }
    }
    return [404, { error: { type: "invalid_request_error", message: `Unrecognized request URL (${method}: ${path}).` } }];
  }

  const server = http.createServer(async (req, res) => {
    const url = new URL(req.url ?? "/", "http://localhost");
    const chunks: Buffer[] = [];
    for await (const c of req) chunks.push(c as Buffer);
    const raw = Buffer.concat(chunks).toString("utf8");
    try {
      if (url.pathname.startsWith("/v1/")) {
        if (!/^Bearer sk_(test|live)_\S+/.test(req.headers.authorization ?? "")) {
          res.writeHead(401, { "content-type": "application/json" }).end(JSON.stringify({ error: { type: "invalid_request_error", message: "Invalid API Key provided." } }));
          return;
        }
        const [status, body] = await api(req.method ?? "GET", url.pathname, parseForm(raw));
        res.writeHead(status, { "content-type": "application/json", "request-id": id("req") }).end(JSON.stringify(body));
        return;
      }
      const m = /^\/checkout\/([\w]+)(\/pay)?$/.exec(url.pathname);
      const session = m ? sessions.get(m[1] as string) : undefined;
      if (!m || !session) {
        res.writeHead(404, { "content-type": "text/html" }).end(html("Not found", "<h1>This checkout does not exist</h1>"));
        return;
      }
      if (!m[2] && req.method === "GET") {
        const done = session.status === "complete";
        res.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(html("Test checkout", `
<h1>Band plan — test checkout</h1>
<p class="note" role="note">This is the local payment stand-in. No card is asked for and nothing is charged.</p>
<p>Pedalpoint band plan: €${(PLAN_AMOUNT / 100).toFixed(2)} a month, renews monthly, cancel any time.</p>
${done ? "<p>This checkout is already paid.</p>" : `<form method="post" action="/checkout/${session.id as string}/pay"><button type="submit" data-testid="fake-pay">Pay €${(PLAN_AMOUNT / 100).toFixed(2)} (test)</button></form>`}
${session.cancel_url ? `<p><a href="${String(session.cancel_url)}">Go back without paying</a></p>` : ""}`));
        return;
      }
      if (m[2] && req.method === "POST") {
        if (session.status !== "complete") {
          const sub = newSubscription(session);
          Object.assign(session, { status: "complete", payment_status: "paid", subscription: sub.id });
          await send("checkout.session.completed", session);
          await send("customer.subscription.created", sub);
        }
        const back = String(session.success_url).replace("{CHECKOUT_SESSION_ID}", session.id as string);
        res.writeHead(303, { location: back }).end();
        return;
      }
      res.writeHead(405).end();
    } catch (err) {
      console.error("payment fake error", err);
      res.writeHead(500, { "content-type": "application/json" }).end(JSON.stringify({ error: { type: "api_error", message: "fake failed" } }));
    }
  });
  await new Promise<void>((resolve) => server.listen(opts.port, "127.0.0.1", resolve));
  const port = (server.address() as AddressInfo).port;
  base = `http://127.0.0.1:${port}`;
  return {
    port,
    url: base,
    endSubscription,
    state: { customers, sessions, subscriptions },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
