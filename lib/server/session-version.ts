import "server-only";
// Ending sessions. A session token carries the user's session version at sign-in and its own id:
// bumping the version ends every session of the user (password change, "sign out everywhere", a
// removed membership); recording the id ends one (signing out). Both are checked on every request
// that verifies a session, so a copied cookie stops working as soon as its session is ended.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { forgetVerifiedSessions } from "./session-cache";

export interface SessionClaims {
  userId: string;
  version: number;
  sid: string | null;
}

export async function sessionVersion(db: Kysely<Database>, userId: string): Promise<number> {
  const row = await db.selectFrom("users").select("session_version").where("id", "=", userId).executeTakeFirst();
  return row?.session_version ?? 0;
}

/** Ends every session of the user, on every device. */
export async function endAllSessions(db: Kysely<Database>, userId: string): Promise<void> {
  await db
    .updateTable("users")
    .set((eb) => ({ session_version: eb("session_version", "+", 1) }))
    .where("id", "=", userId)
    .execute();
  forgetVerifiedSessions();
}

/** Ends the one session a token names, until the token would have expired anyway. */
export async function endSession(db: Kysely<Database>, claims: SessionClaims, endsAt: Date): Promise<void> {
  if (!claims.sid) {
    // A token from before session ids: only ending them all reaches it.
    await endAllSessions(db, claims.userId);
    return;
  }
  const now = new Date().toISOString();
  await db.deleteFrom("ended_sessions").where("ends_at", "<", now).execute();
  await db
    .insertInto("ended_sessions")
    .values({ sid: claims.sid, user_id: claims.userId, ends_at: endsAt.toISOString() })
    .onConflict((oc) => oc.column("sid").doNothing())
    .execute();
  forgetVerifiedSessions();
}

/**
 * Whether a session verified earlier is still live, in one indexed query: its user exists, the
 * user's session version is the token's, and its id was not ended (by any process).
 */
export async function isSessionStillLive(db: Kysely<Database>, claims: SessionClaims): Promise<boolean> {
  const row = await db
    .selectFrom("users")
    .select((eb) => [
      "session_version",
      eb.exists(eb.selectFrom("ended_sessions").select("sid").where("sid", "=", claims.sid ?? "")).as("ended"),
    ])
    .where("id", "=", claims.userId)
    .executeTakeFirst();
  return row !== undefined && row.session_version === claims.version && !row.ended;
}

/** Whether a session is still live: its user exists, its version is current, it was not ended. */
export async function isSessionLive(db: Kysely<Database>, claims: SessionClaims, currentVersion: number): Promise<boolean> {
  if (claims.version !== currentVersion) return false;
  if (!claims.sid) return true;
  const ended = await db.selectFrom("ended_sessions").select("sid").where("sid", "=", claims.sid).executeTakeFirst();
  return !ended;
}
