// The device side of sync against fake-indexeddb and the real server code: first sync, the
// "updated since you last opened it" mark, the outbox across a restart, retries, conflict copies,
// refusals, a removed member and a sub whose share ended.
import { randomUUID } from "node:crypto";
import { IDBKeyRange, indexedDB } from "fake-indexeddb";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { LocalBook, setLocalBook } from "@/lib/offline/db";
import { saveChart } from "@/lib/offline/mutations";
import { SyncEngine } from "@/lib/offline/sync";
import type { Actor } from "@/lib/server/access";
import { createChart, updateChart } from "@/lib/server/charts";
import { chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";
import { makeSetlist, shareWith } from "../sync/helpers";
import { fakeNetwork, type FakeNetwork } from "./fake-server";
import type { WireChart } from "@/lib/wire";

let db: Kysely<Database>;
let cast: BandCast;
let tune: WireChart;

beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  tune = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Harbour Lights" }));
  for (let i = 0; i < 4; i++) await createChart(db, cast.leader, cast.bandId, chartInput({ title: `Standby ${i}` }));
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});
afterEach(() => {
  vi.unstubAllGlobals();
  setLocalBook(null);
});

interface Device {
  book: LocalBook;
  net: FakeNetwork;
  engine: SyncEngine;
  name: string;
}

function device(actor: Actor, name = `device-${randomUUID()}`): Device {
  const book = new LocalBook(name, { indexedDB, IDBKeyRange });
  const net = fakeNetwork(db, () => actor);
  return { book, net, name, engine: new SyncEngine({ book: () => book, transport: net }) };
}

/** saveChart as the page calls it, on this device, with no signal. */
async function editOffline(d: Device, chartId: string, baseRevision: number, feel: string) {
  setLocalBook(d.book);
  vi.stubGlobal("fetch", () => Promise.reject(new TypeError("Failed to fetch")));
  return saveChart(cast.bandId, { ...chartInput({ title: "Harbour Lights", feel }), message: "", id: chartId, baseRevision });
}

describe("first sync", () => {
  it("brings the session, the band and every chart, reports progress, and marks nothing as updated", async () => {
    const d = device(cast.player);
    const seen: number[] = [];
    d.engine.subscribe(() => {
      const p = d.engine.getSnapshot().progress;
      if (p) seen.push(p.received);
    });
    await d.engine.sync();
    expect(d.engine.getSnapshot().problem).toBeUndefined();
    expect((await d.book.session.get("me"))?.userId).toBe(cast.player.userId);
    expect((await d.book.memberships.get(cast.bandId))?.role).toBe("player");
    const charts = await d.book.charts.where("bandId").equals(cast.bandId).toArray();
    expect(charts.length).toBeGreaterThanOrEqual(5);
    expect(charts.every((c) => !c.unseen)).toBe(true);
    expect(seen.length).toBeGreaterThan(0);
    expect((await d.book.revisions.where("chartId").equals(tune.id).toArray()).map((r) => r.revision)).toContain(1);
    expect((await d.book.syncState.get(cast.bandId))?.lastSyncedAt).toBeTruthy();
  });
});

describe("pushed updates", () => {
  it("marks a chart someone else changed until this user opens it, but never their own edits", async () => {
    const d = device(cast.player);
    await d.engine.sync();
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Marked" }));
    await d.engine.sync();
    await updateChart(db, cast.leader, cast.bandId, c.id, { ...chartInput({ title: "Marked", feel: "faster" }), baseRevision: 1 });
    await d.engine.sync();
    const row = await d.book.charts.get(c.id);
    expect([row?.revision, row?.feel, row?.unseen]).toEqual([2, "faster", true]);
    setLocalBook(d.book);
    const { markChartSeen } = await import("@/lib/offline/hooks");
    await markChartSeen(c.id);
    expect((await d.book.charts.get(c.id))?.unseen).toBe(false);
  });
});

describe("the outbox", () => {
  it("keeps an offline edit across a restart and sends it at the next sync", async () => {
    const d = device(cast.arranger);
    await d.engine.sync();
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Restart" }));
    await d.engine.sync();
    const r = await editOffline(d, c.id, 1, "written on the bus");
    expect(r.status).toBe("queued");
    expect((await d.book.charts.get(c.id))?.feel).toBe("written on the bus");
    d.book.close();
    const reopened = new LocalBook(d.name, { indexedDB, IDBKeyRange });
    const items = await reopened.outbox.toArray();
    expect(items.map((i) => [i.entityId, i.status, i.baseRevision])).toEqual([[c.id, "pending", 1]]);
    const again = new SyncEngine({ book: () => reopened, transport: d.net });
    await again.sync();
    expect(await reopened.outbox.count()).toBe(0);
    const server = await db.selectFrom("charts").selectAll().where("id", "=", c.id).executeTakeFirstOrThrow();
    expect([server.revision, server.feel]).toEqual([2, "written on the bus"]);
    expect((await reopened.charts.get(c.id))?.revision).toBe(2);
  });

  it("retries after a failed push and sends the edit once", async () => {
    const d = device(cast.arranger);
    await d.engine.sync();
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Retry" }));
    await d.engine.sync();
    await editOffline(d, c.id, 1, "second try");
    d.net.failNextPush = 1;
    await d.engine.sync();
    expect(d.engine.getSnapshot().problem).toBe("network");
    const [item] = await d.book.outbox.toArray();
    expect(item?.attempts).toBeGreaterThanOrEqual(1);
    expect(item?.nextAttemptAt).toBeTruthy();
    await d.engine.sync();
    expect(d.engine.getSnapshot().problem).toBeUndefined();
    expect(await d.book.outbox.count()).toBe(0);
    const revs = await db.selectFrom("chart_revisions").select("revision").where("chart_id", "=", c.id).execute();
    expect(revs).toHaveLength(2);
  });
});

describe("conflicts and refusals", () => {
  it("keeps the device's edit as a conflict copy beside the leader's newer revision", async () => {
    const d = device(cast.arranger);
    await d.engine.sync();
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Harbour Lights" }));
    await d.engine.sync();
    await editOffline(d, c.id, 1, "arranger's offline idea");
    await updateChart(db, cast.leader, cast.bandId, c.id, { ...chartInput({ title: "Harbour Lights", feel: "leader's correction" }), baseRevision: 1 });
    await d.engine.sync();
    const original = await d.book.charts.get(c.id);
    expect([original?.revision, original?.feel, original?.unseen]).toEqual([2, "leader's correction", true]);
    const copies = await d.book.charts.where("conflictOf").equals(c.id).toArray();
    expect(copies.map((x) => x.feel)).toEqual(["arranger's offline idea"]);
    const conflicts = await d.book.conflicts.toArray();
    expect(conflicts.map((x) => [x.entityId, x.serverRevision])).toEqual([[c.id, 2]]);
    expect(await d.book.outbox.count()).toBe(0);
  });

  it("keeps a refused edit in the outbox with the reason and shows the band's version again", async () => {
    const d = device(cast.player);
    await d.engine.sync();
    await editOffline(d, tune.id, 1, "player's wish");
    await d.engine.sync();
    const [item] = await d.book.outbox.toArray();
    expect(item?.status).toBe("rejected");
    expect(item?.reason).toMatch(/leader or arranger/);
    expect((await d.book.charts.get(tune.id))?.feel).toBe("swing");
  });

  it("does not let a pull overwrite an edit still waiting to be sent", async () => {
    const d = device(cast.arranger);
    await d.engine.sync();
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Waiting" }));
    await d.engine.sync();
    await editOffline(d, c.id, 1, "mine, unsent");
    await updateChart(db, cast.leader, cast.bandId, c.id, { ...chartInput({ title: "Waiting", feel: "theirs" }), baseRevision: 1 });
    // Pull only (as if the push had failed): the local edit stays on screen.
    const { pullBand } = await import("@/lib/offline/pull");
    await pullBand(d.book, d.net, cast.bandId, cast.arranger.userId);
    expect((await d.book.charts.get(c.id))?.feel).toBe("mine, unsent");
  });
});

describe("losing access", () => {
  it("removes the band's data from a removed member's device at the next sync", async () => {
    const gone = await (await import("../server/helpers")).makeUser(db, "Leaving");
    await (await import("../server/helpers")).addMember(db, cast.bandId, gone, "player");
    const d = device(gone);
    await d.engine.sync();
    expect(await d.book.charts.where("bandId").equals(cast.bandId).count()).toBeGreaterThan(0);
    await db.deleteFrom("memberships").where("user_id", "=", gone.userId).execute();
    await d.engine.sync();
    expect(await d.book.charts.where("bandId").equals(cast.bandId).count()).toBe(0);
    expect(await d.book.bands.get(cast.bandId)).toBeUndefined();
    expect(d.engine.getSnapshot().notices.join(" ")).toMatch(/no longer/);
  });

  it("takes a sub's shared charts off the device when the share ends", async () => {
    const setlistId = await makeSetlist(db, cast.bandId, cast.leader, [tune.id]);
    const shareId = await shareWith(db, cast.bandId, setlistId, cast.sub, cast.leader, new Date(Date.now() + 3_600_000));
    const d = device(cast.sub);
    await d.engine.sync();
    expect((await d.book.charts.toArray()).map((c) => c.id)).toEqual([tune.id]);
    expect(await d.book.setlists.count()).toBe(1);
    await db.updateTable("shares").set({ expires_at: new Date(Date.now() - 1000).toISOString() }).where("id", "=", shareId).execute();
    await d.engine.sync();
    expect(await d.book.charts.count()).toBe(0);
    expect(await d.book.setlists.count()).toBe(0);
  });
});
