import "server-only";
// Recently built pull pages, kept in this process's memory so that the devices of a band pulling the
// same page (everyone's first sync, or every stand after the leader's correction) cost one build.
//
// Safe to lose: a miss rebuilds the page from the database, which stays the only source of truth.
// Decides nothing about access: the caller's membership and role are checked live on every request
// before a lookup, and the key holds the user, role, instrument, expiry and scope, so a page only ever
// goes back to the caller it was built for. Never stale across processes: the key holds the band's
// cursor (its newest change seq, read from the database on every request), so any change by any
// process makes a new key. Details that change without a feed entry (a member renaming their account)
// reach a cached page within TTL_MS. Bounded: at most MAX_ENTRIES pages and MAX_BYTES of text, least
// recently used first out.
const TTL_MS = 30_000;
const MAX_ENTRIES = 64;
const MAX_BYTES = 24 * 1024 * 1024;

const utf8 = new TextEncoder();

/** A pull page's JSON text, with its UTF-8 bytes made once, when first asked for. */
export class PullBody {
  private raw: Uint8Array | null = null;
  constructor(readonly text: string) {}

  bytes(): Uint8Array {
    return (this.raw ??= utf8.encode(this.text));
  }
}

interface Entry {
  body: PullBody;
  until: number;
}

const entries = new Map<string, Entry>();
const handles = new WeakMap<object, number>();
let nextHandle = 1;

/** A number for each database handle, so pages built from two databases (tests, a copy) never mix. */
export function handleTag(db: object): number {
  let n = handles.get(db);
  if (n === undefined) handles.set(db, (n = nextHandle++));
  return n;
}
let bytes = 0;

function drop(key: string): void {
  const e = entries.get(key);
  if (!e) return;
  entries.delete(key);
  bytes -= e.body.text.length;
}

export function cachedPull(key: string, now = Date.now()): PullBody | null {
  const e = entries.get(key);
  if (!e) return null;
  drop(key);
  if (e.until <= now) return null;
  // Re-inserted: a Map keeps insertion order, so the first key is the least recently used.
  entries.set(key, e);
  bytes += e.body.text.length;
  return e.body;
}

export function keepPull(key: string, body: PullBody, now = Date.now()): void {
  if (body.text.length > MAX_BYTES / 4) return;
  drop(key);
  entries.set(key, { body, until: now + TTL_MS });
  bytes += body.text.length;
  for (const k of entries.keys()) {
    if (entries.size <= MAX_ENTRIES && bytes <= MAX_BYTES) break;
    drop(k);
  }
}

/** For tests: how much is kept. */
export function pullCacheSize(): { entries: number; bytes: number } {
  return { entries: entries.size, bytes };
}
