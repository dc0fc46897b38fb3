// The device's sync engine: who is signed in and in which bands (bootstrap), then per band push the
// outbox and pull the feed. One run at a time; a request during a run schedules one more run.
// What starts a run lives in triggers.ts (pages) and worker/sw.ts (Background Sync).
import { fetchMissingPartFiles } from "./parts";
import type { LocalBook } from "./db";
import { deleteBandData, getLocalBook } from "./db";
import type { BootstrapResponse } from "./protocol";
import { pullBand, type PullProgress } from "./pull";
import { pushOutbox } from "./push";
import { reportHoldings } from "./readiness-report";
import {
  AccessLostError, AuthError, NetworkError, QUOTA_MESSAGE, ServerError, browserTransport, isQuotaError, type Transport,
} from "./transport";

export type SyncProblem = "network" | "auth" | "server" | "quota" | "other";

export interface EngineState {
  running: boolean;
  progress?: PullProgress;
  problem?: SyncProblem;
  error?: string;
  /** Things the user should read once (a band removed from this device …). */
  notices: string[];
}

export interface EngineOptions {
  book?: () => LocalBook;
  transport?: Transport;
  now?: () => Date;
}

/** Wipes everything this device holds for the signed-in user. */
export async function clearDevice(book: LocalBook): Promise<void> {
  await book.transaction("rw", book.tables, async () => {
    for (const t of book.tables) await t.clear();
  });
}

export class SyncEngine {
  private state: EngineState = { running: false, notices: [] };
  private listeners = new Set<() => void>();
  private current: Promise<void> | null = null;
  private again: { bandId?: string; force: boolean } | null = null;
  private persistAsked = false;
  readonly book: () => LocalBook;
  readonly transport: Transport;
  readonly now: () => Date;

  constructor(opts: EngineOptions = {}) {
    this.book = opts.book ?? getLocalBook;
    this.transport = opts.transport ?? browserTransport;
    this.now = opts.now ?? (() => new Date());
  }

  subscribe = (fn: () => void): (() => void) => {
    this.listeners.add(fn);
    return () => this.listeners.delete(fn);
  };

  getSnapshot = (): EngineState => this.state;

  private set(patch: Partial<EngineState>): void {
    this.state = { ...this.state, ...patch };
    for (const fn of this.listeners) fn();
  }

  dismissNotice(i: number): void {
    this.set({ notices: this.state.notices.filter((_, j) => j !== i) });
  }

  /** Refreshes the trusted session and band list; bands the user left are removed from the device. */
  async bootstrap(): Promise<BootstrapResponse> {
    const book = this.book();
    let res: Response;
    try {
      res = await this.transport.fetch("/api/me/bootstrap");
    } catch (err) {
      throw new NetworkError(err);
    }
    if (res.status === 401) throw new AuthError();
    if (!res.ok) throw new ServerError(res.status);
    const data = (await res.json()) as BootstrapResponse;
    const before = await book.session.get("me");
    if (before && before.userId !== data.user.id) await clearDevice(book);
    await book.session.put({ key: "me", userId: data.user.id, email: data.user.email, name: data.user.name, seenAt: this.now().toISOString() });
    const listed = new Set(data.bands.map((b) => b.id));
    for (const b of await book.bands.toArray()) {
      if (!listed.has(b.id)) {
        await deleteBandData(book, b.id);
        this.set({ notices: [...this.state.notices, `You are no longer in ${b.name}; its book was removed from this device.`] });
      }
    }
    await book.transaction("rw", book.bands, book.memberships, async () => {
      for (const b of data.bands) {
        await book.bands.put({ id: b.id, name: b.name, role: b.role, instrument: b.instrument });
        await book.memberships.put({ bandId: b.id, role: b.role, instrument: b.instrument, expiresAt: b.expiresAt });
      }
    });
    return data;
  }

  private async syncOne(bandId: string, name: string, me: string | null, force: boolean): Promise<void> {
    const book = this.book();
    try {
      await pushOutbox(book, this.transport, bandId, me, { force, now: this.now });
      await pullBand(book, this.transport, bandId, me, (progress) => this.set({ progress }));
      // Readiness for tonight: what this device now holds, sent only after a pull that reached the server.
      await reportHoldings(book, this.transport, bandId).catch(() => undefined);
      // PDF and image parts follow their metadata onto the device, for reading with no signal.
      await fetchMissingPartFiles(book, bandId, { fetcher: (url, init) => this.transport.fetch(url, init) }).catch(() => undefined);
    } catch (err) {
      if (!(err instanceof AccessLostError)) throw err;
      await deleteBandData(book, bandId);
      this.set({ notices: [...this.state.notices, `You no longer have access to ${name}; its charts were removed from this device.`] });
    }
  }

  private async run(bandId: string | undefined, force: boolean): Promise<void> {
    this.set({ running: true, progress: undefined });
    try {
      const boot = await this.bootstrap();
      const bands = boot.bands.filter((b) => !bandId || b.id === bandId);
      for (const b of bands) await this.syncOne(b.id, b.name, boot.user.id, force);
      this.set({ problem: undefined, error: undefined });
      void this.askPersist();
    } catch (err) {
      this.set(describe(err));
    } finally {
      this.set({ running: false, progress: undefined });
    }
  }

  /** Sync now (all bands, or one). Resolves when this run (and any run it had to wait for) is done. */
  sync(opts: { bandId?: string; force?: boolean } = {}): Promise<void> {
    const force = opts.force ?? true;
    if (this.current) {
      this.again = { bandId: this.again ? undefined : opts.bandId, force: force || (this.again?.force ?? false) };
      return this.current;
    }
    this.current = (async () => {
      await this.run(opts.bandId, force);
      while (this.again) {
        const next = this.again;
        this.again = null;
        await this.run(next.bandId, next.force);
      }
    })().finally(() => {
      this.current = null;
    });
    return this.current;
  }

  /** Only the outbox (Background Sync in the service worker, where no pull is needed). */
  async pushAll(): Promise<void> {
    const book = this.book();
    const me = (await book.session.get("me"))?.userId ?? null;
    for (const b of await book.bands.toArray()) await pushOutbox(book, this.transport, b.id, me, { force: true, now: this.now });
  }

  private async askPersist(): Promise<void> {
    // `persist` exists in pages only (not in the service worker).
    const storage = typeof navigator === "undefined" ? undefined : (navigator.storage as (StorageManager & { persist?: () => Promise<boolean> }) | undefined);
    if (this.persistAsked || !storage?.persist) return;
    this.persistAsked = true;
    try {
      if (!(await storage.persisted())) await storage.persist();
    } catch {
      // The browser decides; the book still works without the promise of persistence.
    }
  }
}

function describe(err: unknown): Partial<EngineState> {
  if (err instanceof NetworkError) return { problem: "network", error: err.message };
  if (err instanceof AuthError) return { problem: "auth", error: err.message };
  if (err instanceof ServerError) return { problem: "server", error: err.message };
  if (isQuotaError(err)) return { problem: "quota", error: QUOTA_MESSAGE };
  console.error(err);
  return { problem: "other", error: "Sync stopped on an unexpected problem. The charts on this device are unchanged; try again." };
}

let shared: SyncEngine | null = null;

export function getSyncEngine(): SyncEngine {
  shared ??= new SyncEngine();
  return shared;
}

/** Asks the service worker to send the outbox when signal returns, even with the tab closed. */
export async function requestBackgroundSync(): Promise<void> {
  try {
    const reg = (await navigator.serviceWorker?.ready) as (ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } }) | undefined;
    await reg?.sync?.register("pedalpoint-outbox");
  } catch {
    // Not every browser has Background Sync; the page syncs on `online` anyway.
  }
}

/** How much room the book takes on this device, when the browser says. */
export async function storageEstimate(): Promise<{ usage: number; quota: number; persisted: boolean } | null> {
  if (typeof navigator === "undefined" || !navigator.storage?.estimate) return null;
  const e = await navigator.storage.estimate();
  const persisted = navigator.storage.persisted ? await navigator.storage.persisted() : false;
  return { usage: e.usage ?? 0, quota: e.quota ?? 0, persisted };
}
