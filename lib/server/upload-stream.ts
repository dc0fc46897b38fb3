import "server-only";
// A multipart upload read as a stream (busboy): the file's bytes go on to their consumer as they
// arrive, never held whole in memory, and the size limit holds while streaming: the request is
// refused (413) and reading stops the moment the file passes the limit.
import { Readable } from "node:stream";
import busboy from "busboy";
import { AppError } from "./errors";

/** Room for the multipart envelope around the file itself. */
const ENVELOPE = 64 * 1024;

export interface IncomingFile {
  name: string;
  chunks: AsyncIterable<Uint8Array>;
  /** The form's text fields sent before the file (a part's name and instrument). */
  fields?: Record<string, string>;
}

export interface ReceiveOptions {
  maxBytes: number;
  /** What the file is, for the messages: "a part". */
  what: string;
}

function tooBigError({ maxBytes, what }: ReceiveOptions): AppError {
  const mb = Math.round(maxBytes / 1024 / 1024);
  return new AppError("payload_too_large", `That file is larger than ${mb} MB, the most Pedalpoint takes for ${what}.`);
}

function checkHeaders(request: Request, opts: ReceiveOptions): string {
  const declared = Number(request.headers.get("content-length"));
  if (Number.isFinite(declared) && declared > opts.maxBytes + ENVELOPE) throw tooBigError(opts);
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError("unsupported_media_type", "Send the file as multipart/form-data, in a field named \"file\".");
  }
  if (!request.body) throw new AppError("bad_request", "The upload is empty.");
  return type;
}

const notAForm = () => new AppError("bad_request", "The upload could not be read as a form.");
const noFile = () => new AppError("bad_request", "Attach the file in a field named \"file\".", { fields: [{ field: "file", message: "Choose a file" }] });

/** The request body, failing with a 413 once it passes the file limit and its envelope (whatever it holds). */
async function* capped(body: ReadableStream<Uint8Array>, opts: ReceiveOptions): AsyncGenerator<Uint8Array> {
  const reader = body.getReader();
  let total = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      total += value.byteLength;
      if (total > opts.maxBytes + ENVELOPE) throw tooBigError(opts);
      yield value;
    }
  } finally {
    await reader.cancel().catch(() => undefined);
  }
}

/**
 * Reads the request's field "file" as a stream and hands it to `consume`; answers what `consume`
 * answers. Other fields are skipped. Past `maxBytes` the file's stream fails with a 413 and the
 * request body is no longer read.
 */
export async function receiveFile<T>(request: Request, opts: ReceiveOptions, consume: (file: IncomingFile) => Promise<T>): Promise<T> {
  const type = checkHeaders(request, opts);
  let parser: busboy.Busboy;
  try {
    parser = busboy({ headers: { "content-type": type }, limits: { files: 1, fileSize: opts.maxBytes, fields: 20, fieldSize: 8 * 1024, parts: 40 } });
  } catch {
    throw notAForm();
  }
  const source = Readable.from(capped(request.body as ReadableStream<Uint8Array>, opts), { objectMode: false });
  return new Promise<T>((resolve, reject) => {
    let settled = false;
    let started = false;
    let current: Readable | null = null;
    const finish = (err: unknown, value?: T) => {
      if (settled) return;
      settled = true;
      source.unpipe(parser);
      source.destroy();
      if (err) reject(err);
      else resolve(value as T);
    };
    const fields: Record<string, string> = {};
    parser.on("field", (name, value) => {
      if (!started && name !== "file") fields[name] = value;
    });
    parser.on("file", (field, stream, info) => {
      if (field !== "file" || started) {
        stream.resume();
        return;
      }
      started = true;
      current = stream;
      // Past the limit: stop reading the request at once; the consumer fails with the 413 once it
      // has cleaned up what it wrote (so nothing of the file is left when the refusal is answered).
      stream.once("limit", () => {
        source.unpipe(parser);
        source.destroy();
        stream.destroy(tooBigError(opts));
      });
      consume({ name: (info.filename || "upload").slice(0, 200), chunks: stream, fields }).then(
        (value) => finish(null, value),
        (err) => finish(err),
      );
    });
    parser.on("error", () => finish(notAForm()));
    parser.on("close", () => {
      if (!started) finish(noFile());
    });
    source.on("error", (err) => {
      const failure = err instanceof AppError ? err : notAForm();
      if (current) current.destroy(failure); // the consumer cleans up, then answers with it
      else finish(failure);
    });
    source.pipe(parser);
  });
}

/** The first bytes of a stream (at least `n`, unless it is shorter) and the whole stream again, head included. */
export async function peek(chunks: AsyncIterable<Uint8Array>, n: number): Promise<{ head: Uint8Array; all: AsyncIterable<Uint8Array> }> {
  const it = chunks[Symbol.asyncIterator]();
  const seen: Uint8Array[] = [];
  let size = 0;
  let ended = false;
  while (size < n) {
    const next = await it.next();
    if (next.done) {
      ended = true;
      break;
    }
    seen.push(next.value);
    size += next.value.byteLength;
  }
  const head = Buffer.concat(seen);
  async function* all(): AsyncGenerator<Uint8Array> {
    if (head.byteLength) yield head;
    if (ended) return;
    for (;;) {
      const next = await it.next();
      if (next.done) return;
      yield next.value;
    }
  }
  return { head, all: all() };
}
