// Issue 10 item 12 across processes: each app process remembers verified sessions for a while, so
// a session ended by ANOTHER process (which cannot empty this one's memory) must still be refused
// on this process's very next request. "Another process" is a fresh copy of the modules
// (vi.resetModules), with its own verified-session memory, on the same SQLite file.
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import type { Kysely } from "kysely";
import type { Session } from "next-auth";
import { encode, decode, type JWT } from "next-auth/jwt";
import type { Database } from "@/db/schema";
import { cleanupDbs, freshDb, makeUser } from "../server/helpers";

const SECRET = vi.hoisted(() => (process.env.NEXTAUTH_SECRET = "a test secret that is long enough for the demo"));

let db: Kysely<Database>;
vi.mock("@/db", () => ({ ready: async () => db, getDb: () => db }));

const jar = vi.hoisted(() => ({ cookies: [] as { name: string; value: string }[] }));
vi.mock("next/headers", () => ({ cookies: async () => ({ getAll: () => jar.cookies }) }));

// next-auth's full verification as the app runs it: decrypt the cookie, run the session callback.
const fullVerifications = vi.hoisted(() => ({ count: 0 }));
vi.mock("next-auth", async (importOriginal) => ({
  ...(await importOriginal<typeof import("next-auth")>()),
  getServerSession: async (options: import("next-auth").NextAuthOptions) => {
    fullVerifications.count++;
    const token = (await decode({ token: jar.cookies.map((c) => c.value).join(""), secret: SECRET })) as JWT | null;
    if (!token) return null;
    return options.callbacks!.session!({ session: { expires: "" } as Session, token } as never);
  },
}));

const { authOptions } = await import("@/lib/server/auth-options");
const { getActor } = await import("@/lib/server/session");

async function signIn(user: { userId: string; email: string; name: string }): Promise<JWT> {
  const token = (await authOptions.callbacks!.jwt!({ token: { sub: user.userId }, user: { id: user.userId, email: user.email, name: user.name, sessionVersion: 0 }, account: null, trigger: "signIn" } as never)) as JWT;
  jar.cookies = [{ name: "next-auth.session-token", value: await encode({ token, secret: SECRET }) }];
  return token;
}

/** The session-ending functions of a second app process: fresh modules, their own memory. */
async function otherProcess(): Promise<typeof import("@/lib/server/session-version")> {
  vi.resetModules();
  return import("@/lib/server/session-version");
}

beforeAll(async () => {
  db = await freshDb();
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});
beforeEach(() => {
  fullVerifications.count = 0;
});

describe("a session ended in another process", () => {
  it("is remembered after one full verification, then refused at once after 'sign out everywhere' elsewhere", async () => {
    const user = await makeUser(db, "Ode");
    await signIn(user);
    expect((await getActor())?.userId).toBe(user.userId);
    expect((await getActor())?.userId).toBe(user.userId);
    expect(fullVerifications.count).toBe(1); // the second request was served from memory

    await (await otherProcess()).endAllSessions(db, user.userId);
    expect(await getActor()).toBeNull();
  });

  it("a single sign-out in another process ends that cookie here too, and only that one", async () => {
    const user = await makeUser(db, "Pim");
    const first = await signIn(user);
    const firstCookies = jar.cookies;
    expect((await getActor())?.userId).toBe(user.userId);
    await signIn(user);
    const secondCookies = jar.cookies;
    expect((await getActor())?.userId).toBe(user.userId);

    const other = await otherProcess();
    await other.endSession(db, { userId: user.userId, version: 0, sid: first.sid as string }, new Date(Date.now() + 60_000));
    jar.cookies = firstCookies;
    expect(await getActor()).toBeNull();
    jar.cookies = secondCookies;
    expect((await getActor())?.userId).toBe(user.userId);
  });

  it("a deleted account is refused at once although its session is remembered", async () => {
    const user = await makeUser(db, "Quill");
    await signIn(user);
    expect((await getActor())?.userId).toBe(user.userId);
    await db.deleteFrom("users").where("id", "=", user.userId).execute();
    expect(await getActor()).toBeNull();
  });
});
