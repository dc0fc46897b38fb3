import "server-only";
// Where the bytes of uploaded parts live, addressed by their sha256 (the key is the row's `path`,
// "attachments/<sha256>"). With S3_ENDPOINT and S3_BUCKET set, an S3-compatible object store through
// the AWS SDK (credentials from the usual AWS_* variables); otherwise the local data folder.
// Both directions stream: an upload is hashed while it is spooled to a temporary file (the hash is
// the name, so it is known only at the end), then moved or sent from that file; a download is the
// store's own stream. No part is ever held whole in memory here.
import { GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { createHash, randomUUID } from "node:crypto";
import { createReadStream, createWriteStream } from "node:fs";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { Transform } from "node:stream";

export interface StoredPart {
  sha256: string;
  size: number;
  /** The key the bytes are found under (the attachment row's `path`). */
  key: string;
}

export interface PartBody {
  stream: ReadableStream<Uint8Array>;
  size: number;
}

export interface PartStore {
  readonly kind: "local" | "s3";
  /** Stores the bytes of `source` under their sha256; refuses past `maxBytes` (throws TooLarge). */
  put(source: AsyncIterable<Uint8Array> | Iterable<Uint8Array>, opts: { maxBytes: number; type: string }): Promise<StoredPart>;
  /** The bytes under `key` as a stream, or null when they are missing. */
  open(key: string): Promise<PartBody | null>;
  /** A short-lived address members can fetch the bytes from directly, where the store has one. */
  signedUrl(key: string, opts: { filename: string; type: string; seconds: number }): Promise<string | null>;
}

export class PartTooLarge extends Error {}

export function partKey(sha256: string): string {
  return path.posix.join("attachments", sha256);
}

export function dataDir(): string {
  // the data folder is chosen at run time; the build must not trace it
  return path.resolve(/*turbopackIgnore: true*/ process.env.DATA_DIR ?? path.join(/*turbopackIgnore: true*/ process.cwd(), "data"));
}

/** Copies `source` into `file`, hashing on the way; removes the file when it fails or is too big. */
async function spool(source: AsyncIterable<Uint8Array> | Iterable<Uint8Array>, file: string, maxBytes: number): Promise<{ sha256: string; size: number }> {
  const hash = createHash("sha256");
  let size = 0;
  const meter = new Transform({
    transform(chunk: Buffer, _enc, done) {
      size += chunk.byteLength;
      if (size > maxBytes) return done(new PartTooLarge(`more than ${maxBytes} bytes`));
      hash.update(chunk);
      done(null, chunk);
    },
  });
  try {
    await pipeline(Readable.from(source), meter, createWriteStream(file));
  } catch (err) {
    await fs.rm(file, { force: true });
    throw err;
  }
  return { sha256: hash.digest("hex"), size };
}

/**
 * A pull-driven web stream over a Node stream: the next chunk is read only when the reader asks
 * for it, so a slow reader (a phone on a bad network) holds one chunk here, not the whole part.
 */
export function pullStream(source: Readable): ReadableStream<Uint8Array> {
  const it = source[Symbol.asyncIterator]();
  return new ReadableStream<Uint8Array>(
    {
      async pull(controller) {
        const { done, value } = await it.next();
        if (done) controller.close();
        else controller.enqueue(value as Buffer);
      },
      async cancel() {
        source.destroy();
      },
    },
    { highWaterMark: 0 },
  );
}

class LocalPartStore implements PartStore {
  readonly kind = "local";
  constructor(private readonly root: string) {}

  private abs(key: string): string | null {
    const abs = path.join(/*turbopackIgnore: true*/ this.root, key);
    return abs.startsWith(this.root + path.sep) ? abs : null;
  }

  async put(source: AsyncIterable<Uint8Array> | Iterable<Uint8Array>, opts: { maxBytes: number }): Promise<StoredPart> {
    const dir = path.join(/*turbopackIgnore: true*/ this.root, "attachments");
    await fs.mkdir(dir, { recursive: true });
    const tmp = path.join(dir, `.${randomUUID()}.part`);
    const { sha256, size } = await spool(source, tmp, opts.maxBytes);
    const key = partKey(sha256);
    // Same bytes, same name: a second copy simply replaces the first.
    await fs.rename(tmp, this.abs(key) as string);
    return { sha256, size, key };
  }

  async open(key: string): Promise<PartBody | null> {
    const abs = this.abs(key);
    if (!abs) return null;
    const stat = await fs.stat(abs).catch(() => null);
    if (!stat?.isFile()) return null;
    return { stream: pullStream(createReadStream(abs)), size: stat.size };
  }

  async signedUrl(): Promise<string | null> {
    return null;
  }
}

export interface S3Settings {
  endpoint: string;
  bucket: string;
  region: string;
  /** Path-style addresses (endpoint/bucket/key), as local and most self-hosted stores need. */
  forcePathStyle: boolean;
}

export function s3Settings(env: Record<string, string | undefined> = process.env): S3Settings | null {
  if (!env.S3_ENDPOINT || !env.S3_BUCKET) return null;
  return {
    endpoint: env.S3_ENDPOINT,
    bucket: env.S3_BUCKET,
    region: env.S3_REGION ?? env.AWS_REGION ?? "us-east-1",
    forcePathStyle: env.S3_FORCE_PATH_STYLE !== "0",
  };
}

class S3PartStore implements PartStore {
  readonly kind = "s3";
  private readonly client: S3Client;
  constructor(private readonly s: S3Settings) {
    // Credentials: the SDK's default chain (AWS_ACCESS_KEY_ID / AWS_SECRET_ACCESS_KEY, profiles, roles).
    // Checksums only where the API requires them: a streamed body is then sent as plain bytes with
    // its length, which every S3-compatible store reads (not all of them read aws-chunked framing).
    this.client = new S3Client({
      endpoint: s.endpoint,
      region: s.region,
      forcePathStyle: s.forcePathStyle,
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    });
  }

  private async exists(key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.s.bucket, Key: key }));
      return true;
    } catch (err) {
      if ((err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return false;
      throw err;
    }
  }

  async put(source: AsyncIterable<Uint8Array> | Iterable<Uint8Array>, opts: { maxBytes: number; type: string }): Promise<StoredPart> {
    const tmp = path.join(os.tmpdir(), `pedalpoint-part-${randomUUID()}`);
    try {
      const { sha256, size } = await spool(source, tmp, opts.maxBytes);
      const key = partKey(sha256);
      if (!(await this.exists(key))) {
        await this.client.send(new PutObjectCommand({
          Bucket: this.s.bucket, Key: key, Body: createReadStream(tmp), ContentLength: size, ContentType: opts.type,
        }));
      }
      return { sha256, size, key };
    } finally {
      await fs.rm(tmp, { force: true });
    }
  }

  async open(key: string): Promise<PartBody | null> {
    try {
      const r = await this.client.send(new GetObjectCommand({ Bucket: this.s.bucket, Key: key }));
      if (!r.Body) return null;
      // In Node the SDK's body is the HTTP response itself, a Node stream.
      return { stream: pullStream(r.Body as Readable), size: Number(r.ContentLength ?? 0) };
    } catch (err) {
      const status = (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
      if (status === 404 || (err as Error).name === "NoSuchKey") return null;
      throw err;
    }
  }

  async signedUrl(key: string, opts: { filename: string; type: string; seconds: number }): Promise<string | null> {
    const cmd = new GetObjectCommand({
      Bucket: this.s.bucket,
      Key: key,
      ResponseContentType: opts.type,
      ResponseContentDisposition: `inline; filename="${opts.filename}"`,
    });
    return getSignedUrl(this.client, cmd, { expiresIn: opts.seconds });
  }
}

const stores = new Map<string, PartStore>();

/** The store the settings choose (one per distinct setting, kept for the process). */
export function partStore(env: Record<string, string | undefined> = process.env): PartStore {
  const s3 = s3Settings(env);
  const id = s3 ? `s3:${s3.endpoint}/${s3.bucket}` : `local:${env.DATA_DIR ?? ""}`;
  let store = stores.get(id);
  if (!store) stores.set(id, (store = s3 ? new S3PartStore(s3) : new LocalPartStore(env === process.env ? dataDir() : path.resolve(env.DATA_DIR ?? "data"))));
  return store;
}
