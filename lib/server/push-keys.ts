import "server-only";
// The server's VAPID key pair (RFC 8292): made once, on first use, and kept in the database so every
// app process signs with the same key and browsers' subscriptions survive a restart.
import type { Kysely } from "kysely";
import webpush from "web-push";
import type { Database } from "@/db/schema";

export interface VapidKeys {
  publicKey: string;
  privateKey: string;
}

const ROW = "vapid";

export async function vapidKeys(db: Kysely<Database>): Promise<VapidKeys> {
  const found = await db.selectFrom("push_keys").select(["public_key", "private_key"]).where("id", "=", ROW).executeTakeFirst();
  if (found) return { publicKey: found.public_key, privateKey: found.private_key };
  const made = webpush.generateVAPIDKeys();
  // Two processes starting together: the first insert wins and both read it back.
  await db
    .insertInto("push_keys")
    .values({ id: ROW, public_key: made.publicKey, private_key: made.privateKey, created_at: new Date().toISOString() })
    .onConflict((oc) => oc.column("id").doNothing())
    .execute();
  const row = await db.selectFrom("push_keys").select(["public_key", "private_key"]).where("id", "=", ROW).executeTakeFirstOrThrow();
  return { publicKey: row.public_key, privateKey: row.private_key };
}

/** Who to contact about this sender (the push service may write to it). */
export function vapidSubject(): string {
  return process.env.PUSH_CONTACT ?? "mailto:push@pedalpoint.test";
}
