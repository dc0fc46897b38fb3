import "server-only";
// Slows down password guessing per account: after a few wrong passwords the account is locked for a
// while, and each further failure doubles the wait (capped). A right password clears the count.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { AppError } from "./errors";

export const FREE_FAILURES = 5;
const FIRST_LOCK_MS = 30_000;
const MAX_LOCK_MS = 15 * 60_000;

export function lockDuration(failures: number): number {
  if (failures < FREE_FAILURES) return 0;
  return Math.min(MAX_LOCK_MS, FIRST_LOCK_MS * 2 ** (failures - FREE_FAILURES));
}

function waitWords(ms: number): string {
  const s = Math.ceil(ms / 1000);
  if (s < 90) return `${s} seconds`;
  return `${Math.ceil(s / 60)} minutes`;
}

/** Throws rate_limited while the account is locked. */
export async function assertNotLocked(db: Kysely<Database>, email: string, now = new Date()): Promise<void> {
  const row = await db.selectFrom("login_attempts").selectAll().where("key", "=", email.toLowerCase()).executeTakeFirst();
  if (!row?.locked_until) return;
  const until = new Date(row.locked_until);
  if (until > now) {
    throw new AppError(
      "rate_limited",
      `Too many wrong passwords for this account. Try again in ${waitWords(until.getTime() - now.getTime())} (after ${until.toISOString().slice(11, 19)} UTC), or ask for a sign-in link.`,
      { retryAt: until.toISOString() },
    );
  }
}

export async function recordFailure(db: Kysely<Database>, email: string, now = new Date()): Promise<number> {
  const key = email.toLowerCase();
  const row = await db.selectFrom("login_attempts").selectAll().where("key", "=", key).executeTakeFirst();
  const failures = (row?.failures ?? 0) + 1;
  const lock = lockDuration(failures);
  const values = {
    failures,
    locked_until: lock ? new Date(now.getTime() + lock).toISOString() : null,
    updated_at: now.toISOString(),
  };
  await db
    .insertInto("login_attempts")
    .values({ key, ...values })
    .onConflict((oc) => oc.column("key").doUpdateSet(values))
    .execute();
  return failures;
}

export async function clearFailures(db: Kysely<Database>, email: string): Promise<void> {
  await db.deleteFrom("login_attempts").where("key", "=", email.toLowerCase()).execute();
}
