import "server-only";
// The "charts updated" notice: a leader or arranger mails the band every chart published since the
// last notice. The band's place in the change feed (band_digests.last_seq) is what "since" means, so
// two notices never list the same publication and nothing published in between is skipped.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { can, type Role } from "@/lib/band/roles";
import { sendMail } from "@/lib/mail";
import { chartsUpdatedMail, type DigestChart } from "@/lib/mail/templates";
import { requireMember, type Actor, signedIn } from "./access";
import { AppError } from "./errors";
import { sharedChartIds } from "./shares";
import { appUrl, nowIso } from "./tokens";

export interface DigestResult {
  /** Messages handed to the mail relay (one per member). */
  sent: number;
  /** Charts in the notice. */
  charts: number;
}

interface DigestEntry extends DigestChart {
  chartId: string;
}

interface Recipient {
  userId: string;
  email: string;
  role: Role;
}

interface Snapshot {
  bandName: string;
  lastSeq: number;
  maxSeq: number;
  entries: DigestEntry[];
  recipients: Recipient[];
}

async function takeSnapshot(db: Kysely<Database>, bandId: string, now: Date): Promise<Snapshot> {
  // One read transaction: SQLite lets no write in between, so the revisions match the feed rows.
  return db.transaction().execute(async (trx) => {
    const band = await trx.selectFrom("bands").select("name").where("id", "=", bandId).executeTakeFirstOrThrow();
    const last = await trx.selectFrom("band_digests").select("last_seq").where("band_id", "=", bandId).executeTakeFirst();
    const lastSeq = last?.last_seq ?? 0;
    // Rows with a user_id are private feed entries (a chart pushed to one sub's device by a share),
    // not publications; every publication writes exactly one public row with its revision.
    const feed = await trx
      .selectFrom("changes")
      .select(["entity_id", (eb) => eb.fn.countAll<number>().as("n"), (eb) => eb.fn.max("seq").as("top")])
      .where("band_id", "=", bandId)
      .where("entity", "=", "chart")
      .where("user_id", "is", null)
      .where("seq", ">", lastSeq)
      .groupBy("entity_id")
      .execute();
    const maxSeq = feed.reduce((m, r) => Math.max(m, Number(r.top)), lastSeq);
    const entries: DigestEntry[] = [];
    for (const f of feed) {
      const chart = await trx
        .selectFrom("charts")
        .select(["id", "title", "revision", "deleted_at"])
        .where("id", "=", f.entity_id)
        .where("band_id", "=", bandId)
        .executeTakeFirst();
      if (!chart) continue;
      const revisions = await trx
        .selectFrom("chart_revisions as r")
        .leftJoin("users as u", "u.id", "r.author_id")
        .select(["r.revision", "r.message", "u.name as author"])
        .where("r.chart_id", "=", chart.id)
        .orderBy("r.revision", "desc")
        .limit(Number(f.n))
        .execute();
      revisions.reverse();
      const path = chart.deleted_at ? `/bands/${bandId}` : `/bands/${bandId}/charts/${chart.id}`;
      entries.push({
        chartId: chart.id,
        title: chart.title,
        revision: chart.revision,
        authors: [...new Set(revisions.map((r) => r.author ?? "someone"))],
        messages: revisions.map((r) => r.message),
        removed: chart.deleted_at !== null,
        link: appUrl(path),
      });
    }
    entries.sort((a, b) => a.title.localeCompare(b.title));
    const recipients = await trx
      .selectFrom("memberships as m")
      .innerJoin("users as u", "u.id", "m.user_id")
      .select(["m.user_id as userId", "u.email", "m.role"])
      .where("m.band_id", "=", bandId)
      .where((eb) => eb.or([eb("m.expires_at", "is", null), eb("m.expires_at", ">", now.toISOString())]))
      .execute();
    return { bandName: band.name, lastSeq, maxSeq, entries, recipients };
  });
}

/**
 * Moves the band's cursor from `from` to `to` only if it still stands at `from`: of two notices
 * sent at once, one wins and the other reports nothing to send.
 */
async function moveCursor(db: Kysely<Database>, bandId: string, from: number, to: number, by: string, now: Date): Promise<boolean> {
  if (from === 0) {
    const r = await db
      .insertInto("band_digests")
      .values({ band_id: bandId, last_seq: to, sent_at: nowIso(now), sent_by: by })
      .onConflict((oc) => oc.column("band_id").doUpdateSet({ last_seq: to, sent_at: nowIso(now), sent_by: by }).where("band_digests.last_seq", "=", 0))
      .executeTakeFirst();
    return Number(r.numInsertedOrUpdatedRows ?? 0) > 0;
  }
  const r = await db
    .updateTable("band_digests")
    .set({ last_seq: to, sent_at: nowIso(now), sent_by: by })
    .where("band_id", "=", bandId)
    .where("last_seq", "=", from)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) > 0;
}

export async function sendChartsUpdatedDigest(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  now = new Date(),
): Promise<DigestResult> {
  await requireMember(db, actor, bandId, "editCharts");
  const me = signedIn(actor);
  const snap = await takeSnapshot(db, bandId, now);
  if (snap.entries.length === 0) return { sent: 0, charts: 0 };
  if (!(await moveCursor(db, bandId, snap.lastSeq, snap.maxSeq, me.userId, now))) return { sent: 0, charts: 0 };

  const libraryLink = appUrl(`/bands/${bandId}`);
  let sent = 0;
  let failed = 0;
  for (const r of snap.recipients) {
    // A sub reads only the charts on set lists shared with them, so their notice names only those;
    // the rest of the book is none of their business.
    let charts = snap.entries;
    if (!can(r.role, "readBook")) {
      const mine = new Set(await sharedChartIds(db, bandId, r.userId, now));
      charts = charts.filter((c) => mine.has(c.chartId));
    }
    if (charts.length === 0) continue;
    try {
      await sendMail(chartsUpdatedMail({ to: r.email, bandName: snap.bandName, senderName: me.name, charts, libraryLink }));
      sent += 1;
    } catch (err) {
      console.error("charts-updated notice failed for one member", err);
      failed += 1;
    }
  }
  if (sent === 0 && failed > 0) {
    // Nobody got it: put the cursor back so the next try lists the same charts.
    await moveCursor(db, bandId, snap.maxSeq, snap.lastSeq, me.userId, now);
    throw new AppError("unavailable", "The mail server did not accept the notice. Nothing was sent; try again in a moment.");
  }
  return { sent, charts: snap.entries.length };
}
