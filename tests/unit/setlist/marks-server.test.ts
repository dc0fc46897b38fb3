// Personal marks on the server: private to their owner, on charts the owner may read, following their
// bar after a revision; and the sync feed's loaders and push handlers for set lists and marks.
import { beforeEach, describe, expect, it, vi } from "vitest";
import { findMembership } from "@/lib/server/access";
import { createMark, deleteMark, listMyMarks, reanchorChartMarks, updateMark } from "@/lib/server/marks";
import { AppError } from "@/lib/server/errors";
import { loadMarkFeedRows, loadSetlistFeedRows, pushMarkMutation, pushSetlistMutation } from "@/lib/server/setlist-feed";
import { createSetlist } from "@/lib/server/setlists";
import { acceptShare, createShare } from "@/lib/server/shares";
import { anchorFor } from "@/lib/setlist";
import { bar, entry, harbourChart, makeWorld, NOW, type World } from "./fixture";

vi.mock("@/lib/mail", () => ({ sendMail: async () => undefined }));

let w: World;
beforeEach(async () => {
  w = await makeWorld();
});

function markInput(chartId: string, section: number, b: number, text = "lay out 1st x") {
  return { chartId, data: { anchor: anchorFor(harbourChart(), section, b), kind: "text", text, chartRevision: 1 } };
}

async function member(who: keyof World["people"]) {
  const m = await findMembership(w.db, w.people[who].userId, w.bandId, NOW);
  if (!m) throw new Error(`${who} is not a member`);
  return m;
}

describe("personal marks", () => {
  it("are seen only by the player who made them", async () => {
    const mark = await createMark(w.db, w.people.player, w.bandId, markInput(w.charts.harbour, 2, 3), NOW);
    expect((await listMyMarks(w.db, w.people.player, w.bandId, w.charts.harbour)).map((m) => m.id)).toEqual([mark.id]);
    expect(await listMyMarks(w.db, w.people.leader, w.bandId, w.charts.harbour)).toEqual([]);
    const steal = await updateMark(w.db, w.people.leader, w.bandId, mark.id, { baseRevision: 1, data: mark.data }, NOW).catch((e: unknown) => e);
    expect((steal as AppError).code).toBe("not_found");
    const feed = await w.db.selectFrom("changes").select("user_id").where("entity", "=", "annotation").execute();
    expect(feed).toEqual([{ user_id: w.people.player.userId }]);
  });

  it("refuse a bar that is not in the chart, and a stale edit", async () => {
    const bad = { chartId: w.charts.harbour, data: { anchor: { section: 9, sectionLabel: "Coda", bar: 0 }, kind: "highlight", chartRevision: 1 } };
    expect(((await createMark(w.db, w.people.player, w.bandId, bad, NOW).catch((e: unknown) => e)) as AppError).code).toBe("unprocessable");
    const mark = await createMark(w.db, w.people.player, w.bandId, markInput(w.charts.harbour, 0, 0), NOW);
    await updateMark(w.db, w.people.player, w.bandId, mark.id, { baseRevision: 1, data: { ...mark.data, text: "softer" } }, NOW);
    const stale = (await updateMark(w.db, w.people.player, w.bandId, mark.id, { baseRevision: 1, data: mark.data }, NOW).catch((e: unknown) => e)) as AppError;
    expect(stale.code).toBe("conflict");
    await deleteMark(w.db, w.people.player, w.bandId, mark.id, NOW);
    expect(await listMyMarks(w.db, w.people.player, w.bandId)).toEqual([]);
  });

  it("can be put by a sub only on a chart shared with them", async () => {
    const s = await createSetlist(w.db, w.people.leader, w.bandId, { name: "Sunday brunch", entries: [entry(w.charts.harbour, 1, 0)] }, NOW);
    const { link } = await createShare(w.db, w.people.leader, w.bandId, s.id, { email: w.people.sub.email, expiresAt: "2026-12-03T00:00:00Z" }, NOW);
    await acceptShare(w.db, w.people.sub, link.split("/share/")[1]!, NOW);
    await expect(createMark(w.db, w.people.sub, w.bandId, markInput(w.charts.harbour, 0, 1), NOW)).resolves.toBeTruthy();
    const other = (await createMark(w.db, w.people.sub, w.bandId, markInput(w.charts.spare, 0, 1), NOW).catch((e: unknown) => e)) as AppError;
    expect(other.code).toBe("not_found");
  });

  it("follow their bar when the leader publishes a revision, or are flagged lost", async () => {
    const onBridge = await createMark(w.db, w.people.player, w.bandId, markInput(w.charts.harbour, 2, 5), NOW);
    const onLastA = await createMark(w.db, w.people.arranger, w.bandId, markInput(w.charts.harbour, 3, 7), NOW);
    const next = structuredClone(harbourChart());
    next.sections.unshift({ label: "Verse", bars: [bar("Dm7")] });
    next.sections.pop(); // the last A is cut
    await w.db.updateTable("charts").set({ body_json: JSON.stringify(next), revision: 2 }).where("id", "=", w.charts.harbour).execute();
    expect(await reanchorChartMarks(w.db, w.bandId, w.charts.harbour, next, 2, NOW)).toBe(2);
    const [bridge] = await listMyMarks(w.db, w.people.player, w.bandId);
    expect(bridge?.data.anchor).toMatchObject({ section: 3, sectionLabel: "B", bar: 5 });
    expect(bridge?.data.chartRevision).toBe(2);
    expect(bridge?.revision).toBe(onBridge.revision + 1);
    const [lost] = await listMyMarks(w.db, w.people.arranger, w.bandId);
    expect(lost?.id).toBe(onLastA.id);
    expect(lost?.data.lost).toBe(true);
  });
});

describe("the sync feed's rows and pushes", () => {
  it("gives a sub only shared set lists, and the rest as deletes", async () => {
    const shared = await createSetlist(w.db, w.people.leader, w.bandId, { name: "Open air", entries: [entry(w.charts.kettle, 1, 0, { intro: { kind: "composed" } })] }, NOW);
    const hidden = await createSetlist(w.db, w.people.leader, w.bandId, { name: "Audition night" }, NOW);
    const { link } = await createShare(w.db, w.people.leader, w.bandId, shared.id, { email: w.people.sub.email, expiresAt: "2026-12-03T00:00:00Z" }, NOW);
    await acceptShare(w.db, w.people.sub, link.split("/share/")[1]!, NOW);
    const rows = await loadSetlistFeedRows(w.db, await member("sub"), [shared.id, hidden.id], NOW);
    expect(rows.map((r) => r.op)).toEqual(["upsert", "delete"]);
    expect(rows[0]?.op === "upsert" && rows[0].data.entries[0]?.intro).toEqual({ kind: "composed" });
    const forPlayer = await loadSetlistFeedRows(w.db, await member("player"), [shared.id, hidden.id], NOW);
    expect(forPlayer.map((r) => r.op)).toEqual(["upsert", "upsert"]);
  });

  it("never hands one player's marks to another", async () => {
    const mark = await createMark(w.db, w.people.player, w.bandId, markInput(w.charts.harbour, 0, 0), NOW);
    expect(await loadMarkFeedRows(w.db, await member("leader"), [mark.id])).toEqual([]);
    expect((await loadMarkFeedRows(w.db, await member("player"), [mark.id]))[0]).toMatchObject({ op: "upsert", id: mark.id });
  });

  it("applies a leader's set-list push, rejects a player's, and returns a conflict with the server's row", async () => {
    const id = crypto.randomUUID();
    const data = { name: "Late set", entries: [entry(w.charts.harbour, 1, 0, { key: "Eb" })] };
    const base = { mutationId: "m-000001", entity: "setlist", id, op: "upsert" as const, baseRevision: null, data };
    const applied = await pushSetlistMutation(w.db, await member("leader"), base, NOW);
    expect(applied).toMatchObject({ status: "applied", revision: 1 });
    const rejected = await pushSetlistMutation(w.db, await member("player"), { ...base, mutationId: "m-000002", baseRevision: 1 }, NOW);
    expect(rejected).toMatchObject({ status: "rejected" });
    await pushSetlistMutation(w.db, await member("arranger"), { ...base, mutationId: "m-000003", baseRevision: 1, data: { ...data, name: "Later set" } }, NOW);
    const conflict = await pushSetlistMutation(w.db, await member("leader"), { ...base, mutationId: "m-000004", baseRevision: 1 }, NOW);
    expect(conflict.status).toBe("conflict");
    expect(conflict.status === "conflict" && (conflict.current as { name: string }).name).toBe("Later set");
    const invalid = await pushSetlistMutation(w.db, await member("leader"), { ...base, mutationId: "m-000005", baseRevision: 2, data: { name: "" } }, NOW);
    expect(invalid.status === "rejected" && invalid.fields?.[0]?.field).toBe("data.name");
  });

  it("applies a mark push from its owner", async () => {
    const id = crypto.randomUUID();
    const r = await pushMarkMutation(w.db, await member("player"), { mutationId: "m-100001", entity: "annotation", id, op: "upsert", baseRevision: null, data: markInput(w.charts.harbour, 1, 1) }, NOW);
    expect(r).toMatchObject({ status: "applied", revision: 1 });
    const del = await pushMarkMutation(w.db, await member("leader"), { mutationId: "m-100002", entity: "annotation", id, op: "delete", baseRevision: 1 }, NOW);
    expect(del.status).toBe("rejected");
  });
});

describe("marks through a published revision", () => {
  it("follow their bar when the leader publishes a revision through the chart use case", async () => {
    const { createChart, updateChart } = await import("@/lib/server/charts");
    // An invented 8-bar tune; the revision puts a 2-bar intro section in front of A.
    const text = "title: Pier Lamps\nkey: F\ntime: 4/4\n\nA:\n| Fmaj7 | D7 | Gm7 | C7 |\nB:\n| Am7 | D7 | Gm7 C7 | Fmaj7 |\n";
    const input = { title: "Pier Lamps", composer: "", key: "F", meter: "4/4", tempo: null, feel: "", sourceText: text, message: "" };
    const chart = await createChart(w.db, w.people.leader, w.bandId, input);
    const mark = await createMark(w.db, w.people.player, w.bandId, {
      chartId: chart.id,
      data: { anchor: { section: 1, sectionLabel: "B", bar: 1, chords: ["D7"] }, kind: "highlight", chartRevision: 1 },
    }, NOW);
    const revised = text.replace("A:\n", "Lead:\n| C7sus4 | C7 |\nA:\n");
    await updateChart(w.db, w.people.leader, w.bandId, chart.id, { ...input, sourceText: revised, baseRevision: 1 });
    const [after] = await listMyMarks(w.db, w.people.player, w.bandId, chart.id);
    expect(after?.id).toBe(mark.id);
    expect(after?.data.anchor).toMatchObject({ section: 2, sectionLabel: "B", bar: 1 });
    expect(after?.data.chartRevision).toBe(2);
  });
});
