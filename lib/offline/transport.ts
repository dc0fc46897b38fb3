// How the device reaches the server. The browser uses fetch with the session cookie; tests and the
// simulation plug in a transport that calls the server code directly.
export interface Transport {
  fetch(path: string, init?: RequestInit): Promise<Response>;
}

export const browserTransport: Transport = {
  fetch: (path, init) => fetch(path, { credentials: "same-origin", cache: "no-store", ...init }),
};

/** No answer at all: no signal, server down, request cut. */
export class NetworkError extends Error {
  constructor(readonly cause?: unknown) {
    super("No connection to Pedalpoint.");
    this.name = "NetworkError";
  }
}

/** The session ended: sign in again to send changes. */
export class AuthError extends Error {
  constructor() {
    super("Your sign-in has ended. Sign in again to sync; nothing on this device is lost.");
    this.name = "AuthError";
  }
}

/** This user is no longer in the band (removed, or a sub whose access ended). */
export class AccessLostError extends Error {
  constructor(readonly bandId: string) {
    super("You are no longer in this band, so its book was removed from this device.");
    this.name = "AccessLostError";
  }
}

export class ServerError extends Error {
  constructor(readonly status: number) {
    super(`The server could not sync just now (error ${status}). It will try again.`);
    this.name = "ServerError";
  }
}

/** The browser refused to store more (IndexedDB quota). The transaction was rolled back. */
export function isQuotaError(err: unknown): boolean {
  for (let e: unknown = err, depth = 0; e && depth < 4; depth++) {
    const name = (e as { name?: string }).name;
    if (name === "QuotaExceededError" || name === "NS_ERROR_DOM_QUOTA_REACHED") return true;
    e = (e as { inner?: unknown; cause?: unknown }).inner ?? (e as { cause?: unknown }).cause;
  }
  return false;
}

export const QUOTA_MESSAGE =
  "This device has no room left for the band's book. Free some space (or remove other sites' data) and sync again; the charts already here are unchanged.";
