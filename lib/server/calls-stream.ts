import "server-only";
// The server-sent event stream of a gig's calls. Each event's id is the call's seq, so a browser that
// reconnects (EventSource does so by itself) sends Last-Event-ID and gets exactly what it missed.
// The stream reads the database, never process memory, so any app process can serve any follower.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { callsAfter, latestCall, type TuneCall } from "./calls";

/** How often the stream looks for a new call: well under the one second a follower may lag. */
const POLL_MS = 100;
const HEARTBEAT_MS = 15_000;
/** Streams end after a while; the browser reconnects, and the membership is checked again then. */
const MAX_LIFE_MS = 5 * 60_000;
/** A follower joining late catches up with the tune called in the last few hours. */
const CATCH_UP_MS = 6 * 3600_000;

const encoder = new TextEncoder();
const event = (c: TuneCall) => encoder.encode(`id: ${c.seq}\nevent: call\ndata: ${JSON.stringify(c)}\n\n`);

export function callStream(db: Kysely<Database>, setlistId: string, lastEventId: number | null, signal: AbortSignal): Response {
  let timer: ReturnType<typeof setTimeout> | null = null;
  let closed = false;
  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      const started = Date.now();
      let beat = started;
      let last = lastEventId ?? 0;
      const close = () => {
        if (closed) return;
        closed = true;
        if (timer) clearTimeout(timer);
        try {
          controller.close();
        } catch {
          // already closed by the client going away
        }
      };
      signal.addEventListener("abort", close);
      controller.enqueue(encoder.encode(`retry: 1000\n: following\n\n`));
      if (lastEventId === null) {
        const latest = await latestCall(db, setlistId);
        if (latest && Date.now() - Date.parse(latest.at) < CATCH_UP_MS) controller.enqueue(event(latest));
        last = latest?.seq ?? 0;
      }
      const tick = async () => {
        if (closed) return;
        try {
          for (const c of await callsAfter(db, setlistId, last)) {
            controller.enqueue(event(c));
            last = c.seq;
          }
          if (Date.now() - beat > HEARTBEAT_MS) {
            controller.enqueue(encoder.encode(`: still here\n\n`));
            beat = Date.now();
          }
        } catch {
          return close();
        }
        if (Date.now() - started > MAX_LIFE_MS) return close();
        timer = setTimeout(() => void tick(), POLL_MS);
      };
      await tick();
    },
    cancel() {
      closed = true;
      if (timer) clearTimeout(timer);
    },
  });
  return new Response(stream, {
    headers: { "content-type": "text/event-stream; charset=utf-8", "cache-control": "no-store, no-transform", connection: "keep-alive", "x-accel-buffering": "no" },
  });
}
