// The "charts updated" notice, against a real SQLite file and the real SMTP path into the mail fake.
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { startMailFake, type CapturedMail, type MailFake } from "@/scripts/mail-fake";
import { createChart, deleteChart, updateChart } from "@/lib/server/charts";
import { sendChartsUpdatedDigest } from "@/lib/server/digest";
import { createSetlist } from "@/lib/server/setlists";
import { acceptShare, createShare } from "@/lib/server/shares";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, outcome, type BandCast } from "./helpers";

const BASE = "http://pedalpoint.test:3000";
let db: Kysely<Database>;
let cast: BandCast;
let mail: MailFake;

beforeAll(async () => {
  mail = await startMailFake({ smtpPort: 3950, httpPort: 3951 });
  process.env.SMTP_HOST = "localhost";
  process.env.SMTP_PORT = String(mail.smtpPort);
  process.env.NEXTAUTH_URL = `${BASE}/`;
  db = await freshDb();
});
beforeEach(async () => {
  cast = await makeBand(db);
  await fetch(`http://localhost:${mail.httpPort}/messages`, { method: "DELETE" });
});
afterAll(async () => {
  await db.destroy();
  await mail.close();
  cleanupDbs();
});

const notices = (): CapturedMail[] => mail.messages().filter((m) => m.subject.startsWith("Test Band:"));
const noticeFor = (email: string) => notices().find((m) => m.to.includes(email.toLowerCase()));

async function publish(title: string, message = "") {
  return createChart(db, cast.arranger, cast.bandId, chartInput({ title, message }));
}

describe("who may send the notice", () => {
  it("lets the leader and arrangers send; players and subs get 403, outsiders and expired subs 404", async () => {
    await publish("Lantern Walk");
    const send = (who: keyof BandCast) => () => sendChartsUpdatedDigest(db, cast[who] as BandCast["leader"], cast.bandId);
    expect(await outcome(send("player"))).toBe(403);
    expect(await outcome(send("sub"))).toBe(403);
    expect(await outcome(send("outsider"))).toBe(404);
    expect(await outcome(send("expiredSub"))).toBe(404);
    expect(await outcome(() => sendChartsUpdatedDigest(db, null, cast.bandId))).toBe(401);
    expect((await appError(send("player"))).message).toMatch(/leader or arranger/);
    // A refused call sends nothing and leaves the cursor alone.
    expect(notices()).toHaveLength(0);
    expect(await db.selectFrom("band_digests").selectAll().where("band_id", "=", cast.bandId).execute()).toEqual([]);
    expect(await outcome(send("leader"))).toBe("ok");
    expect(await outcome(send("arranger"))).toBe("ok"); // allowed; nothing new by now
  });
});

describe("what the notice lists", () => {
  it("mails every current member one message with both parts and a link to each chart", async () => {
    const chart = await publish("Lantern Walk", "First version for Friday");
    const r = await sendChartsUpdatedDigest(db, cast.leader, cast.bandId);
    // leader, arranger, player; the sub has no shared set list, the expired sub is no longer a member
    expect(r).toEqual({ sent: 3, charts: 1 });
    expect(notices().flatMap((m) => m.to).sort()).toEqual([cast.leader.email, cast.arranger.email, cast.player.email].map((e) => e.toLowerCase()).sort());
    const m = noticeFor(cast.player.email);
    const link = `${BASE}/bands/${cast.bandId}/charts/${chart.id}`;
    expect(m?.subject).toBe("Test Band: 1 chart updated");
    expect(m?.text).toContain(`${chart.title} — revision 1, by Arranger`);
    expect(m?.text).toContain("“First version for Friday”");
    expect(m?.text).toContain(link);
    expect(m?.links).toContain(link);
    expect(m?.html).toContain(`href="${link}"`);
    expect(m?.html).toContain("First version for Friday");
    expect(m?.html).toContain("<!doctype html>");
    expect(noticeFor(cast.expiredSub.email)).toBeUndefined();
  });

  it("lists exactly the charts changed since the last notice, with every revision's message", async () => {
    const old = await publish("Lantern Walk");
    const quiet = await publish("Quiet Harbour");
    expect(await sendChartsUpdatedDigest(db, cast.leader, cast.bandId)).toEqual({ sent: 3, charts: 2 });
    await fetch(`http://localhost:${mail.httpPort}/messages`, { method: "DELETE" });

    const v2 = await updateChart(db, cast.leader, cast.bandId, old.id, { ...chartInput({ title: old.title }), baseRevision: 1, message: "Bar 7 is Dm7 now" });
    await updateChart(db, cast.arranger, cast.bandId, old.id, { ...chartInput({ title: old.title }), baseRevision: v2.revision, message: "Two-bar tag at the end" });
    const fresh = await publish("Copper Kettle", "New tune");
    await deleteChart(db, cast.leader, cast.bandId, quiet.id);

    expect(await sendChartsUpdatedDigest(db, cast.arranger, cast.bandId)).toEqual({ sent: 3, charts: 3 });
    const text = noticeFor(cast.leader.email)?.text ?? "";
    expect(text).toContain(`${old.title} — revision 3, by Leader, Arranger`);
    expect(text).toContain("“Bar 7 is Dm7 now”");
    expect(text).toContain("“Two-bar tag at the end”");
    expect(text).toContain(`${BASE}/bands/${cast.bandId}/charts/${fresh.id}`);
    expect(text).toContain(`${quiet.title} — removed from the book (revision 2)`);
    expect(text).not.toContain(`/charts/${quiet.id}`); // a removed chart has no page to open
    expect(text).not.toContain("Created the chart"); // that revision was in the first notice
    expect(noticeFor(cast.leader.email)?.html).toContain("Arranger sent this notice");
  });

  it("sends nothing when nothing was published since the last notice", async () => {
    expect(await sendChartsUpdatedDigest(db, cast.leader, cast.bandId)).toEqual({ sent: 0, charts: 0 });
    await publish("Lantern Walk");
    expect((await sendChartsUpdatedDigest(db, cast.leader, cast.bandId)).charts).toBe(1);
    const after = notices().length;
    expect(await sendChartsUpdatedDigest(db, cast.leader, cast.bandId)).toEqual({ sent: 0, charts: 0 });
    expect(await sendChartsUpdatedDigest(db, cast.arranger, cast.bandId)).toEqual({ sent: 0, charts: 0 });
    expect(notices()).toHaveLength(after);
  });

  it("tells a sub only about charts on a set list shared with them, and ignores the share's private feed rows", async () => {
    const NOW = new Date();
    const onList = await publish("Lantern Walk");
    const offList = await publish("Quiet Harbour");
    const list = await createSetlist(db, cast.leader, cast.bandId, {
      name: "Friday at the boathouse",
      entries: [{ id: crypto.randomUUID(), chartId: onList.id, setNumber: 1, position: 0 }],
    });
    expect(await sendChartsUpdatedDigest(db, cast.leader, cast.bandId)).toEqual({ sent: 3, charts: 2 });

    const { link } = await createShare(db, cast.leader, cast.bandId, list.id, { email: cast.sub.email, expiresAt: new Date(NOW.getTime() + 3_600_000).toISOString() });
    await acceptShare(db, cast.sub, link.split("/share/")[1] ?? "");
    // Accepting pushes the set list's charts onto the sub's private feed; that is not a publication.
    expect(await sendChartsUpdatedDigest(db, cast.leader, cast.bandId)).toEqual({ sent: 0, charts: 0 });

    await updateChart(db, cast.leader, cast.bandId, onList.id, { ...chartInput({ title: onList.title }), baseRevision: 1, message: "Ending changed" });
    await updateChart(db, cast.leader, cast.bandId, offList.id, { ...chartInput({ title: offList.title }), baseRevision: 1, message: "New bridge" });
    expect(await sendChartsUpdatedDigest(db, cast.leader, cast.bandId)).toEqual({ sent: 4, charts: 2 });
    const subMail = noticeFor(cast.sub.email);
    expect(subMail?.subject).toBe("Test Band: 1 chart updated");
    expect(subMail?.text).toContain(`/charts/${onList.id}`);
    expect(subMail?.text).not.toContain(offList.title);
    expect(noticeFor(cast.player.email)?.subject).toBe("Test Band: 2 charts updated");
  });
});

describe("when sending goes wrong or overlaps", () => {
  it("keeps the charts for the next try when the mail relay refuses every message", async () => {
    await publish("Lantern Walk");
    const slot = globalThis as unknown as { pedalpointMail?: unknown };
    const real = slot.pedalpointMail;
    const quiet = vi.spyOn(console, "error").mockImplementation(() => undefined);
    slot.pedalpointMail = { sendMail: async () => Promise.reject(new Error("relay down")) };
    const err = await appError(() => sendChartsUpdatedDigest(db, cast.leader, cast.bandId)).finally(() => {
      slot.pedalpointMail = real;
      quiet.mockRestore();
    });
    expect(err.status).toBe(503);
    expect(await sendChartsUpdatedDigest(db, cast.leader, cast.bandId)).toEqual({ sent: 3, charts: 1 });
  });

  it("sends one notice when two are asked for at once", async () => {
    await publish("Lantern Walk");
    const both = await Promise.all([sendChartsUpdatedDigest(db, cast.leader, cast.bandId), sendChartsUpdatedDigest(db, cast.arranger, cast.bandId)]);
    expect(both.map((r) => r.charts).sort()).toEqual([0, 1]);
    expect(notices()).toHaveLength(3);
  });
});
