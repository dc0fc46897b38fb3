// Upload temp files (`*.part`, written before a part is renamed into place) left by a server that
// was killed mid-upload. Nothing else can finish them, so they are removed when the app starts.
// No "server-only" marker: scripts/start.ts runs this before Next starts.
import fs from "node:fs";
import path from "node:path";

/** Removes every `*.part` file under `dir`; returns how many. A missing folder is fine. */
export function removeStaleUploads(dir: string): number {
  let removed = 0;
  let entries: fs.Dirent[];
  try {
    entries = fs.readdirSync(dir, { withFileTypes: true });
  } catch {
    return 0;
  }
  for (const e of entries) {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) removed += removeStaleUploads(full);
    else if (e.isFile() && e.name.endsWith(".part")) {
      fs.rmSync(full, { force: true });
      removed++;
    }
  }
  return removed;
}
