import "server-only";
// Route handlers call these after a publish succeeds: the fan-out runs once the response is sent
// (next/server `after`), so the leader never waits on push services.
import type { Kysely } from "kysely";
import { after } from "next/server";
import type { Database } from "@/db/schema";
import type { Mutation, MutationResult } from "@/lib/offline/protocol";
import type { Actor } from "./access";
import { fanOut, type BandChange } from "./push";

export function announce(db: Kysely<Database>, change: BandChange): void {
  after(async () => {
    try {
      await fanOut(db, change);
    } catch (err) {
      console.warn(`push fan-out for band ${change.bandId} failed: ${(err as Error).message}`);
    }
  });
}

/** After a sync push: one announcement for the charts and one per set list the device's edits changed. */
export function announceApplied(db: Kysely<Database>, actor: Actor | null, bandId: string, mutations: readonly Mutation[], results: readonly MutationResult[]): void {
  const applied = new Set(results.filter((r) => r.status === "applied").map((r) => r.mutationId));
  const done = mutations.filter((m) => applied.has(m.mutationId));
  const charts = done.filter((m) => m.entity === "chart").map((m) => m.id);
  const authorId = actor?.userId ?? null;
  if (charts.length) announce(db, { bandId, authorId, kind: "chart", chartIds: charts });
  for (const m of done.filter((x) => x.entity === "setlist")) announce(db, { bandId, authorId, kind: "setlist", setlistId: m.id });
}
