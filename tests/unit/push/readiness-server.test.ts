// Readiness as the leader's panel gets it: from the devices' reports in the database, for everyone
// who will read the set list (players, and a sub only while a share is live).
import { describe, expect, it } from "vitest";
import { recordDeviceReport, setlistReadiness } from "@/lib/server/readiness";
import { createSetlist } from "@/lib/server/setlists";
import { AppError } from "@/lib/server/errors";
import { entry, makeWorld, NOW } from "../setlist/fixture";

describe("readiness from device reports", () => {
  it("counts each reader's devices, names an old part, and leaves out a sub without a share", async () => {
    const w = await makeWorld();
    const list = await createSetlist(w.db, w.people.leader, w.bandId, { name: "Friday", startsAt: "2026-12-04T20:30:00Z", venue: "", notes: "", entries: [entry(w.charts.harbour, 1, 0)] }, NOW);
    await w.db.insertInto("attachments").values({ id: "part-1", band_id: w.bandId, chart_id: w.charts.harbour, filename: "horn.pdf", path: "x", sha256: "v2", size: 1, type: "application/pdf", pages: 1, uploaded_by: w.people.leader.userId, created_at: NOW.toISOString(), deleted_at: null }).execute();
    const rev = (await w.db.selectFrom("charts").select("revision").where("id", "=", w.charts.harbour).executeTakeFirstOrThrow()).revision;
    const holds = (part: string) => ({ cursor: 9, charts: { [w.charts.harbour]: rev }, setlists: { [list.id]: list.revision }, parts: { "part-1": part } });
    await recordDeviceReport(w.db, w.people.player, w.bandId, { deviceId: "juno-phone-1", label: "Chromium on Android", ...holds("v2") });
    await recordDeviceReport(w.db, w.people.player, w.bandId, { deviceId: "juno-tablet", label: "Safari on iPad", ...holds("v1") });
    await recordDeviceReport(w.db, w.people.leader, w.bandId, { deviceId: "mira-laptop", label: "Firefox on Mac", ...holds("v2") });
    // A second report from the same device replaces the first.
    await recordDeviceReport(w.db, w.people.leader, w.bandId, { deviceId: "mira-laptop", label: "Firefox on Mac", ...holds("v2") });

    const r = await setlistReadiness(w.db, w.people.leader, w.bandId, list.id);
    // leader 1 device, arranger none yet (counts 1), player 2 devices; the sub has no share of it.
    expect({ ready: r.ready, total: r.total }).toEqual({ ready: 2, total: 4 });
    expect(r.members.map((m) => m.name).sort()).toEqual(["Juno Park", "Mira Okafor", "Tomas Vell"]);
    const tablet = r.members.find((m) => m.name === "Juno Park")!.devices.find((d) => d.deviceId === "juno-tablet");
    expect(tablet?.missing).toEqual(["Harbour Lights at Dusk: part horn.pdf (an older copy)"]);
  });

  it("only leaders and arrangers see it", async () => {
    const w = await makeWorld();
    const list = await createSetlist(w.db, w.people.leader, w.bandId, { name: "Friday", startsAt: null, venue: "", notes: "", entries: [] }, NOW);
    await expect(setlistReadiness(w.db, w.people.player, w.bandId, list.id)).rejects.toBeInstanceOf(AppError);
    await expect(setlistReadiness(w.db, w.people.arranger, w.bandId, list.id)).resolves.toMatchObject({ setlistId: list.id });
  });
});
