import fs from "node:fs";
import path from "node:path";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";

export function multipart(name: string, bytes: Uint8Array, type = "application/octet-stream"): Request {
  const fd = new FormData();
  fd.append("file", new Blob([bytes as BlobPart], { type }), name);
  return new Request("http://localhost/upload", { method: "POST", body: fd });
}

/** A 50 MB upload made on the fly, counting how much of it the server actually pulls. */
export function hugeUpload(withLength: boolean): { request: Request; pulled: () => number } {
  const total = 50 * 1024 * 1024;
  const chunk = new Uint8Array(1024 * 1024).fill(0x41);
  let sent = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= total) return controller.close();
      sent += chunk.byteLength;
      controller.enqueue(chunk);
    },
  });
  const headers: Record<string, string> = { "content-type": "multipart/form-data; boundary=pedalpointboundary" };
  if (withLength) headers["content-length"] = String(total);
  const init = { method: "POST", body, headers, duplex: "half" } as RequestInit;
  return { request: new Request("http://localhost/upload", init), pulled: () => sent };
}

/** Rows and files that a refused upload must not leave behind. */
export async function storedState(db: Kysely<Database>, dataDir: string) {
  const count = async (t: "charts" | "attachments" | "changes") => Number((await db.selectFrom(t).select((eb) => eb.fn.countAll<number>().as("n")).executeTakeFirstOrThrow()).n);
  const dir = path.join(dataDir, "attachments");
  return {
    charts: await count("charts"),
    attachments: await count("attachments"),
    changes: await count("changes"),
    files: fs.existsSync(dir) ? fs.readdirSync(dir).length : 0,
  };
}
