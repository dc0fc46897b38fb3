// Issue 10 items 5 and 9: a page on another site posting with the leader's cookie, and oversized
// bodies. Each attack must be refused before any work, and nothing stored.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { actorBox, send } from "./route-harness";

vi.mock("@/lib/server/session", () => ({ getActor: async () => actorBox.actor }));
vi.mock("@/lib/mail", async (importOriginal) => ({ ...(await importOriginal<typeof import("@/lib/mail")>()), sendMail: vi.fn(async () => undefined) }));

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-xsite-"));
process.env.DATABASE_PATH = path.join(dir, "xsite.db");
process.env.BCRYPT_COST = "4";
process.env.NEXTAUTH_URL = "http://localhost:3000";
process.env.PAYMENT_FAKE = "1";

const charts = await import("@/app/api/bands/[bandId]/charts/route");
const invites = await import("@/app/api/bands/[bandId]/invites/route");
const signup = await import("@/app/api/signup/route");
const webhook = await import("@/app/api/billing/webhook/route");
const sync = await import("@/app/api/bands/[bandId]/sync/route");
const { ready } = await import("@/db");
const { makeUser, chartInput } = await import("../server/helpers");

let bandId = "";
const chartCount = async () => Number((await (await ready()).selectFrom("charts").select((eb) => eb.fn.countAll<number>().as("n")).where("band_id", "=", bandId).executeTakeFirstOrThrow()).n);

beforeAll(async () => {
  const db = await ready();
  const leader = await makeUser(db, "Xsite Leader");
  actorBox.actor = leader;
  const bands = await import("@/app/api/bands/route");
  const r = await send(bands.POST, { body: { name: "Xsite Band" } });
  bandId = (r.json.band as { id: string }).id;
});
afterAll(async () => {
  await (await ready()).destroy();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe("a state-changing request from another site, carrying the leader's cookie", () => {
  it("a text/plain POST from a foreign Origin creating a chart is 403 and no chart is stored", async () => {
    const r = await send(charts.POST, { params: { bandId }, origin: "https://evil.example", headers: { "content-type": "text/plain" }, raw: JSON.stringify(chartInput()) });
    expect(r.status).toBe(403);
    expect(r.json.error?.message).toMatch(/another site/);
    expect(await chartCount()).toBe(0);
  });

  it("an invite from a foreign Origin is 403 and no invite is stored", async () => {
    const r = await send(invites.POST, { params: { bandId }, origin: "https://evil.example", body: { email: "mallory@evil.test", role: "leader", instrument: "concert" } });
    expect(r.status).toBe(403);
    expect(await (await ready()).selectFrom("invites").selectAll().where("band_id", "=", bandId).execute()).toEqual([]);
  });

  it("Origin: null (a sandboxed frame) and Sec-Fetch-Site: cross-site without Origin are refused too", async () => {
    expect((await send(charts.POST, { params: { bandId }, origin: "null", body: chartInput() })).status).toBe(403);
    expect((await send(charts.POST, { params: { bandId }, origin: null, headers: { "sec-fetch-site": "cross-site" }, body: chartInput() })).status).toBe(403);
    expect((await send(charts.POST, { params: { bandId }, origin: null, headers: { "sec-fetch-site": "same-site" }, body: chartInput() })).status).toBe(403);
    expect(await chartCount()).toBe(0);
  });

  it("the app's own page (same Origin) still creates the chart", async () => {
    expect((await send(charts.POST, { params: { bandId }, body: chartInput() })).status).toBe(201);
    expect(await chartCount()).toBe(1);
  });
});

describe("oversized bodies are refused with 413 before they are read", () => {
  function endless(bytes: number): ReadableStream<Uint8Array> {
    let sent = 0;
    const chunk = new Uint8Array(64 * 1024).fill(0x20);
    return new ReadableStream({
      pull(c) {
        if (sent >= bytes) return c.close();
        sent += chunk.byteLength;
        c.enqueue(chunk);
      },
    });
  }

  it("a 200 MB sign-up announced by Content-Length is 413 at once and no account is made", async () => {
    const r = await send(signup.POST, { headers: { "content-length": String(200 * 1024 * 1024) }, raw: "{}" , client: "10.0.0.1" });
    expect(r.status).toBe(413);
    expect(await (await ready()).selectFrom("users").selectAll().where("name", "=", "Big").execute()).toEqual([]);
  });

  it("a streamed 200 MB webhook body with no length is cut off after its limit (256 KB), not read to the end", async () => {
    let pulled = 0;
    const body = endless(200 * 1024 * 1024).pipeThrough(new TransformStream({ transform(c, ctl) { pulled += c.byteLength; ctl.enqueue(c); } }));
    const r = await send(webhook.POST, { raw: body, origin: null, client: "10.0.0.2" });
    expect(r.status).toBe(413);
    expect(pulled).toBeLessThan(2 * 1024 * 1024);
    expect(await (await ready()).selectFrom("subscriptions").selectAll().execute()).toEqual([]);
  });

  it("a sync push over 2 MB is 413 and none of its edits is applied", async () => {
    const before = await chartCount();
    const big = { mutations: [{ mutationId: "big-push-0001", entity: "chart", id: "big-one", data: { ...chartInput(), sourceText: "x".repeat(3 * 1024 * 1024) } }] };
    const r = await send(sync.POST, { params: { bandId }, body: big });
    expect(r.status).toBe(413);
    expect(await chartCount()).toBe(before);
    expect(await (await ready()).selectFrom("applied_mutations").selectAll().where("id", "=", "big-push-0001").execute()).toEqual([]);
  });
});
