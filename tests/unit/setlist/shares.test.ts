// Share links for subs: one set list, one person, until an end time.
import { beforeEach, describe, expect, it, vi } from "vitest";
import { findMembership } from "@/lib/server/access";
import { AppError } from "@/lib/server/errors";
import { createSetlist } from "@/lib/server/setlists";
import { acceptShare, createShare, listShares, previewShare, revokeShare, sharedChartIds } from "@/lib/server/shares";
import { entry, makeWorld, NOW, type World } from "./fixture";

const sent = vi.hoisted(() => [] as { to: string; subject: string; text: string }[]);
vi.mock("@/lib/mail", () => ({ sendMail: async (m: { to: string; subject: string; text: string }) => void sent.push(m) }));

const END = "2026-12-05T02:00:00.000Z";
let w: World;
let setlistId: string;

async function fail(p: Promise<unknown>): Promise<AppError> {
  const err = await p.then(() => null, (e: unknown) => e);
  if (!(err instanceof AppError)) throw new Error(`expected an AppError, got ${String(err)}`);
  return err;
}

function tokenOf(link: string): string {
  return link.split("/share/")[1] ?? "";
}

beforeEach(async () => {
  sent.length = 0;
  w = await makeWorld();
  const s = await createSetlist(w.db, w.people.leader, w.bandId, {
    name: "Thursday at the Tidewater",
    entries: [entry(w.charts.harbour, 1, 0, { key: "Ab" }), entry(w.charts.kettle, 1, 1)],
  }, NOW);
  setlistId = s.id;
});

describe("sharing a set list with a sub", () => {
  it("mails a link with the caution, and only the leader may share", async () => {
    const { link, mailed, share } = await createShare(w.db, w.people.leader, w.bandId, setlistId, { email: "Lena@Example.test", expiresAt: END }, NOW);
    expect(mailed).toBe(true);
    expect(share).toMatchObject({ email: "lena@example.test", state: "waiting", expiresAt: END });
    expect(sent[0]?.to).toBe("lena@example.test");
    expect(sent[0]?.text).toContain(link);
    expect(sent[0]?.text).toMatch(/right to share/);
    const stored = await w.db.selectFrom("shares").select("token_hash").executeTakeFirstOrThrow();
    expect(stored.token_hash).not.toContain(tokenOf(link)); // only the hash is kept
    expect((await fail(createShare(w.db, w.people.arranger, w.bandId, setlistId, { email: "x@example.test", expiresAt: END }, NOW))).code).toBe("forbidden");
    expect((await fail(createShare(w.db, w.people.outsider, w.bandId, setlistId, { email: "x@example.test", expiresAt: END }, NOW))).code).toBe("not_found");
  });

  it("refuses an end time in the past, naming the field", async () => {
    const err = await fail(createShare(w.db, w.people.leader, w.bandId, setlistId, { email: "x@example.test", expiresAt: "2026-11-30T00:00:00Z" }, NOW));
    expect(err.code).toBe("unprocessable");
    expect(err.details?.fields?.[0]?.field).toBe("expiresAt");
  });

  it("makes a newcomer a sub until the share ends, with the set list's charts only", async () => {
    const { link } = await createShare(w.db, w.people.leader, w.bandId, setlistId, { email: w.people.newcomer.email, expiresAt: END }, NOW);
    expect((await previewShare(w.db, tokenOf(link), NOW))?.state).toBe("waiting");
    expect(await acceptShare(w.db, w.people.newcomer, tokenOf(link), NOW)).toEqual({ bandId: w.bandId, setlistId });
    const m = await findMembership(w.db, w.people.newcomer.userId, w.bandId, NOW);
    expect(m).toMatchObject({ role: "sub", expires_at: END, instrument: "eb" });
    expect((await sharedChartIds(w.db, w.bandId, w.people.newcomer.userId, NOW)).sort()).toEqual([w.charts.harbour, w.charts.kettle].sort());
    expect(await findMembership(w.db, w.people.newcomer.userId, w.bandId, new Date("2026-12-05T02:00:01Z"))).toBeNull();
    const mine = await w.db.selectFrom("changes").select(["entity", "entity_id"]).where("user_id", "=", w.people.newcomer.userId).execute();
    expect(mine.map((c) => c.entity).sort()).toEqual(["chart", "chart", "setlist", "share"]);
  });

  it("works once per person: the same person again is fine, anyone else is refused", async () => {
    const { link } = await createShare(w.db, w.people.leader, w.bandId, setlistId, { email: w.people.newcomer.email, expiresAt: END }, NOW);
    await acceptShare(w.db, w.people.newcomer, tokenOf(link), NOW);
    expect(await acceptShare(w.db, w.people.newcomer, tokenOf(link), NOW)).toEqual({ bandId: w.bandId, setlistId });
    const reused = await fail(acceptShare(w.db, w.people.outsider, tokenOf(link), NOW));
    expect(reused.code).toBe("gone");
    expect(reused.message).toMatch(/already used/);
  });

  it("must be opened by the address it was sent to", async () => {
    const { link } = await createShare(w.db, w.people.leader, w.bandId, setlistId, { email: w.people.newcomer.email, expiresAt: END }, NOW);
    expect((await fail(acceptShare(w.db, w.people.outsider, tokenOf(link), NOW))).code).toBe("forbidden");
  });

  it("is refused after it ends or is withdrawn, and an unknown token is not found", async () => {
    const { link } = await createShare(w.db, w.people.leader, w.bandId, setlistId, { email: w.people.newcomer.email, expiresAt: END }, NOW);
    const after = new Date("2026-12-05T02:00:00Z");
    expect((await fail(acceptShare(w.db, w.people.newcomer, tokenOf(link), after))).message).toMatch(/ended/);
    expect((await previewShare(w.db, tokenOf(link), after))?.state).toBe("ended");
    const second = await createShare(w.db, w.people.leader, w.bandId, setlistId, { email: w.people.newcomer.email, expiresAt: END }, NOW);
    await revokeShare(w.db, w.people.leader, w.bandId, second.share.id, NOW);
    expect((await fail(acceptShare(w.db, w.people.newcomer, tokenOf(second.link), NOW))).message).toMatch(/withdrew/);
    expect((await fail(acceptShare(w.db, w.people.newcomer, "not-a-real-token-at-all", NOW))).code).toBe("not_found");
    expect((await listShares(w.db, w.people.leader, w.bandId, setlistId, NOW)).map((s) => s.state).sort()).toEqual(["revoked", "waiting"]);
  });

  it("leaves a member's role alone and keeps a sub's longer access", async () => {
    const forPlayer = await createShare(w.db, w.people.leader, w.bandId, setlistId, { email: w.people.player.email, expiresAt: END }, NOW);
    await acceptShare(w.db, w.people.player, tokenOf(forPlayer.link), NOW);
    expect((await findMembership(w.db, w.people.player.userId, w.bandId, NOW))?.role).toBe("player");
    const forSub = await createShare(w.db, w.people.leader, w.bandId, setlistId, { email: w.people.sub.email, expiresAt: END }, NOW);
    await acceptShare(w.db, w.people.sub, tokenOf(forSub.link), NOW);
    expect((await findMembership(w.db, w.people.sub.userId, w.bandId, NOW))?.expires_at).toBe("2026-12-20T00:00:00.000Z");
  });
});
