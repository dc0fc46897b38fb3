// The push side against real SQLite: applied edits go through the chart use cases, re-sent
// mutation ids get their first answer, clashes come back as conflicts, refusals with their reason.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import type { MutationIn, MutationResult } from "@/lib/offline/protocol";
import { MutationSchema } from "@/lib/offline/protocol";
import { createChart, updateChart } from "@/lib/server/charts";
import { pushMutations } from "@/lib/server/sync";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "../server/helpers";

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

function fields(over: Record<string, unknown> = {}) {
  const { title, composer, key, meter, tempo, feel, sourceText } = chartInput(over);
  return { title, composer, key, meter, tempo, feel, sourceText, message: "" };
}

async function push(actor: BandCast["leader"], ...mutations: MutationIn[]): Promise<MutationResult[]> {
  return (await pushMutations(db, actor, cast.bandId, mutations.map((m) => MutationSchema.parse(m)))).results;
}

const revisionsOf = (id: string) => db.selectFrom("chart_revisions").select("revision").where("chart_id", "=", id).execute();

describe("applying a device's edits", () => {
  it("creates a chart with the id the device chose, through the chart use case (revision, history, feed row)", async () => {
    const id = randomUUID();
    const [r] = await push(cast.arranger, { mutationId: randomUUID(), entity: "chart", id, baseRevision: null, data: fields({ title: "Made Offline" }) });
    expect(r).toMatchObject({ status: "applied", revision: 1 });
    expect(r?.status === "applied" ? (r.data as { title: string } | null)?.title : null).toBe("Made Offline");
    expect(await revisionsOf(id)).toHaveLength(1);
    const feed = await db.selectFrom("changes").selectAll().where("entity_id", "=", id).execute();
    expect(feed.map((f) => f.op)).toEqual(["upsert"]);
  });

  it("answers a re-sent mutation id with its first answer and applies it only once", async () => {
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Resent" }));
    const m: MutationIn = { mutationId: randomUUID(), entity: "chart", id: c.id, baseRevision: 1, data: fields({ title: "Resent", feel: "bossa" }) };
    const [first] = await push(cast.arranger, m);
    const [again] = await push(cast.arranger, m);
    expect(first).toMatchObject({ status: "applied", revision: 2 });
    expect(again).toMatchObject({ status: "applied", revision: 2, mutationId: m.mutationId });
    expect(await revisionsOf(c.id)).toHaveLength(2);
  });

  it("does not let another user replay someone's mutation id", async () => {
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Mine" }));
    const m: MutationIn = { mutationId: randomUUID(), entity: "chart", id: c.id, baseRevision: 1, data: fields({ title: "Mine", feel: "waltz" }) };
    await push(cast.arranger, m);
    const [r] = await push(cast.leader, m);
    expect(r?.status).toBe("rejected");
  });

  it("treats an edit the server already holds (its answer was lost, then re-sent with a new id) as applied", async () => {
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Lost Answer" }));
    const data = fields({ title: "Lost Answer", feel: "even eighths" });
    await push(cast.arranger, { mutationId: randomUUID(), entity: "chart", id: c.id, baseRevision: 1, data });
    const [r] = await push(cast.arranger, { mutationId: randomUUID(), entity: "chart", id: c.id, baseRevision: 1, data });
    expect(r).toMatchObject({ status: "applied", revision: 2 });
  });
});

describe("conflicts", () => {
  it("answers an edit based on an old revision with the server's current row, and changes nothing", async () => {
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Contested" }));
    await updateChart(db, cast.leader, cast.bandId, c.id, { ...chartInput({ title: "Contested", feel: "leader's fix" }), baseRevision: 1 });
    const [r] = await push(cast.arranger, { mutationId: randomUUID(), entity: "chart", id: c.id, baseRevision: 1, data: fields({ title: "Contested", feel: "arranger's idea" }) });
    expect(r?.status).toBe("conflict");
    const current = r?.status === "conflict" ? (r.current as { revision: number; feel: string }) : null;
    expect(current).toMatchObject({ revision: 2, feel: "leader's fix" });
    const row = await db.selectFrom("charts").selectAll().where("id", "=", c.id).executeTakeFirstOrThrow();
    expect([row.revision, row.feel]).toEqual([2, "leader's fix"]);
  });

  it("reports a chart deleted meanwhile as a conflict too", async () => {
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Gone" }));
    const [del] = await push(cast.leader, { mutationId: randomUUID(), entity: "chart", id: c.id, op: "delete", baseRevision: 1 });
    expect(del).toMatchObject({ status: "applied", revision: 2 });
    const [r] = await push(cast.arranger, { mutationId: randomUUID(), entity: "chart", id: c.id, baseRevision: 1, data: fields({ title: "Gone" }) });
    expect(r?.status).toBe("conflict");
  });
});

describe("refusals", () => {
  it("refuses a player's chart edit with the role it needs", async () => {
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Not Yours" }));
    const [r] = await push(cast.player, { mutationId: randomUUID(), entity: "chart", id: c.id, baseRevision: 1, data: fields({ title: "Not Yours" }) });
    expect(r?.status).toBe("rejected");
    expect(r?.status === "rejected" ? r.reason : "").toMatch(/leader or arranger/);
  });

  it("refuses a chart text that does not read, naming the line and column", async () => {
    const [r] = await push(cast.arranger, { mutationId: randomUUID(), entity: "chart", id: randomUUID(), baseRevision: null, data: fields({ sourceText: "A:\n| Cmaj7 | Qx9!! |\n" }) });
    expect(r?.status).toBe("rejected");
    const f = r?.status === "rejected" ? (r.fields?.[0] as { field: string; line?: number } | undefined) : undefined;
    expect(f?.field).toBe("sourceText");
    expect(f?.line).toBe(2);
  });

  it("refuses kinds of rows it does not know, without dropping the rest of the batch", async () => {
    const c = await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Batch" }));
    const results = await push(
      cast.leader,
      { mutationId: randomUUID(), entity: "mystery", id: "x", baseRevision: null, data: {} },
      { mutationId: randomUUID(), entity: "chart", id: c.id, baseRevision: 1, data: fields({ title: "Batch", feel: "second" }) },
    );
    expect(results.map((r) => r.status)).toEqual(["rejected", "applied"]);
  });

  it("answers a removed member or an outsider with 404 for the whole push", async () => {
    const err = await appError(() => pushMutations(db, cast.outsider, cast.bandId, []));
    expect(err.status).toBe(404);
  });
});
