import "server-only";
// Set-list rows from the database into the shape the screens, the routes and the sync feed share.
import type { Kysely, Transaction } from "kysely";
import type { Database, SetlistEntryRow, SetlistRow } from "@/db/schema";
import { IntroChoiceSchema } from "@/lib/chart/model";
import { EndingChoiceSchema, SetMinutesSchema } from "@/lib/setlist";
import type { WireSetlist, WireSetlistEntry } from "@/lib/wire";

type Db = Kysely<Database> | Transaction<Database>;

export function parseJson<T>(text: string | null, schema: { safeParse(v: unknown): { success: true; data: T } | { success: false } }): T | null {
  if (!text) return null;
  try {
    const r = schema.safeParse(JSON.parse(text));
    return r.success ? r.data : null;
  } catch {
    return null;
  }
}

function toEntry(r: SetlistEntryRow): WireSetlistEntry {
  return {
    id: r.id,
    setlistId: r.setlist_id,
    chartId: r.chart_id,
    setNumber: r.set_number,
    position: r.position,
    key: r.key,
    tempo: r.tempo,
    intro: parseJson(r.intro_json, IntroChoiceSchema),
    ending: parseJson(r.ending, EndingChoiceSchema),
    soloOrder: r.solo_order,
    choruses: r.choruses,
    straightIn: r.straight_in === 1,
    notes: r.notes,
  };
}

export function toSetlist(row: SetlistRow, entries: SetlistEntryRow[]): WireSetlist {
  return {
    id: row.id,
    bandId: row.band_id,
    name: row.name,
    startsAt: row.starts_at,
    venue: row.venue,
    notes: row.notes,
    setMinutes: parseJson(row.set_minutes_json, SetMinutesSchema) ?? [],
    revision: row.revision,
    updatedBy: row.updated_by,
    updatedAt: row.updated_at,
    entries: entries
      .map(toEntry)
      .sort((a, b) => a.setNumber - b.setNumber || a.position - b.position),
  };
}

/** Set lists with their entries, tombstones included (the caller decides what a deleted row means). */
export async function loadSetlists(db: Db, bandId: string, ids: readonly string[]): Promise<Map<string, { row: SetlistRow; setlist: WireSetlist }>> {
  const out = new Map<string, { row: SetlistRow; setlist: WireSetlist }>();
  if (ids.length === 0) return out;
  const rows = await db.selectFrom("setlists").selectAll().where("band_id", "=", bandId).where("id", "in", [...ids]).execute();
  if (rows.length === 0) return out;
  const entries = await db.selectFrom("setlist_entries").selectAll().where("setlist_id", "in", rows.map((r) => r.id)).execute();
  for (const row of rows) out.set(row.id, { row, setlist: toSetlist(row, entries.filter((e) => e.setlist_id === row.id)) });
  return out;
}

