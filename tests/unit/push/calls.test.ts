// Calling the tune: who may call, and the event stream a follower reads (resumed by Last-Event-ID).
import { describe, expect, it } from "vitest";
import { callTune, gigCallState, setCaller } from "@/lib/server/calls";
import { callStream } from "@/lib/server/calls-stream";
import { createSetlist } from "@/lib/server/setlists";
import { AppError } from "@/lib/server/errors";
import { entry, makeWorld, NOW, type World } from "../setlist/fixture";

async function gig(w: World) {
  return createSetlist(w.db, w.people.leader, w.bandId, { name: "Friday at the Lanternfish Room", startsAt: "2026-12-04T20:30:00Z", venue: "Lanternfish Room", notes: "", entries: [entry(w.charts.harbour, 1, 0), entry(w.charts.kettle, 1, 1)] }, NOW);
}

/** Reads server-sent events from a stream until `n` call events arrived. */
async function readCalls(res: Response, n: number): Promise<{ id: string; chartId: string }[]> {
  const reader = res.body!.getReader();
  const out: { id: string; chartId: string }[] = [];
  let buf = "";
  while (out.length < n) {
    const { value, done } = await reader.read();
    if (done) break;
    buf += new TextDecoder().decode(value);
    let at: number;
    while ((at = buf.indexOf("\n\n")) >= 0) {
      const block = buf.slice(0, at);
      buf = buf.slice(at + 2);
      const id = /^id: (.+)$/m.exec(block)?.[1];
      const data = /^data: (.+)$/m.exec(block)?.[1];
      if (id && data) out.push({ id, chartId: (JSON.parse(data) as { chartId: string }).chartId });
    }
  }
  await reader.cancel();
  return out;
}

describe("calling the tune", () => {
  it("lets the leader call, refuses a player until the leader hands calling over", async () => {
    const w = await makeWorld();
    const list = await gig(w);
    const [first, second] = list.entries;
    const call = await callTune(w.db, w.people.leader, w.bandId, list.id, first!.id);
    expect(call.chartId).toBe(w.charts.harbour);
    await expect(callTune(w.db, w.people.player, w.bandId, list.id, second!.id)).rejects.toBeInstanceOf(AppError);
    await setCaller(w.db, w.people.leader, w.bandId, list.id, w.people.player.userId);
    await callTune(w.db, w.people.player, w.bandId, list.id, second!.id);
    const state = await gigCallState(w.db, w.people.player, w.bandId, list.id);
    expect(state).toMatchObject({ canCall: true, callerId: w.people.player.userId, latest: { chartId: w.charts.kettle } });
    await expect(setCaller(w.db, w.people.player, w.bandId, list.id, null)).rejects.toBeInstanceOf(AppError);
  });

  it("a new follower gets the latest call, a reconnecting one what it missed after Last-Event-ID", async () => {
    const w = await makeWorld();
    const list = await gig(w);
    const [first, second] = list.entries;
    const a = await callTune(w.db, w.people.leader, w.bandId, list.id, first!.id);
    const b = await callTune(w.db, w.people.leader, w.bandId, list.id, second!.id);
    const fresh = await readCalls(callStream(w.db, list.id, null, new AbortController().signal), 1);
    expect(fresh).toEqual([{ id: String(b.seq), chartId: w.charts.kettle }]);
    const resumed = await readCalls(callStream(w.db, list.id, a.seq - 1, new AbortController().signal), 2);
    expect(resumed.map((e) => e.id)).toEqual([String(a.seq), String(b.seq)]);
  });

  it("streams a call made while the follower is connected", async () => {
    const w = await makeWorld();
    const list = await gig(w);
    const stop = new AbortController();
    const res = callStream(w.db, list.id, 0, stop.signal);
    const got = readCalls(res, 1);
    await new Promise((r) => setTimeout(r, 150));
    await callTune(w.db, w.people.leader, w.bandId, list.id, list.entries[1]!.id);
    expect((await got)[0]?.chartId).toBe(w.charts.kettle);
    stop.abort();
  });
});
