import "server-only";
// The two ways in: e-mail + password (rate limited per account) and a single-use link by e-mail.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { sendMail, signInLinkMail } from "@/lib/mail";
import { AppError } from "./errors";
import { assertNotLocked, clearFailures, recordFailure } from "./login-limit";
import { appUrl, hashToken, newToken } from "./tokens";
import { checkPassword, findOrCreateLinkUser, findUserByEmail, toPublicUser, type PublicUser } from "./users";

export const LINK_MINUTES = 15;
const MAX_OPEN_LINKS = 5;

// Compared against when the account does not exist, so a wrong e-mail costs as long as a wrong password.
const DUMMY_HASH = "$2b$10$FIgTIwpIXcMfIZ03jOxeg.GrNo.mvEoKG9pY55qTruMYKTn45FY9m";

const WRONG = "That e-mail and password do not match an account.";

export async function signInWithPassword(db: Kysely<Database>, email: string, password: string, now = new Date()): Promise<PublicUser> {
  const key = email.trim().toLowerCase();
  if (!key || !password) throw new AppError("unauthenticated", WRONG);
  await assertNotLocked(db, key, now);
  const user = await findUserByEmail(db, key);
  const ok = await checkPassword(password, user?.password_hash ?? DUMMY_HASH);
  if (!user || !user.password_hash || !ok) {
    const failures = await recordFailure(db, key, now);
    // The failure that starts a lock says so at once.
    await assertNotLocked(db, key, now);
    throw new AppError("unauthenticated", WRONG, { failures });
  }
  await clearFailures(db, key);
  return toPublicUser(user);
}

/** Only same-site paths are allowed after sign-in, so a link cannot bounce someone elsewhere. */
export function safeCallback(callbackUrl: string | undefined | null): string {
  if (!callbackUrl || !callbackUrl.startsWith("/") || callbackUrl.startsWith("//")) return "/";
  return callbackUrl;
}

/** Always looks the same to the caller, whether or not the address has an account. */
export async function requestSignInLink(
  db: Kysely<Database>,
  email: string,
  callbackUrl?: string,
  now = new Date(),
): Promise<{ link: string }> {
  const recent = await db
    .selectFrom("sign_in_tokens")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("email", "=", email.toLowerCase())
    .where("used_at", "is", null)
    .where("expires_at", ">", now.toISOString())
    .executeTakeFirstOrThrow();
  // A handful of open links is plenty; more would let anyone flood an inbox.
  if (Number(recent.n) >= MAX_OPEN_LINKS) {
    throw new AppError("rate_limited", `Several sign-in links were sent to that address in the last ${LINK_MINUTES} minutes. Use one of those, or wait a little.`);
  }
  const token = newToken();
  const expires = new Date(now.getTime() + LINK_MINUTES * 60_000);
  await db
    .insertInto("sign_in_tokens")
    .values({ token_hash: hashToken(token), email: email.toLowerCase(), expires_at: expires.toISOString(), used_at: null })
    .execute();
  const params = new URLSearchParams({ token });
  const cb = safeCallback(callbackUrl);
  if (cb !== "/") params.set("callbackUrl", cb);
  const link = appUrl(`/signin/link?${params.toString()}`);
  try {
    await sendMail(signInLinkMail({ to: email, link, minutes: LINK_MINUTES }));
  } catch (err) {
    console.error("sign-in link mail failed", err);
    throw new AppError("unavailable", "The sign-in e-mail could not be sent just now. Try again in a minute, or sign in with your password.");
  }
  return { link };
}

export async function redeemSignInLink(db: Kysely<Database>, token: string, now = new Date()): Promise<PublicUser> {
  const hash = hashToken(token);
  const row = await db.selectFrom("sign_in_tokens").selectAll().where("token_hash", "=", hash).executeTakeFirst();
  if (!row) throw new AppError("not_found", "That sign-in link is not valid. Ask for a new one.");
  if (row.used_at) throw new AppError("gone", "That sign-in link was already used. Ask for a new one.");
  if (row.expires_at <= now.toISOString()) throw new AppError("gone", "That sign-in link has expired. Ask for a new one.");
  // Claim the token in one statement so two tabs cannot both use it.
  const claimed = await db
    .updateTable("sign_in_tokens")
    .set({ used_at: now.toISOString() })
    .where("token_hash", "=", hash)
    .where("used_at", "is", null)
    .executeTakeFirst();
  if (Number(claimed.numUpdatedRows) !== 1) throw new AppError("gone", "That sign-in link was already used. Ask for a new one.");
  const user = await findOrCreateLinkUser(db, row.email);
  await clearFailures(db, row.email);
  return toPublicUser(user);
}
