// A local stand-in for a browser push service (RFC 8030): accepts the standard encrypted request
// (RFC 8291 aes128gcm content + RFC 8292 VAPID authorization), checks the VAPID signature, records
// each message and, for subscribers whose keys it holds, decrypts it. Lists what it received at
// GET /messages (newest first; DELETE clears). Used by the demo and the tests; never in production.
//   POST /subscribers            {privateKey?, auth?}  → {id, endpoint, keys: {p256dh, auth}}
//   POST /subscribers/:id/gone   later pushes to it answer 410 Gone (an unsubscribed browser)
//   POST /push/:id               the push itself (what web-push sends)
import { createECDH, createPublicKey, randomBytes, verify } from "node:crypto";
import http from "node:http";
import type { AddressInfo } from "node:net";
// http_ece is the reference implementation of RFC 8188 / 8291 content coding.
import ece from "http_ece";

export interface PushedMessage {
  id: number;
  subscriber: string;
  receivedAt: string;
  ttl: number | null;
  urgency: string | null;
  topic: string | null;
  /** The VAPID claims, after the signature was checked. */
  vapid: { aud: string; sub: string; exp: number };
  bytes: number;
  /** The decrypted payload (UTF-8), or null when this fake holds no keys for the subscriber. */
  payload: string | null;
}

interface Subscriber {
  ecdh: ReturnType<typeof createECDH>;
  auth: Buffer;
  gone: boolean;
}

export interface PushFake {
  port: number;
  origin: string;
  messages: () => PushedMessage[];
  close: () => Promise<void>;
}

const MAX_KEPT = 1000;
const b64u = (b: Buffer) => b.toString("base64url");

async function readBody(req: http.IncomingMessage, limit = 8192): Promise<Buffer> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const c of req) {
    size += (c as Buffer).length;
    if (size > limit) throw new Error("too large");
    chunks.push(c as Buffer);
  }
  return Buffer.concat(chunks);
}

/** Checks `Authorization: vapid t=<jwt>, k=<p256 public key>` (RFC 8292) and returns its claims. */
export function checkVapid(header: string | undefined, origin: string, now = Date.now()): PushedMessage["vapid"] {
  const m = /^vapid\s+t=([^,\s]+),\s*k=([A-Za-z0-9_-]+)$/.exec(header ?? "");
  if (!m) throw new Error("missing or malformed vapid authorization");
  const [, jwt, k] = m as unknown as [string, string, string];
  const point = Buffer.from(k, "base64url");
  if (point.length !== 65 || point[0] !== 4) throw new Error("k is not an uncompressed P-256 key");
  const key = createPublicKey({ key: { kty: "EC", crv: "P-256", x: b64u(point.subarray(1, 33)), y: b64u(point.subarray(33)) }, format: "jwk" });
  const [h, p, s] = jwt.split(".");
  if (!h || !p || !s) throw new Error("malformed jwt");
  const head = JSON.parse(Buffer.from(h, "base64url").toString()) as { alg?: string };
  if (head.alg !== "ES256") throw new Error("jwt alg must be ES256");
  const ok = verify("sha256", Buffer.from(`${h}.${p}`), { key, dsaEncoding: "ieee-p1363" }, Buffer.from(s, "base64url"));
  if (!ok) throw new Error("bad vapid signature");
  const claims = JSON.parse(Buffer.from(p, "base64url").toString()) as PushedMessage["vapid"];
  if (claims.aud !== origin) throw new Error(`aud ${claims.aud} is not ${origin}`);
  if (!(claims.exp * 1000 > now) || claims.exp * 1000 > now + 24 * 3600_000) throw new Error("exp out of range");
  if (!/^(mailto:|https?:)/.test(claims.sub ?? "")) throw new Error("sub must be a mailto: or https: contact");
  return claims;
}

export async function startPushFake({ port = 2528 }: { port?: number } = {}): Promise<PushFake> {
  const subscribers = new Map<string, Subscriber>();
  const store: PushedMessage[] = [];
  let nextId = 1;
  let origin = "";

  const json = (res: http.ServerResponse, status: number, body: unknown) => {
    res.writeHead(status, { "content-type": "application/json" });
    res.end(JSON.stringify(body));
  };

  async function subscribe(req: http.IncomingMessage, res: http.ServerResponse) {
    const text = (await readBody(req)).toString() || "{}";
    const body = JSON.parse(text) as { privateKey?: string; auth?: string };
    const ecdh = createECDH("prime256v1");
    if (body.privateKey) ecdh.setPrivateKey(Buffer.from(body.privateKey, "base64url"));
    else ecdh.generateKeys();
    const auth = body.auth ? Buffer.from(body.auth, "base64url") : randomBytes(16);
    const id = b64u(randomBytes(12));
    subscribers.set(id, { ecdh, auth, gone: false });
    json(res, 201, { id, endpoint: `${origin}/push/${id}`, keys: { p256dh: b64u(ecdh.getPublicKey()), auth: b64u(auth) } });
  }

  async function receive(id: string, req: http.IncomingMessage, res: http.ServerResponse) {
    const sub = subscribers.get(id);
    if (!sub) return json(res, 404, { error: "no such subscription" });
    if (sub.gone) return json(res, 410, { error: "subscription expired" });
    let vapid: PushedMessage["vapid"];
    try {
      vapid = checkVapid(req.headers.authorization, origin);
    } catch (err) {
      return json(res, 403, { error: (err as Error).message });
    }
    const ttl = req.headers.ttl === undefined ? null : Number(req.headers.ttl);
    if (ttl === null || !Number.isFinite(ttl)) return json(res, 400, { error: "TTL header is required" });
    const body = await readBody(req, 4096 + 100);
    let payload: string | null = null;
    if (body.length > 0) {
      if (req.headers["content-encoding"] !== "aes128gcm") return json(res, 415, { error: "content-encoding must be aes128gcm" });
      try {
        payload = ece.decrypt(body, { version: "aes128gcm", privateKey: sub.ecdh, authSecret: b64u(sub.auth) }).toString("utf8");
      } catch (err) {
        return json(res, 400, { error: `could not decrypt: ${(err as Error).message}` });
      }
    }
    const header = (n: string) => (typeof req.headers[n] === "string" ? (req.headers[n] as string) : null);
    store.unshift({ id: nextId++, subscriber: id, receivedAt: new Date().toISOString(), ttl, urgency: header("urgency"), topic: header("topic"), vapid, bytes: body.length, payload });
    store.length = Math.min(store.length, MAX_KEPT);
    res.writeHead(201, { location: `${origin}/messages/${nextId - 1}` }).end();
  }

  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://localhost");
    const parts = url.pathname.split("/").filter(Boolean);
    const run = async () => {
      if (url.pathname === "/messages" && req.method === "GET") {
        const to = url.searchParams.get("subscriber");
        return json(res, 200, { messages: to ? store.filter((m) => m.subscriber === to) : store });
      }
      if (url.pathname === "/messages" && req.method === "DELETE") {
        store.length = 0;
        return void res.writeHead(204).end();
      }
      if (url.pathname === "/subscribers" && req.method === "POST") return subscribe(req, res);
      if (parts[0] === "subscribers" && parts[2] === "gone" && req.method === "POST") {
        const sub = subscribers.get(parts[1] ?? "");
        if (sub) sub.gone = true;
        return json(res, sub ? 200 : 404, { ok: Boolean(sub) });
      }
      if (parts[0] === "push" && parts.length === 2 && req.method === "POST") return receive(parts[1]!, req, res);
      json(res, 404, { error: "not found" });
    };
    run().catch((err: unknown) => json(res, 400, { error: (err as Error).message }));
  });

  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const actual = (server.address() as AddressInfo).port;
  origin = `http://127.0.0.1:${actual}`;
  return {
    port: actual,
    origin,
    messages: () => [...store],
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

// `tsx scripts/push-fake.ts`: run it alone (the bench starts it in its own process this way).
if (process.argv[1] && import.meta.url === (await import("node:url")).pathToFileURL(process.argv[1]).href) {
  const fake = await startPushFake({ port: Number(process.env.PUSH_FAKE_PORT ?? 2528) });
  console.log(`push fake on ${fake.origin}, received pushes at ${fake.origin}/messages`);
}
