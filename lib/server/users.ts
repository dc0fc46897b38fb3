import "server-only";
// Accounts: sign-up with a password, and the look-ups sign-in needs. Passwords are kept only as
// bcrypt hashes.
import bcrypt from "bcryptjs";
import type { Kysely } from "kysely";
import type { Insertable } from "kysely";
import type { Database, User, UsersTable } from "@/db/schema";
import { SignUpSchema } from "@/lib/validation/auth";
import { parseInput } from "./input";
import { AppError } from "./errors";
import { weakPasswordReason } from "./password-strength";
import { newId, nowIso } from "./tokens";

type NewUser = Insertable<UsersTable>;

/** bcrypt work factor; tests may lower it through the environment to stay quick. */
function cost(): number {
  const n = Number(process.env.BCRYPT_COST);
  return Number.isInteger(n) && n >= 4 && n <= 15 ? n : 10;
}

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, cost());
}

export function checkPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

export interface PublicUser {
  id: string;
  email: string;
  name: string;
  defaultInstrument: string;
}

export function toPublicUser(u: User): PublicUser {
  return { id: u.id, email: u.email, name: u.name, defaultInstrument: u.default_instrument };
}

export async function findUserByEmail(db: Kysely<Database>, email: string): Promise<User | undefined> {
  return db.selectFrom("users").selectAll().where("email", "=", email.trim().toLowerCase()).executeTakeFirst();
}

export async function findUserById(db: Kysely<Database>, id: string): Promise<User | undefined> {
  return db.selectFrom("users").selectAll().where("id", "=", id).executeTakeFirst();
}

/** What sign-up answers, the same whether the address was new or already had an account. */
export interface SignUpAnswer {
  ok: true;
  message: string;
}

export const SIGN_UP_ANSWER = (email: string): SignUpAnswer => ({
  ok: true,
  message: `Account ready for ${email}. If that address already had an account, nothing was changed and a sign-in link is on its way to it.`,
});

/**
 * Validates the body itself so server actions and route handlers share one path. An address that
 * already has an account gets a mail with a sign-in link instead, and the caller the same answer,
 * so sign-up does not tell strangers which addresses have accounts. The new account's address is
 * not proven yet: the first sign-in link its real owner opens ends the password set here.
 */
export async function signUp(db: Kysely<Database>, input: unknown, onExisting?: (email: string) => Promise<void>): Promise<SignUpAnswer> {
  const { name, email, password, instrument } = parseInput(SignUpSchema, input);
  const weak = weakPasswordReason(password, [email, name]);
  if (weak) throw new AppError("unprocessable", weak, { fields: [{ field: "password", message: weak }] });
  const hash = await hashPassword(password);
  const existing = await findUserByEmail(db, email);
  if (existing) {
    await onExisting?.(email);
    return SIGN_UP_ANSWER(email);
  }
  const user: NewUser = { id: newId(), email, name, password_hash: hash, default_instrument: instrument, created_at: nowIso(), email_verified_at: null };
  const made = await db.insertInto("users").values(user).onConflict((oc) => oc.column("email").doNothing()).executeTakeFirst();
  // Two sign-ups racing for one address: the unique index decides, and the loser is "existing".
  if (Number(made.numInsertedOrUpdatedRows ?? 0) === 0) await onExisting?.(email);
  return SIGN_UP_ANSWER(email);
}

/** Accounts made from a sign-in link have no password until the person sets one. */
export async function findOrCreateLinkUser(db: Kysely<Database>, email: string): Promise<User> {
  const existing = await findUserByEmail(db, email);
  if (existing) return existing;
  const user: NewUser = {
    id: newId(),
    email: email.toLowerCase(),
    name: email.split("@")[0] ?? email,
    password_hash: null,
    default_instrument: "concert",
    created_at: nowIso(),
    email_verified_at: nowIso(),
  };
  await db.insertInto("users").values(user).onConflict((oc) => oc.column("email").doNothing()).execute();
  const stored = await findUserByEmail(db, email);
  if (!stored) throw new Error("the link account was not stored");
  return stored;
}
