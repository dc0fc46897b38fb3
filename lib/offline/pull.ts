// Pulling a band's feed page by page until the server says there is no more.
import { applyPullPage } from "./apply";
import type { LocalBook } from "./db";
import type { PullResponse } from "./protocol";
import { AccessLostError, AuthError, NetworkError, ServerError, type Transport } from "./transport";

export const PAGE_SIZE = 200;

export interface PullProgress {
  received: number;
  total: number;
}

export interface PullSummary {
  pages: number;
  changes: number;
  bytes: number;
}

export async function pullBand(
  book: LocalBook,
  transport: Transport,
  bandId: string,
  me: string | null,
  onProgress?: (p: PullProgress) => void,
): Promise<PullSummary> {
  const state = await book.syncState.get(bandId);
  let cursor = state?.cursor ?? 0;
  let scope = state?.scope ?? null;
  const baseline = cursor === 0;
  const sum: PullSummary = { pages: 0, changes: 0, bytes: 0 };
  let total = 0;
  for (;;) {
    const q = new URLSearchParams({ since: String(cursor), limit: String(PAGE_SIZE) });
    if (scope) q.set("scope", scope);
    if (sum.pages === 0) q.set("count", "1");
    let res: Response;
    try {
      res = await transport.fetch(`/api/bands/${encodeURIComponent(bandId)}/sync?${q}`);
    } catch (err) {
      throw new NetworkError(err);
    }
    if (res.status === 401) throw new AuthError();
    if (res.status === 403 || res.status === 404) throw new AccessLostError(bandId);
    if (!res.ok) throw new ServerError(res.status);
    const text = await res.text();
    const page = JSON.parse(text) as PullResponse;
    sum.bytes += text.length;
    sum.pages++;
    sum.changes += page.changes.length;
    if (page.total !== undefined) total = page.total;
    // A changed scope restarts the feed from 0 (the server did so already): nothing here counts as new then.
    await applyPullPage(book, bandId, page, me, baseline || (scope !== null && page.scope !== scope));
    cursor = page.seq;
    scope = page.scope;
    if (total > 0) onProgress?.({ received: Math.min(sum.changes, total), total });
    if (!page.more) break;
  }
  return sum;
}
