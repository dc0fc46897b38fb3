// The route handlers as the browser meets them: status codes and JSON error bodies.
// The session is replaced by a settable actor; the database is a real file.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { Actor } from "@/lib/server/access";

let actor: Actor | null = null;
vi.mock("@/lib/server/session", () => ({ getActor: async () => actor }));
vi.mock("@/lib/mail", async (importOriginal) => ({ ...(await importOriginal<typeof import("@/lib/mail")>()), sendMail: vi.fn(async () => undefined) }));

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-routes-"));
process.env.DATABASE_PATH = path.join(dir, "routes.db");
process.env.BCRYPT_COST = "4";

const bands = await import("@/app/api/bands/route");
const charts = await import("@/app/api/bands/[bandId]/charts/route");
const chart = await import("@/app/api/bands/[bandId]/charts/[chartId]/route");
const members = await import("@/app/api/bands/[bandId]/members/route");
const health = await import("@/app/api/health/route");
const signup = await import("@/app/api/signup/route");
const member = await import("@/app/api/bands/[bandId]/members/[userId]/route");
const accept = await import("@/app/api/invites/[token]/accept/route");
const instrument = await import("@/app/api/me/instrument/route");
const { ready } = await import("@/db");
const { makeUser, addMember, chartInput } = await import("./helpers");

type Handler = (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

async function call(h: Handler, method: string, params: Record<string, string>, body?: unknown, rawBody?: string) {
  const init: RequestInit = { method, headers: { "content-type": "application/json" } };
  if (body !== undefined) init.body = JSON.stringify(body);
  if (rawBody !== undefined) init.body = rawBody;
  const res = await h(new Request("http://localhost/api/x", init), { params: Promise.resolve(params) });
  return { status: res.status, json: (await res.json()) as Record<string, unknown> & { error?: { code: string; message: string; fields?: { field: string }[]; current?: { revision: number } } } };
}

let leader: Actor;
let player: Actor;
let outsider: Actor;
let bandId = "";

beforeAll(async () => {
  const db = await ready();
  leader = await makeUser(db, "Route Leader");
  player = await makeUser(db, "Route Player");
  outsider = await makeUser(db, "Route Outsider");
  actor = leader;
  const r = await call(bands.POST, "POST", {}, { name: "Route Band" });
  expect(r.status).toBe(201);
  bandId = (r.json.band as { id: string }).id;
  await addMember(db, bandId, player, "player");
});
afterAll(async () => {
  await (await ready()).destroy();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe("routes", () => {
  it("health answers once migrations ran", async () => {
    const res = await health.GET();
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ ok: true });
  });

  it("signed out: 401 with a JSON error", async () => {
    actor = null;
    const r = await call(bands.GET, "GET", {});
    expect(r.status).toBe(401);
    expect(r.json.error?.code).toBe("unauthenticated");
  });

  // The second answer is the same as the first (issue 10 item 13): sign-up tells no stranger which addresses exist.
  it("sign-up: 201, the same 201 answer on the same address, 422 naming the field on a bad body", async () => {
    actor = null;
    const body = { name: "New", email: "route.new@band.test", password: "long enough pw" };
    const first = await call(signup.POST, "POST", {}, body);
    expect(first.status).toBe(201);
    const again = await call(signup.POST, "POST", {}, body);
    expect(again.status).toBe(201);
    expect(again.json).toEqual(first.json);
    const bad = await call(signup.POST, "POST", {}, { ...body, email: "x" });
    expect(bad.status).toBe(422);
    expect(bad.json.error?.fields?.[0]?.field).toBe("email");
  });

  it("create, conflict with the current chart, and the player's refused PUT", async () => {
    actor = leader;
    const created = await call(charts.POST, "POST", { bandId }, chartInput());
    expect(created.status).toBe(201);
    const chartId = (created.json.chart as { id: string }).id;
    const params = { bandId, chartId };
    expect((await call(chart.PUT, "PUT", params, { ...chartInput({ title: "v2" }), baseRevision: 1 })).status).toBe(200);
    const stale = await call(chart.PUT, "PUT", params, { ...chartInput({ title: "late" }), baseRevision: 1 });
    expect(stale.status).toBe(409);
    expect(stale.json.error?.code).toBe("conflict");
    expect(stale.json.error?.current?.revision).toBe(2);
    actor = player;
    expect((await call(chart.GET, "GET", params)).status).toBe(200);
    const refused = await call(chart.PUT, "PUT", params, { ...chartInput(), baseRevision: 2 });
    expect(refused.status).toBe(403);
    expect(refused.json.error?.message).toContain("This needs the leader or arranger role");
    actor = outsider;
    expect((await call(chart.GET, "GET", params)).status).toBe(404);
    expect((await call(members.GET, "GET", { bandId })).status).toBe(404);
  });

  it("bad bodies: invalid JSON 400, unknown keys and wrong types 422 with the field, bad ids 400", async () => {
    actor = leader;
    expect((await call(charts.POST, "POST", { bandId }, undefined, "{not json")).status).toBe(400);
    const unknown = await call(charts.POST, "POST", { bandId }, { ...chartInput(), extra: 1 });
    expect(unknown.status).toBe(422);
    const wrongType = await call(charts.POST, "POST", { bandId }, chartInput({ tempo: "fast" }));
    expect(wrongType.json.error?.fields?.map((f) => f.field)).toContain("tempo");
    expect((await call(charts.GET, "GET", { bandId: "../etc" })).status).toBe(400);
  });

  it("members: the leader sees open invites, a player sees none", async () => {
    actor = leader;
    expect((await call(members.POST, "POST", { bandId }, { email: "invitee@band.test", role: "sub" })).status).toBe(201);
    const list = await call(members.GET, "GET", { bandId });
    expect((list.json.invites as unknown[]).length).toBe(1);
    actor = player;
    const asPlayer = await call(members.GET, "GET", { bandId });
    expect(asPlayer.status).toBe(200);
    expect(asPlayer.json.invites).toEqual([]);
  });

  it("invite accept: the wrong band in the query is 404, the right one joins; PATCH and DELETE members", async () => {
    actor = leader;
    const made = await call(members.POST, "POST", { bandId }, { email: "joiner.route@band.test", role: "player", instrument: "bb" });
    const token = String(made.json.link).split("/invite/")[1] ?? "";
    const db = await ready();
    const joiner = await makeUser(db, "Route Joiner", "joiner.route@band.test");
    actor = joiner;
    const acceptWith = async (q: string) => {
      const res = await accept.POST(new Request(`http://localhost/api/invites/${token}/accept${q}`, { method: "POST" }), { params: Promise.resolve({ token }) });
      return { status: res.status, json: (await res.json()) as { bandId?: string } };
    };
    expect((await acceptWith("?bandId=some-other-band")).status).toBe(404);
    const ok = await acceptWith(`?bandId=${bandId}`);
    expect(ok.status).toBe(200);
    expect(ok.json.bandId).toBe(bandId);
    expect((await acceptWith("")).status).toBe(410);
    // The new member may not change roles; the leader may.
    const params = { bandId, userId: joiner.userId };
    expect((await call(member.PATCH, "PATCH", params, { role: "arranger" })).status).toBe(403);
    actor = leader;
    const patched = await call(member.PATCH, "PATCH", params, { role: "arranger" });
    expect((patched.json.member as { role: string }).role).toBe("arranger");
    expect((await call(member.PATCH, "PATCH", params, { role: "boss" })).status).toBe(422);
    expect((await call(member.DELETE, "DELETE", params)).status).toBe(200);
    expect((await call(member.DELETE, "DELETE", params)).status).toBe(404);
  });

  it("PUT /api/me/instrument sets my part in a band, and refuses an unknown instrument", async () => {
    actor = player;
    const r = await call(instrument.PUT, "PUT", {}, { bandId, instrument: "eb" });
    expect(r.status).toBe(200);
    expect(r.json).toEqual({ instrument: "eb", bandId });
    expect((await call(instrument.PUT, "PUT", {}, { instrument: "kazoo" })).status).toBe(422);
    actor = outsider;
    expect((await call(instrument.PUT, "PUT", {}, { bandId, instrument: "eb" })).status).toBe(404);
  });
});
