import "server-only";
// The verified-session cache of session.ts, apart so that ending a session can empty it without
// importing next-auth (and so tests that replace session.ts keep it).
import type { Actor } from "./access";

export const verifiedSessions = new Map<string, { actor: Actor; until: number }>();

/** Drops every remembered verification, after a session was ended. */
export function forgetVerifiedSessions(): void {
  verifiedSessions.clear();
}
