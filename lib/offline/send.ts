"use client";
// The one way a page's write reaches the server. Online it goes straight to the REST route and the
// answer is settled into the local book; with no signal, no session or a failing server it is
// "unreachable" and the caller writes the edit locally and queues it in the outbox for the next sync.
// An edit of a row that still has an earlier one queued is never sent past it: it queues behind it.
import { readErrorBody, type FieldProblem } from "@/lib/api-error";
import type { LocalBook } from "./db";

/** What a write from the pages came to; `row` and `current` are what the device now holds. */
export type SaveResult<T> =
  | { status: "saved"; row: T }
  | { status: "queued"; row: T }
  | { status: "conflict"; current: T; message: string }
  | { status: "invalid"; fields: FieldProblem[]; message: string };

/** A delete leaves no row behind. */
export type DeleteResult<T> = { status: "saved" } | { status: "queued" } | Exclude<SaveResult<T>, { row: T }>;

export type Sent = { kind: "answer"; res: Response } | { kind: "unreachable" };

function online(): boolean {
  return typeof navigator === "undefined" || navigator.onLine !== false;
}

/** True while an earlier edit of this row waits in the outbox. */
export async function hasQueued(book: LocalBook, entityId: string): Promise<boolean> {
  return (await book.outbox.where("entityId").equals(entityId).toArray()).some((i) => i.status === "pending");
}

/** Sends a JSON request to one of the band's routes (`path` below /api/bands/{bandId}). */
export async function send(bandId: string, path: string, init: RequestInit): Promise<Sent> {
  if (!online()) return { kind: "unreachable" };
  try {
    const res = await fetch(`/api/bands/${encodeURIComponent(bandId)}${path}`, {
      credentials: "same-origin",
      cache: "no-store",
      headers: { "content-type": "application/json" },
      ...init,
    });
    // No session or a failing server: keep the edit here and let sync send it later.
    if (res.status === 401 || res.status >= 500) return { kind: "unreachable" };
    return { kind: "answer", res };
  } catch {
    return { kind: "unreachable" };
  }
}

/** The signed-in user on this device, as the last session left it. */
export async function whoAmI(book: LocalBook): Promise<{ id: string; name: string } | null> {
  const s = await book.session.get("me");
  return s ? { id: s.userId, name: s.name } : null;
}

/**
 * Settles the server's answer to a save: the saved row (the body's `key`) or, on a 409, the server's
 * current version is stored with `store`; any other refusal names the fields.
 */
export async function settle<W, T>(res: Response, key: string, store: (wire: W) => Promise<T>, refused: string): Promise<SaveResult<T>> {
  if (res.ok) {
    const body = (await res.json().catch(() => null)) as Record<string, W | undefined> | null;
    const saved = body?.[key];
    if (saved) return { status: "saved", row: await store(saved) };
    return { status: "invalid", fields: [], message: refused };
  }
  const error = await readErrorBody(res);
  const message = error?.message ?? refused;
  if (res.status === 409 && error?.current) return { status: "conflict", current: await store(error.current as W), message };
  return { status: "invalid", fields: error?.fields ?? [], message };
}

/** A refusal as a delete reports it (a delete's answer carries no row). */
export function refusal<T>(r: SaveResult<T>): DeleteResult<T> {
  return r.status === "saved" || r.status === "queued" ? { status: "saved" } : r;
}
