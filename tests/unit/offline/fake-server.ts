// A transport that serves the device's requests with the real server code (no HTTP), as one
// signed-in user, plus a switch to cut the signal.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { MutationSchema, PullQuerySchema } from "@/lib/offline/protocol";
import type { Transport } from "@/lib/offline/transport";
import type { Actor } from "@/lib/server/access";
import { listMyBands } from "@/lib/server/bands";
import { AppError } from "@/lib/server/errors";
import { pullChanges, pushMutations } from "@/lib/server/sync";

function json(body: unknown, status = 200): Response {
  return new Response(typeof body === "string" ? body : JSON.stringify(body), { status, headers: { "content-type": "application/json" } });
}

export async function serve(db: Kysely<Database>, actor: Actor | null, path: string, init?: RequestInit): Promise<Response> {
  const url = new URL(path, "http://device.test");
  try {
    if (url.pathname === "/api/me/bootstrap") {
      if (!actor) throw new AppError("unauthenticated", "Please sign in first.");
      const bands = await listMyBands(db, actor);
      return json({ user: { id: actor.userId, email: actor.email, name: actor.name }, bands: bands.map((b) => ({ id: b.id, name: b.name, role: b.role, instrument: b.instrument, expiresAt: b.expiresAt })) });
    }
    const m = /^\/api\/bands\/([^/]+)\/sync$/.exec(url.pathname);
    if (m) {
      const bandId = decodeURIComponent(m[1]!);
      if ((init?.method ?? "GET") === "GET") {
        return json(await pullChanges(db, actor, bandId, PullQuerySchema.parse(Object.fromEntries(url.searchParams))));
      }
      const body = JSON.parse(String(init?.body)) as { mutations: unknown[] };
      return json(await pushMutations(db, actor, bandId, body.mutations.map((x) => MutationSchema.parse(x))));
    }
    return json({ error: { code: "not_found", message: "no route" } }, 404);
  } catch (err) {
    if (err instanceof AppError) return json({ error: { code: err.code, message: err.message } }, err.status);
    throw err;
  }
}

export interface FakeNetwork extends Transport {
  online: boolean;
  /** Fail the next N requests as if the signal dropped. */
  failNext: number;
  /** Fail the next N pushes (POSTs) only. */
  failNextPush: number;
  requests: string[];
}

export function fakeNetwork(db: Kysely<Database>, actor: () => Actor | null): FakeNetwork {
  const net: FakeNetwork = {
    online: true,
    failNext: 0,
    failNextPush: 0,
    requests: [],
    async fetch(path, init) {
      net.requests.push(`${init?.method ?? "GET"} ${path}`);
      if (!net.online) throw new TypeError("Failed to fetch");
      if (net.failNext > 0) {
        net.failNext--;
        throw new TypeError("Failed to fetch");
      }
      if (init?.method === "POST" && net.failNextPush > 0) {
        net.failNextPush--;
        throw new TypeError("Failed to fetch");
      }
      return serve(db, actor(), path, init);
    },
  };
  return net;
}
