// Readiness from device reports: ready only when a device holds the current revision of the set
// list, every chart on it and every part.
import { describe, expect, it } from "vitest";
import { computeReadiness, type DeviceReport, type Needed } from "@/lib/server/readiness-model";

const need: Needed = {
  setlist: { id: "s1", name: "Friday at the Lanternfish Room", revision: 3 },
  charts: [
    { id: "c1", title: "Tidewater Waltz", revision: 5 },
    { id: "c2", title: "Copper Kettle", revision: 2 },
  ],
  parts: [{ id: "p1", chartTitle: "Copper Kettle", filename: "horn.pdf", sha256: "new" }],
};

const device = (id: string, over: Partial<DeviceReport["holdings"]> = {}, at = "2026-12-02T18:00:00Z"): DeviceReport => ({
  deviceId: id,
  label: `Phone ${id}`,
  reportedAt: at,
  cursor: 40,
  holdings: { setlists: { s1: 3 }, charts: { c1: 5, c2: 2 }, parts: { p1: "new" }, ...over },
});

describe("readiness", () => {
  it("counts a device ready only with every current revision, and names what an old part is", () => {
    const r = computeReadiness(need, [
      { userId: "u1", name: "Odile", role: "leader", devices: [device("a")] },
      { userId: "u2", name: "Priya", role: "player", devices: [device("b"), device("c", { parts: { p1: "old" } })] },
    ]);
    expect(r.ready).toBe(2);
    expect(r.total).toBe(3);
    const priya = r.members.find((m) => m.name === "Priya")!;
    expect(priya.ready).toBe(false);
    expect(priya.devices.find((d) => d.deviceId === "c")?.missing).toEqual(["Copper Kettle: part horn.pdf (an older copy)"]);
  });

  it("names an old chart revision and a stale set list", () => {
    const r = computeReadiness(need, [{ userId: "u", name: "Gus", role: "player", devices: [device("a", { charts: { c1: 4, c2: 2 }, setlists: { s1: 2 } })] }]);
    expect(r.members[0]!.devices[0]!.missing).toEqual(["the latest set list (has revision 2 of 3)", "Tidewater Waltz (has revision 4 of 5)"]);
    expect(r.ready).toBe(0);
  });

  it("a member with no synced device counts as one device not ready", () => {
    const r = computeReadiness(need, [{ userId: "u", name: "Jonah", role: "sub", devices: [] }]);
    expect(r).toMatchObject({ ready: 0, total: 1 });
    expect(r.members[0]!.devices[0]!.deviceId).toBeNull();
  });

  it("lists members behind first", () => {
    const r = computeReadiness(need, [
      { userId: "u1", name: "Able", role: "player", devices: [device("a")] },
      { userId: "u2", name: "Zed", role: "player", devices: [device("b", { charts: {} })] },
    ]);
    expect(r.members.map((m) => m.name)).toEqual(["Zed", "Able"]);
  });
});
