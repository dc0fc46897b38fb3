// Accounts and signing in: hashes never the password, wrong passwords slow down, links work once.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { FREE_FAILURES, lockDuration } from "@/lib/server/login-limit";
import { redeemSignInLink, requestSignInLink, safeCallback, signInWithPassword } from "@/lib/server/sign-in";
import { hashToken } from "@/lib/server/tokens";
import { signUp } from "@/lib/server/users";
import { appError, cleanupDbs, freshDb } from "./helpers";

const sent: { to: string; text: string }[] = [];
vi.mock("@/lib/mail", async (importOriginal) => ({
  ...(await importOriginal<typeof import("@/lib/mail")>()),
  sendMail: vi.fn(async (m: { to: string; text: string }) => {
    sent.push(m);
  }),
}));

process.env.BCRYPT_COST = "4";
process.env.NEXTAUTH_URL = "http://localhost:3000";

let db: Kysely<Database>;
beforeAll(async () => {
  db = await freshDb();
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

const PASSWORD = "a long demo password";

describe("sign-up", () => {
  it("stores a bcrypt hash, never the password", async () => {
    await signUp(db, { name: "Hash Check", email: "Hash.Check@Band.test", password: PASSWORD });
    const row = await db.selectFrom("users").selectAll().where("email", "=", "hash.check@band.test").executeTakeFirstOrThrow();
    expect(row.password_hash).toMatch(/^\$2[aby]\$\d\d\$/);
    const dump = JSON.stringify(await db.selectFrom("users").selectAll().execute());
    expect(dump).not.toContain(PASSWORD);
  });

  // Issue 10 item 13: answering 409 told strangers which addresses have accounts.
  it("a second sign-up with the same address (any case) answers as for a new one, mails the owner and changes nothing", async () => {
    const first = await signUp(db, { name: "First", email: "twice@band.test", password: PASSWORD });
    const before = await db.selectFrom("users").selectAll().where("email", "=", "twice@band.test").executeTakeFirstOrThrow();
    const mailed: string[] = [];
    const second = await signUp(db, { name: "Second", email: "TWICE@band.test", password: "another long password" }, async (e) => {
      mailed.push(e);
    });
    expect(second).toEqual(first);
    expect(mailed).toEqual(["twice@band.test"]);
    expect(await db.selectFrom("users").selectAll().where("email", "=", "twice@band.test").execute()).toEqual([before]);
  });
});

describe("password sign-in", () => {
  it("accepts the right password in any e-mail case and refuses a wrong one", async () => {
    await signUp(db, { name: "Right", email: "right@band.test", password: PASSWORD });
    expect((await signInWithPassword(db, "RIGHT@band.test", PASSWORD)).name).toBe("Right");
    expect((await appError(() => signInWithPassword(db, "right@band.test", "wrong password"))).status).toBe(401);
    expect((await appError(() => signInWithPassword(db, "nobody@band.test", PASSWORD))).status).toBe(401);
  });

  it(`locks the account after ${FREE_FAILURES} wrong passwords, says when to try again, and doubles the wait`, async () => {
    await signUp(db, { name: "Guessed", email: "guessed@band.test", password: PASSWORD });
    const t0 = new Date("2026-12-01T22:00:00Z");
    for (let i = 1; i < FREE_FAILURES; i++) {
      expect((await appError(() => signInWithPassword(db, "guessed@band.test", `guess ${i}`, t0))).status).toBe(401);
    }
    const locking = await appError(() => signInWithPassword(db, "guessed@band.test", "guess 5", t0));
    expect(locking.status).toBe(429);
    expect(locking.message).toMatch(/Try again in 30 seconds/);
    // Locked: even the right password is refused until the time has passed.
    const locked = await appError(() => signInWithPassword(db, "guessed@band.test", PASSWORD, new Date(t0.getTime() + 10_000)));
    expect(locked.status).toBe(429);
    expect(locked.details?.retryAt).toBe("2026-12-01T22:00:30.000Z");
    // After the wait, one more wrong guess locks for twice as long.
    const t1 = new Date(t0.getTime() + 31_000);
    const next = await appError(() => signInWithPassword(db, "guessed@band.test", "guess 6", t1));
    expect(next.status).toBe(429);
    expect(next.details?.retryAt).toBe(new Date(t1.getTime() + 60_000).toISOString());
    // The right password after the lock clears the count.
    const t2 = new Date(t1.getTime() + 61_000);
    expect((await signInWithPassword(db, "guessed@band.test", PASSWORD, t2)).email).toBe("guessed@band.test");
    expect(await db.selectFrom("login_attempts").selectAll().where("key", "=", "guessed@band.test").executeTakeFirst()).toBeUndefined();
  });

  it("unknown addresses are limited too, so guessing cannot tell which exist", async () => {
    const t = new Date("2026-12-01T23:00:00Z");
    for (let i = 0; i < FREE_FAILURES - 1; i++) await appError(() => signInWithPassword(db, "ghost@band.test", "x", t));
    expect((await appError(() => signInWithPassword(db, "ghost@band.test", "x", t))).status).toBe(429);
  });

  it("the wait grows and is capped at 15 minutes", () => {
    expect(lockDuration(FREE_FAILURES - 1)).toBe(0);
    expect(lockDuration(FREE_FAILURES)).toBe(30_000);
    expect(lockDuration(FREE_FAILURES + 1)).toBe(60_000);
    expect(lockDuration(FREE_FAILURES + 20)).toBe(15 * 60_000);
  });
});

describe("sign-in links", () => {
  function tokenFrom(link: string): string {
    return new URL(link).searchParams.get("token") ?? "";
  }

  it("mails a single-use link that expires after 15 minutes; only its hash is stored", async () => {
    const t = new Date("2026-12-01T20:00:00Z");
    const { link } = await requestSignInLink(db, "linker@band.test", "/bands", t);
    expect(link.startsWith("http://localhost:3000/signin/link?token=")).toBe(true);
    expect(sent.at(-1)?.text).toContain(link);
    const token = tokenFrom(link);
    const row = await db.selectFrom("sign_in_tokens").selectAll().where("token_hash", "=", hashToken(token)).executeTakeFirstOrThrow();
    expect(row.expires_at).toBe("2026-12-01T20:15:00.000Z");
    // First use makes the account (no password) and signs in; a second use is refused.
    const u = await redeemSignInLink(db, token, new Date(t.getTime() + 60_000));
    expect(u.email).toBe("linker@band.test");
    const user = await db.selectFrom("users").selectAll().where("id", "=", u.id).executeTakeFirstOrThrow();
    expect(user.password_hash).toBeNull();
    expect((await appError(() => redeemSignInLink(db, token, new Date(t.getTime() + 120_000)))).status).toBe(410);
  });

  it("an expired link is refused", async () => {
    const t = new Date("2026-12-01T20:00:00Z");
    const { link } = await requestSignInLink(db, "slow@band.test", undefined, t);
    const err = await appError(() => redeemSignInLink(db, tokenFrom(link), new Date(t.getTime() + 16 * 60_000)));
    expect(err.status).toBe(410);
    expect(err.message).toContain("expired");
  });

  it("an account without a password cannot be entered by password", async () => {
    const { link } = await requestSignInLink(db, "nopass@band.test");
    await redeemSignInLink(db, tokenFrom(link));
    expect((await appError(() => signInWithPassword(db, "nopass@band.test", "anything at all"))).status).toBe(401);
  });

  it("too many open links for one address are refused", async () => {
    for (let i = 0; i < 5; i++) await requestSignInLink(db, "flood@band.test");
    expect((await appError(() => requestSignInLink(db, "flood@band.test"))).status).toBe(429);
  });

  it("only same-site paths are kept as the place to land", () => {
    expect(safeCallback("/bands/abc")).toBe("/bands/abc");
    expect(safeCallback("https://elsewhere.test/")).toBe("/");
    expect(safeCallback("//elsewhere.test/")).toBe("/");
  });
});
