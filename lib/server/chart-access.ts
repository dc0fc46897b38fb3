import "server-only";
// The one rule for who may read a chart (its text, history, MusicXML and parts): members who read
// the book see every chart; a sub sees the charts of set lists shared with them — the same ones
// sync delivers to their device. Any other chart is refused: 403 for the chart itself (the sub knows
// the band), 404 where the caller asks for a part by id (its existence is not confirmed).
import type { Kysely } from "kysely";
import type { Database, Membership } from "@/db/schema";
import { requireMember, type Actor } from "./access";
import { AppError } from "./errors";
import { sharedChartIds } from "./shares";
import { can } from "@/lib/band/roles";

export async function requireChartReader(
  db: Kysely<Database>,
  actor: Actor | null,
  bandId: string,
  chartId: string,
  refuse: "forbidden" | "not_found" = "forbidden",
): Promise<Membership> {
  const m = await requireMember(db, actor, bandId, "readSetlists");
  if (!can(m.role, "readBook") && !(await sharedChartIds(db, bandId, m.user_id)).includes(chartId)) {
    throw refuse === "forbidden"
      ? new AppError("forbidden", "This chart is not in a set list shared with you.")
      : new AppError("not_found", "That chart was not found.");
  }
  return m;
}
