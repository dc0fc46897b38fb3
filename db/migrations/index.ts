// In-code migration provider: every migration imported by name, in order.
import type { Migration, MigrationProvider } from "kysely";
import * as m001 from "./001_initial";

export const migrations: Record<string, Migration> = {
  "001_initial": m001,
};

export const migrationProvider: MigrationProvider = {
  getMigrations: async () => migrations,
};
