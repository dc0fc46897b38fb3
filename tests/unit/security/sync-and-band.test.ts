// Issue 10 items 1, 7, 8 and 13 (sync ids, deletes, chart ids across bands): what a member with a
// script pushes, against a real SQLite file. Each refusal is checked with what was stored.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { MAX_CHART_TEXT_LINES } from "@/lib/chart";
import { MutationSchema, type MutationIn, type MutationResult } from "@/lib/offline/protocol";
import { createChart, updateChart } from "@/lib/server/charts";
import { inviteMember, updateMember } from "@/lib/server/members";
import { pushMutations } from "@/lib/server/sync";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";

process.env.NEXTAUTH_URL = "http://localhost:3000";

let db: Kysely<Database>;
let cast: BandCast;
beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

async function push(...mutations: MutationIn[]): Promise<MutationResult[]> {
  return (await pushMutations(db, cast.leader, cast.bandId, mutations.map((m) => MutationSchema.parse(m)))).results;
}
// Compared in JS: PostgreSQL refuses a NUL byte even as a query parameter, and some refused titles hold one.
const chartsNamed = async (title: string) =>
  (await db.selectFrom("charts").select(["id", "title"]).execute()).filter((c) => c.title === title).map(({ id }) => ({ id }));
const stored = (mutationId: string) => db.selectFrom("applied_mutations").select("result_json").where("id", "=", mutationId).executeTakeFirst();

describe("built-in object keys as entity names", () => {
  for (const entity of ["constructor", "__proto__", "valueOf", "hasOwnProperty", "toString"]) {
    it(`entity "${entity}" is refused as unknown, echoes nothing of the server, and later edits in the batch still apply`, async () => {
      const mutationId = randomUUID();
      const after = randomUUID();
      const title = `After ${entity}`;
      const results = await push({ mutationId, entity, id: "x1", data: {} }, { mutationId: after, entity: "chart", id: randomUUID(), data: { ...chartInput({ title }), message: "" } });
      expect(results[0]).toEqual({ mutationId, status: "rejected", reason: `This server does not take changes to “${entity}”.` });
      expect(results[1]?.status).toBe("applied");
      const kept = (await stored(mutationId))?.result_json ?? "";
      expect(kept).not.toMatch(/"(membership|actor|db|userId|mutation)":/);
      expect(await chartsNamed(title)).toHaveLength(1);
    });
  }
});

describe("ids pushed through sync follow the REST id rule", () => {
  for (const id of ["a b\u0000c", "../x<script>"]) {
    it(`row id ${JSON.stringify(id)} is refused and nothing is stored`, async () => {
      const mutationId = randomUUID();
      const [r] = await push({ mutationId, entity: "chart", id, data: { ...chartInput({ title: `Bad id ${id}` }), message: "" } });
      expect(r).toMatchObject({ status: "rejected", fields: [{ field: "id" }] });
      expect(await chartsNamed(`Bad id ${id}`)).toEqual([]);
      expect(await stored(mutationId)).toBeUndefined();
    });
  }

  it("a change id with a NUL byte is refused and not kept as a key", async () => {
    const [r] = await push({ mutationId: "change\u0000id-1", entity: "chart", id: randomUUID(), data: { ...chartInput({ title: "Bad change id" }), message: "" } });
    expect(r).toMatchObject({ status: "rejected", fields: [{ field: "mutationId" }] });
    expect(await chartsNamed("Bad change id")).toEqual([]);
  });
});

describe("deletes and chart ids", () => {
  it("a delete pushed without a base revision after someone else's edit is a conflict and the chart stays", async () => {
    const chart = await createChart(db, cast.arranger, cast.bandId, chartInput({ title: "Keep Me" }));
    await updateChart(db, cast.arranger, cast.bandId, chart.id, { ...chartInput({ title: "Keep Me" }), baseRevision: 1, sourceText: "A:\n| F7 |" });
    const [r] = await push({ mutationId: randomUUID(), entity: "chart", id: chart.id, op: "delete", baseRevision: null });
    expect(r?.status).toBe("conflict");
    const row = await db.selectFrom("charts").selectAll().where("id", "=", chart.id).executeTakeFirstOrThrow();
    expect([row.deleted_at, row.revision]).toEqual([null, 2]);
  });

  it("a chart id taken in another band answers 409 revealing nothing of that band's chart, and stores nothing", async () => {
    const other = await makeBand(db);
    const theirs = await createChart(db, other.leader, other.bandId, chartInput({ title: "Their Secret Tune" }));
    const err = await appError(() => createChart(db, cast.leader, cast.bandId, { ...chartInput({ title: "Mine" }), id: theirs.id }));
    expect(err.status).toBe(409);
    expect(JSON.stringify({ m: err.message, d: err.details })).not.toContain("Secret");
    const [r] = await push({ mutationId: randomUUID(), entity: "chart", id: theirs.id, data: { ...chartInput({ title: "Mine by sync" }), message: "" } });
    expect(r).toEqual({ mutationId: expect.any(String), status: "conflict", current: null });
    expect(await chartsNamed("Mine")).toEqual([]);
    expect(await chartsNamed("Mine by sync")).toEqual([]);
  });
});

describe("over-long chart texts", () => {
  it(`a text of 50,000 blank lines and one bar is refused (over ${MAX_CHART_TEXT_LINES} lines) in one push of three, and none is stored`, async () => {
    const sourceText = `${"\n".repeat(49_990)}A:\n| C |`;
    const results = await push(
      ...[1, 2, 3].map((n) => ({ mutationId: randomUUID(), entity: "chart", id: randomUUID(), data: { ...chartInput({ title: `Blank ${n}` }), sourceText, message: "" } })),
    );
    expect(results.map((r) => r.status)).toEqual(["rejected", "rejected", "rejected"]);
    expect(results[0]).toMatchObject({ fields: [{ field: "sourceText" }] });
    expect(await db.selectFrom("charts").select("id").where("title", "like", "Blank %").execute()).toEqual([]);
  });
});

describe("the last leader", () => {
  it("a sole leader cannot give their own membership an end date; nothing changes", async () => {
    const band = await makeBand(db);
    const err = await appError(() => updateMember(db, band.leader, band.bandId, band.leader.userId, { expiresAt: new Date(Date.now() + 86_400_000).toISOString() }));
    expect(err.status).toBe(422);
    const row = await db.selectFrom("memberships").selectAll().where("band_id", "=", band.bandId).where("user_id", "=", band.leader.userId).executeTakeFirstOrThrow();
    expect([row.role, row.expires_at]).toEqual(["leader", null]);
  });

  it("nor another leader's, nor an arranger's; a leader with an end date does not count as the band's leader", async () => {
    const band = await makeBand(db);
    const soon = new Date(Date.now() + 86_400_000).toISOString();
    await updateMember(db, band.leader, band.bandId, band.arranger.userId, { role: "leader" });
    expect((await appError(() => updateMember(db, band.leader, band.bandId, band.arranger.userId, { expiresAt: soon }))).status).toBe(422);
    expect((await appError(() => updateMember(db, band.leader, band.bandId, band.player.userId, { expiresAt: soon }))).status).toBe(422);
    // A sub's access may end: that is what it is for.
    expect((await updateMember(db, band.leader, band.bandId, band.sub.userId, { expiresAt: soon })).expiresAt).toBe(soon);
    const ends = await db.selectFrom("memberships").select(["user_id", "expires_at"]).where("band_id", "=", band.bandId).where("expires_at", "is not", null).execute();
    expect(ends.map((e) => e.user_id).sort()).toEqual([band.sub.userId, band.expiredSub.userId].sort());
  });

  it("an invite as leader (or player) with an access end date is refused and no invite is stored", async () => {
    const band = await makeBand(db);
    const soon = new Date(Date.now() + 86_400_000).toISOString();
    for (const role of ["leader", "player"]) {
      const err = await appError(() => inviteMember(db, band.leader, band.bandId, { email: `${role}@band.test`, role, instrument: "concert", accessExpiresAt: soon }));
      expect(err.status).toBe(422);
    }
    expect(await db.selectFrom("invites").selectAll().where("band_id", "=", band.bandId).execute()).toEqual([]);
  });
});
