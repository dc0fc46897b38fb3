import "server-only";
// The two ways in: e-mail + password and a single-use link by e-mail.
// Password guessing meets three limits: tries per client (any address), wrong passwords per address
// *and client* (the lock-out, so a stranger locks only themselves out, never the owner), and wrong
// passwords per address from everywhere together; past that last one the password is refused for a
// day but a sign-in link still works, so no stranger can keep the owner out.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { accountExistsMail, sendMail, signInLinkMail, type MailMessage } from "@/lib/mail";
import { safeCallbackPath } from "@/lib/validation/callback";
import { AppError } from "./errors";
import { assertNotLocked, clearFailures, recordFailure } from "./login-limit";
import { appUrl, hashToken, newToken } from "./tokens";
import { consume, forget, isLimited, LIMITS } from "./rate-limit";
import { endAllSessions } from "./session-version";
import { checkPassword, findOrCreateLinkUser, findUserByEmail, hashPassword, toPublicUser, type PublicUser } from "./users";

export type SignedIn = PublicUser & { sessionVersion: number };

export const LINK_MINUTES = 15;
const MAX_OPEN_LINKS = 5;

// Compared against when the account does not exist, so a wrong e-mail costs as long as a wrong
// password: made once at the same work factor as real hashes.
let dummyHash: Promise<string> | null = null;
const DUMMY_HASH = () => (dummyHash ??= hashPassword("no account has this password"));

const WRONG = "That e-mail and password do not match an account.";

/**
 * `client` is who is asking (see request-guard's clientKey); without one (tests, scripts) the
 * lock-out is kept per address alone.
 */
export async function signInWithPassword(db: Kysely<Database>, email: string, password: string, now = new Date(), client?: string): Promise<SignedIn> {
  const address = email.trim().toLowerCase().slice(0, 254);
  if (client) await consume(db, LIMITS.signInPerClient, client);
  if (!address || !password) throw new AppError("unauthenticated", WRONG);
  const lockKey = client ? `${address}|${client}` : address;
  await assertNotLocked(db, lockKey, now);
  if (await isLimited(db, LIMITS.signInFailuresPerAddress, address)) {
    throw new AppError("rate_limited", "Too many wrong passwords were tried for this account today, so its password is paused. Ask for a sign-in link instead: it still works.", { retryAfter: LIMITS.signInFailuresPerAddress.seconds });
  }
  const user = await findUserByEmail(db, address);
  const ok = await checkPassword(password, user?.password_hash ?? (await DUMMY_HASH()));
  if (!user || !user.password_hash || !ok) {
    const failures = await recordFailure(db, lockKey, now);
    await consume(db, LIMITS.signInFailuresPerAddress, address).catch(() => undefined);
    // The failure that starts a lock says so at once.
    await assertNotLocked(db, lockKey, now);
    throw new AppError("unauthenticated", WRONG, { failures });
  }
  await clearFailures(db, lockKey);
  return { ...toPublicUser(user), sessionVersion: user.session_version };
}

/** Only same-site paths are allowed after sign-in, so a link cannot bounce someone elsewhere. */
export function safeCallback(callbackUrl: string | undefined | null): string {
  return safeCallbackPath(callbackUrl, "/");
}

/** Always looks the same to the caller, whether or not the address has an account. */
export async function requestSignInLink(
  db: Kysely<Database>,
  email: string,
  callbackUrl?: string,
  now = new Date(),
  mail: (p: { to: string; link: string; minutes: number }) => MailMessage = signInLinkMail,
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
    await sendMail(mail({ to: email, link, minutes: LINK_MINUTES }));
  } catch (err) {
    console.error("sign-in link mail failed", err);
    throw new AppError("unavailable", "The sign-in e-mail could not be sent just now. Try again in a minute, or sign in with your password.");
  }
  return { link };
}

/** Sign-up with an address that has an account: its owner gets a sign-in link, nobody else learns. */
export async function mailAccountExists(db: Kysely<Database>, email: string): Promise<void> {
  try {
    await requestSignInLink(db, email, undefined, new Date(), accountExistsMail);
  } catch (err) {
    // Too many open links, or the mail is down: the caller still gets the same answer.
    if (!(err instanceof AppError)) throw err;
  }
}

export async function redeemSignInLink(db: Kysely<Database>, token: string, now = new Date()): Promise<SignedIn> {
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
  let user = await findOrCreateLinkUser(db, row.email);
  if (!user.email_verified_at) user = await proveAddress(db, user.id, Boolean(user.password_hash), now);
  await clearFailures(db, row.email);
  await forget(db, LIMITS.signInFailuresPerAddress, row.email);
  return { ...toPublicUser(user), sessionVersion: user.session_version };
}

/**
 * The address's owner opened a link: the address is proven. A password set before that was set by
 * whoever signed up, perhaps not the owner, so it is dropped and every session it opened is ended;
 * the owner can set a password of their own.
 */
async function proveAddress(db: Kysely<Database>, userId: string, hadPassword: boolean, now: Date) {
  await db
    .updateTable("users")
    .set({ email_verified_at: now.toISOString(), ...(hadPassword ? { password_hash: null } : {}) })
    .where("id", "=", userId)
    .execute();
  if (hadPassword) await endAllSessions(db, userId);
  return db.selectFrom("users").selectAll().where("id", "=", userId).executeTakeFirstOrThrow();
}
