import "server-only";
// Every write that a device must learn about appends one row to `changes`, the delta-sync feed.
import type { Kysely, Transaction } from "kysely";
import { appendChange } from "@/db/feed";
import type { Database } from "@/db/schema";

export type SyncEntity =
  | "band"
  | "membership"
  | "chart"
  | "setlist"
  | "annotation"
  | "attachment"
  | "share";

export interface ChangeInput {
  bandId: string;
  entity: SyncEntity;
  entityId: string;
  op: "upsert" | "delete";
  /** Set for private rows (personal marks): only this user's devices receive the change. */
  userId?: string | null;
}

// Through db/feed so that, on PostgreSQL, seq order within a band is commit order.
export async function recordChange(db: Kysely<Database> | Transaction<Database>, c: ChangeInput): Promise<number> {
  return appendChange(db, {
    band_id: c.bandId,
    entity: c.entity,
    entity_id: c.entityId,
    op: c.op,
    user_id: c.userId ?? null,
    created_at: new Date().toISOString(),
  });
}
