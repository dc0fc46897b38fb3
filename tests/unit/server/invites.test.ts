// Invites: single-use links that expire, bound to one band and one address, mailed through SMTP
// (the local mail fake, started here on free ports).
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { startMailFake, type MailFake } from "@/scripts/mail-fake";
import { listMyBands } from "@/lib/server/bands";
import { acceptInvite, changeRole, inviteMember, listMembers, previewInvite, removeMember, updateMember } from "@/lib/server/members";
import { hashToken } from "@/lib/server/tokens";
import { appError, cleanupDbs, freshDb, makeBand, makeUser, type BandCast } from "./helpers";

let db: Kysely<Database>;
let cast: BandCast;
let mail: MailFake;

beforeAll(async () => {
  mail = await startMailFake({ smtpPort: 0, httpPort: 0 });
  process.env.SMTP_HOST = "localhost";
  process.env.SMTP_PORT = String(mail.smtpPort);
  process.env.NEXTAUTH_URL = "http://pedalpoint.test:3000";
  db = await freshDb();
});
// A new band per test: the free plan counts open invites against its member limit.
beforeEach(async () => {
  cast = await makeBand(db);
});
afterAll(async () => {
  await db.destroy();
  await mail.close();
  cleanupDbs();
});

function tokenOf(link: string): string {
  return link.split("/invite/")[1] ?? "";
}

async function invite(email: string, extra: Record<string, unknown> = {}, now?: Date) {
  return inviteMember(db, cast.leader, cast.bandId, { email, role: "player", instrument: "eb", ...extra }, now);
}

describe("sending an invite", () => {
  it("mails a link into the app with a text and an HTML part; only the token's hash is stored", async () => {
    const r = await invite("Alto.Player@Band.test");
    expect(r.mailed).toBe(true);
    expect(r.invite.email).toBe("alto.player@band.test");
    expect(r.link.startsWith("http://pedalpoint.test:3000/invite/")).toBe(true);
    const token = tokenOf(r.link);
    const row = await db.selectFrom("invites").selectAll().where("id", "=", r.invite.id).executeTakeFirstOrThrow();
    expect(row.token_hash).toBe(hashToken(token));
    expect(row.token_hash).not.toContain(token);
    expect(JSON.stringify(row)).not.toContain(token);
    const sent = mail.messages().find((m) => m.to.includes("alto.player@band.test"));
    expect(sent?.subject).toBe("Join Test Band on Pedalpoint");
    expect(sent?.links).toContain(r.link);
    expect(sent?.text).toContain("a player");
    expect(sent?.html).toContain(`href="${r.link}"`);
  });

  it("expires after 7 days", async () => {
    const now = new Date("2026-12-01T12:00:00Z");
    const r = await invite("week@band.test", {}, now);
    expect(r.invite.expiresAt).toBe("2026-12-08T12:00:00.000Z");
  });

  it("refuses someone already in the band", async () => {
    expect((await appError(() => invite(cast.player.email))).status).toBe(409);
  });
});

describe("accepting an invite", () => {
  it("makes the invited person a member with the invited role and instrument, once", async () => {
    const r = await invite("joiner@band.test", { role: "arranger", instrument: "f" });
    const joiner = await makeUser(db, "Joiner", "joiner@band.test");
    expect((await previewInvite(db, tokenOf(r.link)))?.state).toBe("open");
    const res = await acceptInvite(db, joiner, tokenOf(r.link));
    expect(res).toEqual({ bandId: cast.bandId, role: "arranger" });
    const me = (await listMembers(db, cast.leader, cast.bandId)).find((m) => m.userId === joiner.userId);
    expect(me?.role).toBe("arranger");
    expect(me?.instrument).toBe("f");
    const changes = await db.selectFrom("changes").selectAll().where("entity", "=", "membership").where("entity_id", "=", joiner.userId).execute();
    expect(changes).toHaveLength(1);
    // Used once: a second use is refused, and the preview says so.
    const again = await appError(() => acceptInvite(db, joiner, tokenOf(r.link)));
    expect(again.status).toBe(410);
    expect(again.message).toContain("already used");
    expect((await previewInvite(db, tokenOf(r.link)))?.state).toBe("accepted");
  });

  it("an expired invite is refused", async () => {
    const r = await invite("late@band.test", {}, new Date(Date.now() - 8 * 86_400_000));
    const late = await makeUser(db, "Late", "late@band.test");
    const err = await appError(() => acceptInvite(db, late, tokenOf(r.link)));
    expect(err.status).toBe(410);
    expect(err.message).toContain("expired");
    expect((await listMyBands(db, late)).length).toBe(0);
  });

  it("a token used with another band's id is not found", async () => {
    const other = await makeBand(db);
    const r = await invite("wrongband@band.test");
    const person = await makeUser(db, "Wrong", "wrongband@band.test");
    expect((await appError(() => acceptInvite(db, person, tokenOf(r.link), { bandId: other.bandId }))).status).toBe(404);
    // The right band still works.
    expect((await acceptInvite(db, person, tokenOf(r.link), { bandId: cast.bandId })).bandId).toBe(cast.bandId);
  });

  it("a made-up token is not found", async () => {
    const person = await makeUser(db, "Guess");
    expect((await appError(() => acceptInvite(db, person, "made-up-token-0123456789"))).status).toBe(404);
  });

  it("someone signed in with another address cannot use the link", async () => {
    const r = await invite("intended@band.test");
    const other = await makeUser(db, "Other", "other@band.test");
    const err = await appError(() => acceptInvite(db, other, tokenOf(r.link)));
    expect(err.status).toBe(403);
    expect(err.message).toContain("intended@band.test");
  });

  it("a sub's invite carries the end of their access, after which the band is gone for them", async () => {
    const ends = new Date(Date.now() + 3_600_000).toISOString();
    const r = await invite("dep@band.test", { role: "sub", instrument: "bb", accessExpiresAt: ends });
    const dep = await makeUser(db, "Dep", "dep@band.test");
    await acceptInvite(db, dep, tokenOf(r.link));
    const m = await db.selectFrom("memberships").selectAll().where("user_id", "=", dep.userId).executeTakeFirstOrThrow();
    expect(m.expires_at).toBe(ends);
    expect(m.role).toBe("sub");
    await db.updateTable("memberships").set({ expires_at: new Date(Date.now() - 1000).toISOString() }).where("user_id", "=", dep.userId).execute();
    expect((await listMyBands(db, dep)).length).toBe(0);
  });
});

describe("leaders", () => {
  it("a band is never left without a leader", async () => {
    const band = await makeBand(db);
    expect((await appError(() => changeRole(db, band.leader, band.bandId, band.leader.userId, "player"))).status).toBe(409);
    expect((await appError(() => removeMember(db, band.leader, band.bandId, band.leader.userId))).status).toBe(409);
    await changeRole(db, band.leader, band.bandId, band.arranger.userId, "leader");
    // With a second leader, the first may step down.
    const stepped = await changeRole(db, band.leader, band.bandId, band.leader.userId, "player");
    expect(stepped.role).toBe("player");
    expect((await appError(() => removeMember(db, band.arranger, band.bandId, band.arranger.userId))).status).toBe(409);
  });

  it("a leader can give a sub an end time and later remove it", async () => {
    const band = await makeBand(db);
    const until = new Date(Date.now() + 7_200_000).toISOString();
    expect((await updateMember(db, band.leader, band.bandId, band.sub.userId, { expiresAt: until })).expiresAt).toBe(until);
    expect((await updateMember(db, band.leader, band.bandId, band.sub.userId, { expiresAt: null })).expiresAt).toBeNull();
  });

  it("promoting a sub to player ends the time limit on their access", async () => {
    const band = await makeBand(db);
    const promoted = await changeRole(db, band.leader, band.bandId, band.sub.userId, "player");
    expect(promoted.role).toBe("player");
    expect(promoted.expiresAt).toBeNull();
  });

  it("removing a member records a delete change and ends their access", async () => {
    const band = await makeBand(db);
    await removeMember(db, band.leader, band.bandId, band.player.userId);
    expect((await listMyBands(db, band.player)).length).toBe(0);
    const ops = await db.selectFrom("changes").select("op").where("band_id", "=", band.bandId).where("entity_id", "=", band.player.userId).execute();
    expect(ops.map((o) => o.op)).toEqual(["delete"]);
    expect((await appError(() => removeMember(db, band.leader, band.bandId, band.player.userId))).status).toBe(404);
  });
});
