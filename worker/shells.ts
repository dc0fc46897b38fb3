// Band pages are client shells: one HTML per route pattern, stored with placeholder ids ("_"),
// serves every address that matches the pattern. The page reads the real ids from the address bar.

/** "/bands/_/charts/_" matches "/bands/abc/charts/xyz" ("_" stands for any one segment). */
export function matchShell(pathname: string, shells: readonly string[]): string | null {
  const parts = pathname.replace(/\/+$/, "").split("/").filter(Boolean);
  let best: string | null = null;
  let bestLiterals = -1;
  for (const shell of shells) {
    const pattern = shell.split("/").filter(Boolean);
    if (pattern.length !== parts.length) continue;
    let literals = 0;
    let ok = true;
    for (let i = 0; i < pattern.length; i++) {
      if (pattern[i] === "_") continue;
      if (pattern[i] !== parts[i]) {
        ok = false;
        break;
      }
      literals++;
    }
    // "/bands/_/charts/new" beats "/bands/_/charts/_" for "/bands/b1/charts/new".
    if (ok && literals > bestLiterals) {
      best = shell;
      bestLiterals = literals;
    }
  }
  return best;
}
