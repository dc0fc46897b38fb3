// In-code migration provider: every migration imported by name, in order.
import type { Migration, MigrationProvider } from "kysely";
import * as m001 from "./001_initial";
import * as m002 from "./002_sync_feed_index";
import * as m003 from "./003_band_digests";
import * as m004 from "./004_sync_feed_cover";
import * as m005 from "./005_security";
import * as m006 from "./006_push_readiness_calls";
import * as m007 from "./007_desk_gig_lengths_archive";
import * as m008 from "./008_part_names";

export const migrations: Record<string, Migration> = {
  "001_initial": m001,
  "002_sync_feed_index": m002,
  "003_band_digests": m003,
  "004_sync_feed_cover": m004,
  "005_security": m005,
  "006_push_readiness_calls": m006,
  "007_desk_gig_lengths_archive": m007,
  "008_part_names": m008,
};

export const migrationProvider: MigrationProvider = {
  getMigrations: async () => migrations,
};
