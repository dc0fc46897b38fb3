// Sync test helpers on top of the backend's test database helpers: set lists and shares inserted
// directly (with their feed rows), and a pull that parses the spliced JSON text.
import { randomUUID } from "node:crypto";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import type { PullResponse } from "@/lib/offline/protocol";
import type { Actor } from "@/lib/server/access";
import { recordChange } from "@/lib/server/changes";
import { pullChanges } from "@/lib/server/sync";

export async function pull(db: Kysely<Database>, actor: Actor | null, bandId: string, q: { since?: number; limit?: number; scope?: string; count?: "0" | "1" } = {}): Promise<PullResponse> {
  const text = await pullChanges(db, actor, bandId, { since: q.since ?? 0, limit: q.limit ?? 100, scope: q.scope, count: q.count });
  return JSON.parse(text) as PullResponse;
}

/** Pulls every page from `since`, as a device would. */
export async function pullAll(db: Kysely<Database>, actor: Actor, bandId: string, since = 0, scope?: string, limit = 100) {
  const pages: PullResponse[] = [];
  let cursor = since;
  let s = scope;
  for (;;) {
    const p = await pull(db, actor, bandId, { since: cursor, limit, scope: s });
    pages.push(p);
    cursor = p.seq;
    s = p.scope;
    if (!p.more) break;
  }
  return { pages, seq: cursor, scope: s, changes: pages.flatMap((p) => p.changes) };
}

export async function makeSetlist(db: Kysely<Database>, bandId: string, by: Actor, chartIds: string[], name = "Friday at the Boathouse"): Promise<string> {
  const id = randomUUID();
  const now = new Date().toISOString();
  await db.insertInto("setlists").values({ id, band_id: bandId, name, starts_at: null, venue: "The Boathouse", notes: "", revision: 1, updated_by: by.userId, updated_at: now, deleted_at: null }).execute();
  let position = 0;
  for (const chartId of chartIds) {
    await db
      .insertInto("setlist_entries")
      .values({ id: randomUUID(), setlist_id: id, band_id: bandId, set_number: 1, position: position++, chart_id: chartId, key: null, intro_json: null, ending: null, tempo: null, solo_order: "", notes: "" })
      .execute();
  }
  await recordChange(db, { bandId, entity: "setlist", entityId: id, op: "upsert" });
  return id;
}

export async function shareWith(db: Kysely<Database>, bandId: string, setlistId: string, sub: Actor, by: Actor, expiresAt: Date): Promise<string> {
  const id = randomUUID();
  await db
    .insertInto("shares")
    .values({
      id, band_id: bandId, setlist_id: setlistId, user_id: sub.userId, email: sub.email, token_hash: randomUUID(),
      expires_at: expiresAt.toISOString(), created_by: by.userId, created_at: new Date().toISOString(), revoked_at: null,
    })
    .execute();
  await recordChange(db, { bandId, entity: "share", entityId: id, op: "upsert", userId: sub.userId });
  return id;
}

export function ids(changes: PullResponse["changes"], entity: string, op: "upsert" | "delete" = "upsert"): string[] {
  return changes.filter((c) => c.entity === entity && c.op === op).map((c) => c.id).sort();
}
