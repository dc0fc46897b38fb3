// Issue 10 items 2, 6, 12 and 13 (sign-up answers, weak passwords): what a stranger with a script
// tries against accounts, against a real SQLite file. Each refusal is checked with what was stored.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { Kysely } from "kysely";
import type { JWT } from "next-auth/jwt";
import type { Session } from "next-auth";
import type { Database } from "@/db/schema";
import { authOptions } from "@/lib/server/auth-options";
import { removeMember } from "@/lib/server/members";
import { LIMITS } from "@/lib/server/rate-limit";
import { endAllSessions, endSession } from "@/lib/server/session-version";
import { redeemSignInLink, requestSignInLink, signInWithPassword } from "@/lib/server/sign-in";
import { signUp } from "@/lib/server/users";
import { appError, cleanupDbs, freshDb, makeBand } from "../server/helpers";

const sent: { to: string; text: string }[] = [];
vi.mock("@/lib/mail", async (importOriginal) => ({
  ...(await importOriginal<typeof import("@/lib/mail")>()),
  sendMail: vi.fn(async (m: { to: string; text: string }) => void sent.push(m)),
}));

process.env.BCRYPT_COST = "4";
process.env.NEXTAUTH_URL = "http://localhost:3000";

// The session callbacks read the app's database handle: point it at this test's file.
let db: Kysely<Database>;
vi.mock("@/db", () => ({ ready: async () => db, getDb: () => db }));

beforeAll(async () => {
  db = await freshDb();
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

const PASSWORD = "a long demo password";
const tokenOf = (link: string) => new URL(link).searchParams.get("token") ?? "";

async function tokenFor(user: { id: string; email: string; name: string; sessionVersion: number }): Promise<JWT> {
  const jwt = authOptions.callbacks!.jwt!;
  return (await jwt({ token: { sub: user.id }, user: { ...user }, account: null, trigger: "signIn" } as never)) as JWT;
}

async function sessionUserId(token: JWT): Promise<string> {
  const session = (await authOptions.callbacks!.session!({ session: { expires: "" } as Session, token } as never)) as Session;
  return session.user.id;
}

describe("guessing passwords from one client", () => {
  it("60 wrong passwords for 60 addresses: past the per-client limit they are 429 with a wait, not 'wrong password'", async () => {
    const statuses: number[] = [];
    let retryAfter: unknown;
    for (let i = 0; i < 60; i++) {
      const err = await appError(() => signInWithPassword(db, `guess${i}@band.test`, "wrong guess", new Date(), "203.0.113.9"));
      statuses.push(err.status);
      if (err.status === 429) retryAfter ??= err.details?.retryAfter;
    }
    expect(statuses.filter((s) => s === 401)).toHaveLength(LIMITS.signInPerClient.points);
    expect(statuses.slice(LIMITS.signInPerClient.points).every((s) => s === 429)).toBe(true);
    expect(retryAfter).toEqual(expect.any(Number));
  });

  it("the lock-out cannot be turned against the owner: a stranger's wrong guesses lock only the stranger's client", async () => {
    await signUp(db, { name: "Victim", email: "victim@band.test", password: PASSWORD });
    for (let i = 0; i < 8; i++) await appError(() => signInWithPassword(db, "victim@band.test", `guess ${i}`, new Date(), "198.51.100.66"));
    expect((await appError(() => signInWithPassword(db, "victim@band.test", PASSWORD, new Date(), "198.51.100.66"))).status).toBe(429);
    // The owner, from their own client, gets in at once.
    expect((await signInWithPassword(db, "victim@band.test", PASSWORD, new Date(), "192.0.2.10")).email).toBe("victim@band.test");
  });

  it("when guesses from many clients pause an account's password, the owner still gets in with a sign-in link", async () => {
    await signUp(db, { name: "Popular", email: "popular@band.test", password: PASSWORD });
    for (let i = 0; i < LIMITS.signInFailuresPerAddress.points; i++) {
      await appError(() => signInWithPassword(db, "popular@band.test", "nope nope", new Date(), `10.9.${Math.floor(i / 200)}.${i % 200}`));
    }
    const paused = await appError(() => signInWithPassword(db, "popular@band.test", PASSWORD, new Date(), "192.0.2.20"));
    expect(paused.status).toBe(429);
    expect(paused.message).toMatch(/sign-in link/);
    const { link } = await requestSignInLink(db, "popular@band.test");
    expect((await redeemSignInLink(db, tokenOf(link))).email).toBe("popular@band.test");
  });
});

describe("sign-up as a stranger sees it", () => {
  it("refuses 'password', '12345678' and the address itself as passwords, storing no account", async () => {
    for (const password of ["password", "12345678", "weakling@band.test"]) {
      const err = await appError(() => signUp(db, { name: "Weakling", email: "weakling@band.test", password }));
      expect(err.status).toBe(422);
      expect(err.details?.fields?.[0]?.field).toBe("password");
    }
    expect(await db.selectFrom("users").selectAll().where("email", "=", "weakling@band.test").execute()).toEqual([]);
  });
});

describe("squatting an address", () => {
  it("a squatter's password account ends when the real owner signs in by link: password gone, squatter's session dead", async () => {
    await signUp(db, { name: "Squatter", email: "owner@band.test", password: "squatter knows this one" });
    const squatter = await signInWithPassword(db, "owner@band.test", "squatter knows this one");
    const squatterToken = await tokenFor(squatter);
    expect(await sessionUserId(squatterToken)).toBe(squatter.id);
    // The real owner is invited and signs in by the link mailed to them.
    const { link } = await requestSignInLink(db, "owner@band.test");
    const owner = await redeemSignInLink(db, tokenOf(link));
    expect(owner.id).toBe(squatter.id);
    expect((await appError(() => signInWithPassword(db, "owner@band.test", "squatter knows this one"))).status).toBe(401);
    expect(await sessionUserId(squatterToken)).toBe("");
    const row = await db.selectFrom("users").selectAll().where("email", "=", "owner@band.test").executeTakeFirstOrThrow();
    expect(row.password_hash).toBeNull();
    expect(row.email_verified_at).not.toBeNull();
    // The owner's own new session is live.
    expect(await sessionUserId(await tokenFor(owner))).toBe(owner.id);
  });
});

describe("sessions end when they should", () => {
  async function signedIn(email: string) {
    await signUp(db, { name: "Sessions", email, password: PASSWORD });
    const user = await signInWithPassword(db, email, PASSWORD);
    return { user, token: await tokenFor(user) };
  }

  it("a copied cookie stops working once its session signs out; the same person's other session goes on", async () => {
    const { user, token } = await signedIn("copied@band.test");
    const other = await tokenFor(user);
    await authOptions.events!.signOut!({ token, session: {} as never });
    expect(await sessionUserId(token)).toBe("");
    expect(await sessionUserId(other)).toBe(user.id);
  });

  it("'sign out everywhere' (and a password change, which calls the same) ends every session", async () => {
    const { user, token } = await signedIn("everywhere@band.test");
    const second = await tokenFor(user);
    await endAllSessions(db, user.id);
    expect(await sessionUserId(token)).toBe("");
    expect(await sessionUserId(second)).toBe("");
    // Signing in again gives a live session.
    expect(await sessionUserId(await tokenFor(await signInWithPassword(db, "everywhere@band.test", PASSWORD)))).toBe(user.id);
  });

  it("a removed member's sessions end", async () => {
    const cast = await makeBand(db);
    const { user, token } = await signedIn(`removed-${randomUUID().slice(0, 6)}@band.test`);
    await db.insertInto("memberships").values({ band_id: cast.bandId, user_id: user.id, role: "player", instrument: "concert", expires_at: null, created_at: new Date().toISOString() }).execute();
    await removeMember(db, cast.leader, cast.bandId, user.id);
    expect(await sessionUserId(token)).toBe("");
  });

  it("an ended session id is kept only until the token would have expired", async () => {
    await endSession(db, { userId: "u1", version: 0, sid: "old-sid" }, new Date(Date.now() - 1000));
    await endSession(db, { userId: "u1", version: 0, sid: "new-sid" }, new Date(Date.now() + 60_000));
    expect((await db.selectFrom("ended_sessions").select("sid").where("user_id", "=", "u1").execute()).map((r) => r.sid)).toEqual(["new-sid"]);
  });
});
