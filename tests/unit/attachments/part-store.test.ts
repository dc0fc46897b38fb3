// Parts in object storage: the AWS SDK against a local fake S3 server (s3rver), addressed by sha256,
// streamed both ways (a 50 MB part moves with far less than 50 MB of memory), and served through a
// short-lived signed address; the data folder when no store is set.
import { spawn, type ChildProcess } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import v8 from "node:v8";
import vm from "node:vm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freePort } from "@/scripts/pg-cluster";
import { partKey, partStore, PartTooLarge } from "@/lib/server/part-store";

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-s3-"));
let server: ChildProcess;
let env: Record<string, string>;

// The fake runs in its own process, so the memory measured below is this process's alone.
const FAKE = `const { default: S3rver } = await import("s3rver");
const [port, directory] = process.argv.slice(1);
await new S3rver({ address: "127.0.0.1", port: Number(port), silent: true, directory, configureBuckets: [{ name: "parts", configs: [] }] }).run();
console.log("ready");`;

beforeAll(async () => {
  const port = await freePort(3560);
  server = spawn(process.execPath, ["--input-type=module", "-e", FAKE, String(port), path.join(dir, "s3")], { cwd: process.cwd(), stdio: ["ignore", "pipe", "inherit"] });
  await new Promise<void>((resolve, reject) => {
    server.stdout?.on("data", (d: Buffer) => d.toString().includes("ready") && resolve());
    server.once("exit", (code) => reject(new Error(`fake S3 exited with ${code}`)));
  });
  // s3rver accepts these fixed credentials (its documented defaults).
  env = { S3_ENDPOINT: `http://127.0.0.1:${port}`, S3_BUCKET: "parts", S3_REGION: "us-east-1", AWS_ACCESS_KEY_ID: "S3RVER", AWS_SECRET_ACCESS_KEY: "S3RVER" };
  Object.assign(process.env, { AWS_ACCESS_KEY_ID: "S3RVER", AWS_SECRET_ACCESS_KEY: "S3RVER" });
}, 30_000);
afterAll(() => {
  server.kill();
  fs.rmSync(dir, { recursive: true, force: true });
});

const MB = 1024 * 1024;

// One invented 1 MB block, sent again and again: the source itself then holds no memory of its own.
const BLOCK = Buffer.alloc(1024 * 1024);
for (let i = 0; i < BLOCK.length; i += 4) BLOCK.writeUInt32LE(i * 2654435761 >>> 0, i);

/** `total` bytes in 64 KB views of BLOCK. */
async function* pattern(total: number): AsyncGenerator<Uint8Array> {
  for (let sent = 0; sent < total; sent += 64 * 1024) {
    const at = sent % BLOCK.length;
    yield BLOCK.subarray(at, at + Math.min(64 * 1024, total - sent));
  }
}

// The collector, run before each sample so that samples count memory really in use.
v8.setFlagsFromString("--expose-gc");
const collect = vm.runInNewContext("gc") as () => void;

/**
 * Two full collections: the first frees the dead Buffers, but V8 releases their backing stores (what
 * `arrayBuffers` counts) only at the next one. After a single collection a plain node:http download
 * that keeps no chunk at all still showed up to 25 MB of `arrayBuffers` here; after two, 0.0 MB.
 */
function gc(): void {
  collect();
  collect();
}

function memory(): number {
  const m = process.memoryUsage();
  return m.heapUsed + m.arrayBuffers;
}

/** Runs `work` and returns the most memory it held above where it started, sampled every 100 ms after a collection
 * (memory still held, not garbage waiting for the collector). */
async function peakGrowth(work: () => Promise<void>): Promise<number> {
  gc();
  const start = memory();
  let peak = start;
  const timer = setInterval(() => {
    gc();
    peak = Math.max(peak, memory());
  }, 100);
  try {
    await work();
  } finally {
    clearInterval(timer);
  }
  gc();
  return Math.max(peak, memory()) - start;
}

describe("parts on the fake S3 store", () => {
  it("stores a part under its sha256 and hands back the same bytes, once for the same bytes", async () => {
    const store = partStore(env);
    expect(store.kind).toBe("s3");
    const bytes = new TextEncoder().encode("%PDF-1.4 a small invented part");
    const a = await store.put([bytes], { maxBytes: MB, type: "application/pdf" });
    expect(a.sha256).toBe(createHash("sha256").update(bytes).digest("hex"));
    expect(a.key).toBe(partKey(a.sha256));
    expect((await store.put([bytes], { maxBytes: MB, type: "application/pdf" })).key).toBe(a.key);
    const body = await store.open(a.key);
    expect(body?.size).toBe(bytes.byteLength);
    expect(new Uint8Array(await new Response(body?.stream).arrayBuffer())).toEqual(bytes);
    expect(await store.open(partKey("0".repeat(64)))).toBeNull();
  });

  it("refuses a part past the size limit and keeps nothing of it", async () => {
    const store = partStore(env);
    const spools = () => new Set(fs.readdirSync(os.tmpdir()).filter((f) => f.startsWith("pedalpoint-part-")));
    const before = spools();
    await expect(store.put(pattern(2 * MB), { maxBytes: MB, type: "application/pdf" })).rejects.toBeInstanceOf(PartTooLarge);
    expect([...spools()].filter((f) => !before.has(f))).toEqual([]);
  });

  it("serves a part through a signed address that works for a while and carries its type", async () => {
    const store = partStore(env);
    const bytes = new TextEncoder().encode("%PDF-1.4 signed");
    const { key } = await store.put([bytes], { maxBytes: MB, type: "application/pdf" });
    const url = await store.signedUrl(key, { filename: "lead.pdf", type: "application/pdf", seconds: 60 });
    expect(url).toMatch(/X-Amz-Signature=/);
    const res = await fetch(url as string);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(new Uint8Array(await res.arrayBuffer())).toEqual(bytes);
    // short-lived: the address says for how long (s3rver does not check signatures, a real store does)
    expect(new URL(url as string).searchParams.get("X-Amz-Expires")).toBe("60");
  });

  it("streams a 50 MB part in and out with memory growth under 20 MB", async () => {
    const store = partStore(env);
    const total = 50 * MB;
    const want = createHash("sha256");
    for await (const c of pattern(total)) want.update(c);
    let key = "";
    const upGrowth = await peakGrowth(async () => {
      key = (await store.put(pattern(total), { maxBytes: 60 * MB, type: "application/pdf" })).key;
    });
    expect(key).toBe(partKey(want.digest("hex")));
    const got = createHash("sha256");
    let size = 0;
    const downGrowth = await peakGrowth(async () => {
      const body = await store.open(key);
      expect(body?.size).toBe(total);
      const reader = (body?.stream as ReadableStream<Uint8Array>).getReader();
      for (;;) {
        const { done, value } = await reader.read();
        if (done) break;
        size += value.byteLength;
        got.update(value);
      }
    });
    expect(size).toBe(total);
    expect(`attachments/${got.digest("hex")}`).toBe(key);
    console.log(`50 MB part: memory growth up ${(upGrowth / MB).toFixed(1)} MB, down ${(downGrowth / MB).toFixed(1)} MB`);
    expect(upGrowth).toBeLessThan(20 * MB);
    expect(downGrowth).toBeLessThan(20 * MB);
  }, 240_000);
});

describe("parts in the data folder (no store set)", () => {
  it("stores under attachments/<sha256> and streams back", async () => {
    const store = partStore({ DATA_DIR: path.join(dir, "data") });
    expect(store.kind).toBe("local");
    const bytes = new TextEncoder().encode("\x89PNG local");
    const { key } = await store.put([bytes], { maxBytes: MB, type: "image/png" });
    expect(fs.existsSync(path.join(dir, "data", key))).toBe(true);
    const body = await store.open(key);
    expect(new Uint8Array(await new Response(body?.stream).arrayBuffer())).toEqual(bytes);
    expect(await store.signedUrl(key, { filename: "x.png", type: "image/png", seconds: 60 })).toBeNull();
    expect(await store.open("../../etc/passwd")).toBeNull();
  });
});
