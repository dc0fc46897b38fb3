// The server's pushes go to a local push service over HTTP with the standard's encryption (RFC 8291
// aes128gcm) and VAPID (RFC 8292); the fake decrypts them with the keys the "browser" holds.
import { createECDH, randomBytes } from "node:crypto";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { startPushFake, type PushFake } from "@/scripts/push-fake";
import { fanOut, pushTopic } from "@/lib/server/push";
import { vapidKeys } from "@/lib/server/push-keys";
import { endpointAllowed, subscribeDevice } from "@/lib/server/push-subscriptions";
import { readPushMessage } from "@/lib/push/message";
import { removeMember } from "@/lib/server/members";
import { cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";

let fake: PushFake;
let db: Kysely<Database>;
let cast: BandCast;

interface Browser {
  endpoint: string;
  id: string;
  keys: { p256dh: string; auth: string };
}

/** A browser's side of a subscription: its own ECDH key and auth secret, given to the fake to decrypt with. */
async function browser(): Promise<Browser> {
  const ecdh = createECDH("prime256v1");
  ecdh.generateKeys();
  const auth = randomBytes(16).toString("base64url");
  const res = await fetch(`${fake.origin}/subscribers`, { method: "POST", body: JSON.stringify({ privateKey: ecdh.getPrivateKey().toString("base64url"), auth }) });
  const body = (await res.json()) as Browser;
  expect(body.keys.p256dh).toBe(ecdh.getPublicKey().toString("base64url"));
  return body;
}

async function subscribe(actor: BandCast["player"], b: Browser, deviceId = `device-${b.id}`) {
  await subscribeDevice(db, actor, { deviceId, bandIds: [cast.bandId], subscription: { endpoint: b.endpoint, keys: b.keys } });
}

beforeAll(async () => {
  fake = await startPushFake({ port: 0 });
  process.env.PUSH_FAKE_ORIGIN = fake.origin;
});
afterAll(async () => {
  await fake.close();
  cleanupDbs();
});
beforeEach(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  await fetch(`${fake.origin}/messages`, { method: "DELETE" });
});

describe("push fan-out", () => {
  it("sends an encrypted, VAPID-signed message that the push service decrypts to the band and charts", async () => {
    const phone = await browser();
    await subscribe(cast.player, phone);
    const r = await fanOut(db, { bandId: cast.bandId, authorId: cast.leader.userId, kind: "chart", chartIds: ["chart-1"] });
    expect(r).toEqual({ sent: 1, removed: 0, failed: 0 });
    const [msg] = fake.messages();
    expect(msg?.subscriber).toBe(phone.id);
    // The body on the wire is ciphertext, not the JSON.
    expect(msg!.bytes).toBeGreaterThan(msg!.payload!.length);
    const data = readPushMessage(msg!.payload);
    expect(data).toMatchObject({ v: 1, bandId: cast.bandId, kind: "chart", chartIds: ["chart-1"] });
    expect(msg!.vapid.aud).toBe(fake.origin);
    expect(msg!.ttl).toBeGreaterThan(3600);
    expect(msg!.topic).toBe(pushTopic(cast.bandId, "chart"));
  });

  it("keeps the VAPID key pair in the database across calls", async () => {
    const a = await vapidKeys(db);
    const b = await vapidKeys(db);
    expect(a).toEqual(b);
    expect(Buffer.from(a.publicKey, "base64url")).toHaveLength(65);
  });

  it("skips the author's own devices and reaches every other member's", async () => {
    await subscribe(cast.leader, await browser());
    await subscribe(cast.arranger, await browser());
    const p1 = await browser();
    const p2 = await browser();
    await subscribe(cast.player, p1, "player-phone");
    await subscribe(cast.player, p2, "player-tablet");
    const r = await fanOut(db, { bandId: cast.bandId, authorId: cast.leader.userId, kind: "setlist", setlistId: "s1" });
    expect(r.sent).toBe(3);
    expect(new Set(fake.messages().map((m) => m.subscriber))).toContain(p2.id);
  });

  it("does not tell a sub about a chart that is not on a set list shared with them", async () => {
    await subscribe(cast.sub, await browser());
    const r = await fanOut(db, { bandId: cast.bandId, authorId: cast.leader.userId, kind: "chart", chartIds: ["not-shared"] });
    expect(r.sent).toBe(0);
  });

  it("removes a subscription the push service answers 410 Gone for, and keeps the others", async () => {
    const gone = await browser();
    const live = await browser();
    await subscribe(cast.player, gone, "old-phone");
    await subscribe(cast.arranger, live);
    await fetch(`${fake.origin}/subscribers/${gone.id}/gone`, { method: "POST" });
    const r = await fanOut(db, { bandId: cast.bandId, authorId: cast.leader.userId, kind: "chart", chartIds: ["c"] });
    expect(r).toEqual({ sent: 1, removed: 1, failed: 0 });
    const left = await db.selectFrom("push_subscriptions").select("endpoint").execute();
    expect(left.map((s) => s.endpoint)).toEqual([live.endpoint]);
  });

  it("drops a member's subscriptions when they leave the band", async () => {
    await subscribe(cast.player, await browser());
    await removeMember(db, cast.player, cast.bandId, cast.player.userId);
    const left = await db.selectFrom("push_subscriptions").select("id").where("user_id", "=", cast.player.userId).execute();
    expect(left).toHaveLength(0);
  });

  it("refuses endpoints that are not push services", () => {
    expect(endpointAllowed("http://10.0.0.5/steal", undefined)).toBe(false);
    expect(endpointAllowed("https://localhost/x", undefined)).toBe(false);
    expect(endpointAllowed("https://push.example.net/abc", undefined)).toBe(true);
    expect(endpointAllowed(`${fake.origin}/push/x`)).toBe(true);
  });

  it("the push service refuses a request with a forged VAPID signature", async () => {
    const phone = await browser();
    const res = await fetch(phone.endpoint, { method: "POST", headers: { TTL: "60", Authorization: `vapid t=a.b.c, k=${phone.keys.p256dh}` } });
    expect(res.status).toBe(403);
  });
});
