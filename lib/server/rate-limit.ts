import "server-only";
// The one place rate limits are made. Every limit keeps its counters in the app's database
// (rate-limiter-flexible's SQL store, table `rate_limits` from migration 005), so every app process
// sees the same counts. To move the counters to another database, change only `store()` below.
import type { Kysely } from "kysely";
import { RateLimiterPostgres, RateLimiterRes, RateLimiterSQLite, type RateLimiterAbstract } from "rate-limiter-flexible";
import { postgresPool, sqliteHandle } from "@/db/connection";
import type { Database } from "@/db/schema";
import { AppError } from "./errors";

export interface LimitSpec {
  /** Prefix of the counter keys; one name per limit. */
  name: string;
  /** Tries allowed per window. */
  points: number;
  /** Window length in seconds. */
  seconds: number;
  /** What the person was doing, for the message: "sign-in attempts", "sign-ups" … */
  what: string;
}

/**
 * RATE_LIMIT_FACTOR multiplies every limit's tries (default 1). The browser test suite signs the demo
 * accounts in hundreds of times from one address and sets it high; the limits themselves are tested
 * at their real sizes in the unit tests.
 */
function allowed(spec: LimitSpec): number {
  const factor = Number(process.env.RATE_LIMIT_FACTOR ?? 1);
  return Number.isFinite(factor) && factor >= 1 ? Math.floor(spec.points * factor) : spec.points;
}

const made = new WeakMap<Kysely<Database>, Map<string, RateLimiterAbstract>>();

function store(db: Kysely<Database>, spec: LimitSpec): RateLimiterAbstract {
  const common = { tableName: "rate_limits", tableCreated: true, keyPrefix: spec.name, points: allowed(spec), duration: spec.seconds };
  const pool = postgresPool(db);
  // PostgreSQL: the same table through the app's pg pool (the library's Postgres store).
  if (pool) return new RateLimiterPostgres({ ...common, storeClient: pool, storeType: "pool" });
  const sqlite = sqliteHandle(db);
  if (!sqlite) throw new Error("rate limits need the app's SQLite handle or PostgreSQL pool");
  return new RateLimiterSQLite({ ...common, storeClient: sqlite, storeType: "better-sqlite3" });
}

function limiterFor(db: Kysely<Database>, spec: LimitSpec): RateLimiterAbstract {
  let byName = made.get(db);
  if (!byName) made.set(db, (byName = new Map()));
  let l = byName.get(spec.name);
  if (!l) byName.set(spec.name, (l = store(db, spec)));
  return l;
}

export function waitWords(ms: number): string {
  const s = Math.max(1, Math.ceil(ms / 1000));
  if (s < 90) return `${s} second${s === 1 ? "" : "s"}`;
  return `${Math.ceil(s / 60)} minutes`;
}

/** Counts one try for `key`; past the limit, throws 429 with the wait in seconds (Retry-After). */
export async function consume(db: Kysely<Database>, spec: LimitSpec, key: string, cost = 1): Promise<void> {
  try {
    await limiterFor(db, spec).consume(key, cost);
  } catch (res) {
    if (!(res instanceof RateLimiterRes)) throw res;
    const retryAfter = Math.max(1, Math.ceil(res.msBeforeNext / 1000));
    throw new AppError("rate_limited", `Too many ${spec.what} from here. Wait ${waitWords(res.msBeforeNext)} and try again.`, { retryAfter });
  }
}

/** Whether `key` is already past the limit, without counting a try. */
export async function isLimited(db: Kysely<Database>, spec: LimitSpec, key: string): Promise<boolean> {
  const res = await limiterFor(db, spec).get(key);
  return res !== null && res.consumedPoints >= allowed(spec);
}

/** Forgets the counts of `key` (a right password clears its failures). */
export async function forget(db: Kysely<Database>, spec: LimitSpec, key: string): Promise<void> {
  await limiterFor(db, spec).delete(key);
}

// The limits, in one table so their sizes can be read side by side.
export const LIMITS = {
  /** Password sign-ins from one client, right or wrong, whatever the address. */
  signInPerClient: { name: "signin-client", points: 30, seconds: 10 * 60, what: "sign-in attempts" },
  /** Wrong passwords for one address from every client together; past it only link sign-in works. */
  signInFailuresPerAddress: { name: "signin-address", points: 50, seconds: 24 * 60 * 60, what: "wrong passwords for this account" },
  /** New accounts from one client. */
  signUpPerClient: { name: "signup-client", points: 5, seconds: 60 * 60, what: "sign-ups" },
  /** Sign-in link requests from one client. */
  linkPerClient: { name: "link-client", points: 10, seconds: 60 * 60, what: "sign-in link requests" },
  /** Other anonymous routes that cost work (share and invite look-ups, webhooks). */
  anonymousPerClient: { name: "anon-client", points: 120, seconds: 60, what: "requests" },
} as const satisfies Record<string, LimitSpec>;
