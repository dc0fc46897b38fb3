// Every use case against every kind of caller: the four roles, a sub whose access ended, and an
// outsider. Outsiders learn nothing (404); members without the role get 403 naming the role.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/server/access";
import { createBand, getBand, listMyBands } from "@/lib/server/bands";
import { createChart, deleteChart, getChart, listCharts, listRevisions, restoreRevision, updateChart } from "@/lib/server/charts";
import { changeRole, inviteMember, listInvites, listMembers, removeMember, setMyInstrument, updateMember } from "@/lib/server/members";
import { addMember, appError, chartInput, cleanupDbs, freshDb, makeBand, makeUser, outcome, type BandCast } from "./helpers";

vi.mock("@/lib/mail", async (importOriginal) => ({ ...(await importOriginal<typeof import("@/lib/mail")>()), sendMail: vi.fn(async () => undefined) }));

type Who = "leader" | "arranger" | "player" | "sub" | "expiredSub" | "outsider";
const WHO: Who[] = ["leader", "arranger", "player", "sub", "expiredSub", "outsider"];
type Expect = Record<Who, "ok" | 403 | 404 | 409>;

const READ_BOOK: Expect = { leader: "ok", arranger: "ok", player: "ok", sub: 403, expiredSub: 404, outsider: 404 };
const EDIT: Expect = { leader: "ok", arranger: "ok", player: 403, sub: 403, expiredSub: 404, outsider: 404 };
const LEADER_ONLY: Expect = { leader: "ok", arranger: 403, player: 403, sub: 403, expiredSub: 404, outsider: 404 };
const ANY_MEMBER: Expect = { leader: "ok", arranger: "ok", player: "ok", sub: "ok", expiredSub: 404, outsider: 404 };

let db: Kysely<Database>;
beforeAll(async () => {
  db = await freshDb();
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

async function withChart(cast: BandCast): Promise<string> {
  return (await createChart(db, cast.leader, cast.bandId, chartInput())).id;
}

const CASES: Array<{ name: string; expect: Expect; run: (cast: BandCast, me: Actor) => Promise<unknown> }> = [
  { name: "getBand", expect: ANY_MEMBER, run: (c, me) => getBand(db, me, c.bandId) },
  { name: "listMembers", expect: READ_BOOK, run: (c, me) => listMembers(db, me, c.bandId) },
  { name: "listInvites", expect: LEADER_ONLY, run: (c, me) => listInvites(db, me, c.bandId) },
  {
    name: "inviteMember",
    expect: LEADER_ONLY,
    run: (c, me) => inviteMember(db, me, c.bandId, { email: "new.person@band.test", role: "player", instrument: "eb" }),
  },
  { name: "updateMember", expect: LEADER_ONLY, run: (c, me) => updateMember(db, me, c.bandId, c.player.userId, { instrument: "bb" }) },
  { name: "changeRole", expect: LEADER_ONLY, run: (c, me) => changeRole(db, me, c.bandId, c.player.userId, "arranger") },
  {
    name: "removeMember (someone else)",
    expect: LEADER_ONLY,
    run: async (c, me) => {
      const victim = await makeUser(db, "Victim");
      await addMember(db, c.bandId, victim, "player");
      return removeMember(db, me, c.bandId, victim.userId);
    },
  },
  // The only leader may not leave: the band would have nobody to run it.
  { name: "removeMember (leave myself)", expect: { ...ANY_MEMBER, leader: 409 }, run: (c, me) => removeMember(db, me, c.bandId, me.userId) },
  { name: "setMyInstrument (in a band)", expect: ANY_MEMBER, run: (c, me) => setMyInstrument(db, me, { bandId: c.bandId, instrument: "f" }) },
  { name: "listCharts", expect: READ_BOOK, run: (c, me) => listCharts(db, me, c.bandId) },
  { name: "getChart", expect: READ_BOOK, run: async (c, me) => getChart(db, me, c.bandId, await withChart(c)) },
  { name: "listRevisions", expect: READ_BOOK, run: async (c, me) => listRevisions(db, me, c.bandId, await withChart(c)) },
  { name: "createChart", expect: EDIT, run: (c, me) => createChart(db, me, c.bandId, chartInput()) },
  {
    name: "updateChart",
    expect: EDIT,
    run: async (c, me) => updateChart(db, me, c.bandId, await withChart(c), { ...chartInput({ title: "Renamed" }), baseRevision: 1 }),
  },
  { name: "deleteChart", expect: EDIT, run: async (c, me) => deleteChart(db, me, c.bandId, await withChart(c)) },
  {
    name: "restoreRevision",
    expect: EDIT,
    run: async (c, me) => {
      const id = await withChart(c);
      await updateChart(db, c.leader, c.bandId, id, { ...chartInput({ title: "Second" }), baseRevision: 1 });
      return restoreRevision(db, me, c.bandId, id, 1);
    },
  },
];

describe("role × action matrix", () => {
  for (const c of CASES) {
    for (const who of WHO) {
      const want = c.expect[who];
      it(`${c.name} by ${who} → ${want}`, async () => {
        const cast = await makeBand(db);
        expect(await outcome(() => c.run(cast, cast[who]))).toBe(want);
      });
    }
  }

  it("a refusal names the role that is needed", async () => {
    const cast = await makeBand(db);
    const err = await appError(() => createChart(db, cast.player, cast.bandId, chartInput()));
    expect(err.status).toBe(403);
    expect(err.message).toContain("This needs the leader or arranger role");
    const err2 = await appError(() => inviteMember(db, cast.arranger, cast.bandId, { email: "x@band.test", role: "player" }));
    expect(err2.message).toContain("This needs the leader role");
  });

  it("an outsider's 404 does not reveal that the band exists", async () => {
    const cast = await makeBand(db);
    const real = await appError(() => listCharts(db, cast.outsider, cast.bandId));
    const made_up = await appError(() => listCharts(db, cast.outsider, "no-such-band"));
    expect(real.status).toBe(404);
    expect(real.message).toBe(made_up.message);
  });

  it("nobody signed in gets 401 everywhere", async () => {
    const cast = await makeBand(db);
    expect(await outcome(() => listMyBands(db, null))).toBe(401);
    expect(await outcome(() => createBand(db, null, { name: "X" }))).toBe(401);
    expect(await outcome(() => listCharts(db, null, cast.bandId))).toBe(401);
    expect(await outcome(() => setMyInstrument(db, null, { instrument: "bb" }))).toBe(401);
  });

  it("anyone signed in may start a band and leads it", async () => {
    const someone = await makeUser(db, "Founder");
    const band = await createBand(db, someone, { name: "Brand New Band", city: "Elsewhere" });
    expect(band.role).toBe("leader");
    expect((await listMyBands(db, someone)).map((b) => b.id)).toContain(band.id);
    expect(await outcome(() => createChart(db, someone, band.id, chartInput()))).toBe("ok");
  });

  it("a sub whose access ended no longer sees the band in their list", async () => {
    const cast = await makeBand(db);
    expect((await listMyBands(db, cast.expiredSub)).map((b) => b.id)).not.toContain(cast.bandId);
    expect((await listMyBands(db, cast.sub)).map((b) => b.id)).toContain(cast.bandId);
  });
});
