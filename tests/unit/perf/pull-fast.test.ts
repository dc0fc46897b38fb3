// The sync pull's fast paths: an up-to-date poll answered from the band's cursor, pages kept in the
// page cache. Each must give the same answer as building the page from the feed,
// and must never hand out what the caller may no longer see.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { createChart, updateChart } from "@/lib/server/charts";
import { removeMember } from "@/lib/server/members";
import { PullBody, cachedPull, keepPull, pullCacheSize } from "@/lib/server/pull-cache";
import { pullResponse } from "@/lib/server/sync-response";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";
import { pull, pullAll } from "../sync/helpers";

let db: Kysely<Database>;
let cast: BandCast;
let chartId = "";

beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  for (let i = 0; i < 3; i++) chartId = (await createChart(db, cast.leader, cast.bandId, chartInput({ title: `Tune ${i}` }))).id;
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

describe("an up-to-date poll", () => {
  it("answers with no changes, the caller's membership and a zero count, like the full path", async () => {
    const all = await pullAll(db, cast.player, cast.bandId);
    const poll = await pull(db, cast.player, cast.bandId, { since: all.seq, scope: all.scope, count: "1" });
    expect(poll).toMatchObject({ seq: all.seq, more: false, scope: "player", total: 0, changes: [] });
    expect(poll.membership).toMatchObject({ bandId: cast.bandId, role: "player" });
    expect(poll.band).toEqual({ id: cast.bandId, name: "Test Band" });
  });

  it("sees a change made after it, through a second handle on the same database", async () => {
    const all = await pullAll(db, cast.player, cast.bandId);
    expect((await pull(db, cast.player, cast.bandId, { since: all.seq })).changes).toEqual([]);
    await updateChart(db, cast.leader, cast.bandId, chartId, { ...chartInput({ title: "Tune changed" }), baseRevision: 1 });
    const next = await pull(db, cast.player, cast.bandId, { since: all.seq });
    expect(next.changes.map((c) => c.id)).toEqual([chartId]);
    expect(next.seq).toBeGreaterThan(all.seq);
  });

  it("still refuses a member who was removed (membership is checked before any shortcut)", async () => {
    const all = await pullAll(db, cast.arranger, cast.bandId);
    await pull(db, cast.arranger, cast.bandId, { since: 0 });
    await removeMember(db, cast.leader, cast.bandId, cast.arranger.userId);
    expect((await appError(() => pull(db, cast.arranger, cast.bandId, { since: all.seq }))).code).toBe("not_found");
    expect((await appError(() => pull(db, cast.arranger, cast.bandId, { since: 0 }))).code).toBe("not_found");
  });
});

describe("the page cache", () => {
  it("serves a page again only while the band's cursor is unchanged", async () => {
    const first = await pull(db, cast.leader, cast.bandId, { since: 0, limit: 50 });
    expect(await pull(db, cast.leader, cast.bandId, { since: 0, limit: 50 })).toEqual(first);
    await createChart(db, cast.leader, cast.bandId, chartInput({ title: "A new one" }));
    const after = await pull(db, cast.leader, cast.bandId, { since: 0, limit: 50 });
    expect(after.seq).toBeGreaterThan(first.seq);
    expect(after.changes.length).toBe(first.changes.length + 1);
  });

  it("keeps pages apart per caller: a player's page is never the leader's", async () => {
    const leader = await pull(db, cast.leader, cast.bandId, { since: 0 });
    const player = await pull(db, cast.player, cast.bandId, { since: 0 });
    expect(leader.membership.role).toBe("leader");
    expect(player.membership.role).toBe("player");
    expect(player.members).toBeUndefined();
  });

  it("is bounded in entries and bytes, and drops pages past their time", () => {
    for (let i = 0; i < 200; i++) keepPull(`k${i}`, new PullBody("x".repeat(1000)));
    expect(pullCacheSize().entries).toBeLessThanOrEqual(64);
    expect(cachedPull("k0")).toBeNull();
    expect(cachedPull("k199")?.text).toHaveLength(1000);
    keepPull("old", new PullBody("{}"), Date.now() - 60_000);
    expect(cachedPull("old")).toBeNull();
  });
});

describe("the response", () => {
  it("carries the page's bytes as they are, for the server to compress when asked", async () => {
    const page = new PullBody('{"seq":3,"more":false,"changes":[]}');
    const res = pullResponse(page);
    expect(res.headers.get("content-encoding")).toBeNull();
    expect(res.headers.get("cache-control")).toBe("no-store");
    expect(await res.text()).toBe(page.text);
    expect(page.bytes()).toBe(page.bytes());
  });
});
