// Set-list use cases by role: leader and arranger edit; player and sub read; outsiders see nothing.
import { beforeEach, describe, expect, it, vi } from "vitest";
import { AppError } from "@/lib/server/errors";
import {
  createSetlist,
  deleteSetlist,
  duplicateSetlist,
  getSetlist,
  listSetlists,
  updateSetlist,
} from "@/lib/server/setlists";
import { createShare, acceptShare } from "@/lib/server/shares";
import { entry, makeWorld, NOW, type World } from "./fixture";

const sent = vi.hoisted(() => [] as { to: string; text: string }[]);
vi.mock("@/lib/mail", () => ({ sendMail: async (m: { to: string; text: string }) => void sent.push(m) }));

async function codeOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return "ok";
  } catch (err) {
    if (err instanceof AppError) return err.code;
    throw err;
  }
}

function gig(w: World) {
  return {
    name: "Friday at the Lamplight Room",
    startsAt: "2026-12-04T20:30:00Z",
    venue: "Lamplight Room",
    notes: "Load in at 7.",
    entries: [
      entry(w.charts.harbour, 1, 0, { key: "G", tempo: 132, intro: { kind: "dominant-pedal", bars: 4 }, ending: { kind: "tag", bars: 4, times: 3 }, soloOrder: "tenor, piano" }),
      entry(w.charts.kettle, 2, 0, { intro: { kind: "composed" }, ending: { kind: "cold" } }),
    ],
  };
}

let w: World;
beforeEach(async () => {
  sent.length = 0;
  w = await makeWorld();
});

describe("who may do what with set lists", () => {
  const table = [
    { who: "leader", create: "ok", read: "ok" },
    { who: "arranger", create: "ok", read: "ok" },
    { who: "player", create: "forbidden", read: "ok" },
    { who: "sub", create: "forbidden", read: "not_found" }, // nothing shared with them yet
    { who: "outsider", create: "not_found", read: "not_found" },
  ] as const;
  for (const row of table) {
    it(`a ${row.who}: create → ${row.create}, read another's set list → ${row.read}`, async () => {
      const made = await createSetlist(w.db, w.people.leader, w.bandId, gig(w), NOW);
      expect(await codeOf(createSetlist(w.db, w.people[row.who], w.bandId, gig(w), NOW))).toBe(row.create);
      expect(await codeOf(getSetlist(w.db, w.people[row.who], w.bandId, made.id, NOW))).toBe(row.read);
      const edit = updateSetlist(w.db, w.people[row.who], w.bandId, made.id, { ...gig(w), baseRevision: 1 }, NOW);
      expect(await codeOf(edit)).toBe(row.create);
    });
  }

  it("an anonymous caller is asked to sign in", async () => {
    expect(await codeOf(listSetlists(w.db, null, w.bandId))).toBe("unauthenticated");
  });
});

describe("building a gig", () => {
  it("keeps every per-tune choice and returns the tunes in set order", async () => {
    const made = await createSetlist(w.db, w.people.leader, w.bandId, gig(w), NOW);
    const got = await getSetlist(w.db, w.people.player, w.bandId, made.id, NOW);
    expect(got.entries.map((e) => [e.setNumber, e.chartId])).toEqual([[1, w.charts.harbour], [2, w.charts.kettle]]);
    expect(got.entries[0]).toMatchObject({
      key: "G",
      tempo: 132,
      intro: { kind: "dominant-pedal", bars: 4 },
      ending: { kind: "tag", bars: 4, times: 3 },
      soloOrder: "tenor, piano",
    });
    expect(got.startsAt).toBe("2026-12-04T20:30:00.000Z");
    const list = await listSetlists(w.db, w.people.player, w.bandId, NOW);
    expect(list).toMatchObject([{ id: made.id, tunes: 2, sets: 2 }]);
  });

  it("refuses the composed intro on a chart without one, naming the entry", async () => {
    const bad = { ...gig(w), entries: [entry(w.charts.harbour, 1, 0, { intro: { kind: "composed" } })] };
    const err = await createSetlist(w.db, w.people.leader, w.bandId, bad, NOW).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).code).toBe("unprocessable");
    expect((err as AppError).details?.fields?.[0]?.field).toBe("entries.0.intro.kind");
  });

  it("refuses a chart from another band as if it did not exist", async () => {
    const bad = { ...gig(w), entries: [entry("c-not-ours", 1, 0)] };
    const err = (await createSetlist(w.db, w.people.leader, w.bandId, bad, NOW).catch((e: unknown) => e)) as AppError;
    expect(err.details?.fields?.[0]?.field).toBe("entries.0.chartId");
  });

  it("reorders by saving the new order, and refuses a stale revision with the current one", async () => {
    const made = await createSetlist(w.db, w.people.leader, w.bandId, gig(w), NOW);
    const [a, b] = made.entries;
    const moved = await updateSetlist(w.db, w.people.arranger, w.bandId, made.id, {
      ...gig(w),
      baseRevision: 1,
      entries: [{ ...b!, setNumber: 1, position: 0 }, { ...a!, setNumber: 1, position: 1 }],
    }, NOW);
    expect(moved.revision).toBe(2);
    expect(moved.entries.map((e) => e.chartId)).toEqual([w.charts.kettle, w.charts.harbour]);
    const stale = (await updateSetlist(w.db, w.people.leader, w.bandId, made.id, { ...gig(w), baseRevision: 1 }, NOW).catch((e: unknown) => e)) as AppError;
    expect(stale.code).toBe("conflict");
    expect((stale.details?.current as { revision: number }).revision).toBe(2);
  });

  it("duplicates for the next gig with new entry ids and no shares", async () => {
    const made = await createSetlist(w.db, w.people.leader, w.bandId, gig(w), NOW);
    await createShare(w.db, w.people.leader, w.bandId, made.id, { email: w.people.newcomer.email, expiresAt: "2026-12-05T02:00:00Z" }, NOW);
    const copy = await duplicateSetlist(w.db, w.people.leader, w.bandId, made.id, { name: "Saturday at the Lamplight Room", startsAt: "2026-12-05T20:30:00Z" }, NOW);
    expect(copy.id).not.toBe(made.id);
    expect(copy.name).toBe("Saturday at the Lamplight Room");
    expect(copy.entries.map((e) => e.intro)).toEqual(made.entries.map((e) => e.intro));
    expect(copy.entries.some((e) => made.entries.some((m) => m.id === e.id))).toBe(false);
    const shares = await w.db.selectFrom("shares").select("setlist_id").execute();
    expect(shares.map((s) => s.setlist_id)).toEqual([made.id]);
  });

  it("deletes as a tombstone on the feed and hides it from lists", async () => {
    const made = await createSetlist(w.db, w.people.leader, w.bandId, gig(w), NOW);
    expect(await codeOf(deleteSetlist(w.db, w.people.player, w.bandId, made.id, NOW))).toBe("forbidden");
    await deleteSetlist(w.db, w.people.leader, w.bandId, made.id, NOW);
    expect(await listSetlists(w.db, w.people.leader, w.bandId, NOW)).toEqual([]);
    const feed = await w.db.selectFrom("changes").select(["entity", "op"]).where("entity_id", "=", made.id).orderBy("seq").execute();
    expect(feed.map((c) => c.op)).toEqual(["upsert", "delete"]);
  });
});

describe("a sub sees only what is shared with them", () => {
  it("reads the shared set list, not the others, and nothing after the share ends", async () => {
    const shared = await createSetlist(w.db, w.people.leader, w.bandId, gig(w), NOW);
    const other = await createSetlist(w.db, w.people.leader, w.bandId, { ...gig(w), name: "Private rehearsal" }, NOW);
    const { link } = await createShare(w.db, w.people.leader, w.bandId, shared.id, { email: w.people.sub.email, expiresAt: "2026-12-05T02:00:00Z" }, NOW);
    await acceptShare(w.db, w.people.sub, link.split("/share/")[1]!, NOW);
    expect((await listSetlists(w.db, w.people.sub, w.bandId, NOW)).map((s) => s.id)).toEqual([shared.id]);
    expect((await getSetlist(w.db, w.people.sub, w.bandId, shared.id, NOW)).name).toBe(shared.name);
    expect(await codeOf(getSetlist(w.db, w.people.sub, w.bandId, other.id, NOW))).toBe("not_found");
    const afterGig = new Date("2026-12-05T03:00:00Z");
    expect(await listSetlists(w.db, w.people.sub, w.bandId, afterGig)).toEqual([]);
    expect(await codeOf(getSetlist(w.db, w.people.sub, w.bandId, shared.id, afterGig))).toBe("not_found");
  });
});
