// Compressed MusicXML (.mxl): a zip holding META-INF/container.xml and the score. Read with fflate's
// streaming unzip so the limits count real decompressed bytes, not what the zip headers claim.
import { Unzip, UnzipInflate } from "fflate";
import { MAX_MUSICXML_BYTES, MusicXmlError, parseXml, child, children } from "./xml";

export const MXL_LIMITS = {
  maxEntries: 64,
  /** Decompressed bytes for any one entry we read. */
  maxEntryBytes: MAX_MUSICXML_BYTES,
  /** Decompressed bytes across everything we read. */
  maxTotalBytes: 2 * MAX_MUSICXML_BYTES,
};

const WANTED = /(^META-INF\/container\.xml$)|(\.(musicxml|xml)$)/i;

function bombError(): MusicXmlError {
  return new MusicXmlError(
    "zip_limits",
    `This .mxl file unpacks to more than ${MXL_LIMITS.maxEntryBytes / 1024 / 1024} MB (or holds too many files), so it was refused.`,
  );
}

/** The files of a zip that we might need, decompressed within limits. */
export function unzipLimited(data: Uint8Array): Map<string, Uint8Array> {
  const files = new Map<string, Uint8Array>();
  let entries = 0;
  let total = 0;
  let failure: MusicXmlError | null = null;
  const unzip = new Unzip((file) => {
    entries++;
    if (entries > MXL_LIMITS.maxEntries) {
      failure ??= new MusicXmlError("zip_limits", `This .mxl file holds more than ${MXL_LIMITS.maxEntries} files, so it was refused.`);
      return;
    }
    if (!WANTED.test(file.name) || file.name.includes("..")) return;
    if ((file.originalSize ?? 0) > MXL_LIMITS.maxEntryBytes) {
      failure ??= bombError();
      return;
    }
    const chunks: Uint8Array[] = [];
    let size = 0;
    file.ondata = (err, chunk, final) => {
      if (failure) return;
      if (err) {
        failure = new MusicXmlError("bad_zip", "This .mxl file is damaged and could not be unpacked.");
        return;
      }
      size += chunk.length;
      total += chunk.length;
      if (size > MXL_LIMITS.maxEntryBytes || total > MXL_LIMITS.maxTotalBytes) {
        failure = bombError();
        file.terminate();
        return;
      }
      chunks.push(chunk);
      if (final) {
        const out = new Uint8Array(size);
        let at = 0;
        for (const c of chunks) {
          out.set(c, at);
          at += c.length;
        }
        files.set(file.name, out);
      }
    };
    file.start();
  });
  unzip.register(UnzipInflate);
  const step = 64 * 1024;
  try {
    for (let i = 0; i < data.length && !failure; i += step) {
      unzip.push(data.subarray(i, Math.min(data.length, i + step)), i + step >= data.length);
    }
  } catch (err) {
    if (err instanceof MusicXmlError) throw err;
    throw failure ?? new MusicXmlError("bad_zip", "This .mxl file is damaged and could not be unpacked.");
  }
  if (failure) throw failure;
  return files;
}

export function decodeXmlBytes(bytes: Uint8Array): string {
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return new TextDecoder("utf-16le").decode(bytes);
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return new TextDecoder("utf-16be").decode(bytes);
  return new TextDecoder("utf-8").decode(bytes);
}

/** The score's XML text inside an .mxl, found through META-INF/container.xml. */
export function scoreFromMxl(data: Uint8Array): string {
  const files = unzipLimited(data);
  const container = files.get("META-INF/container.xml");
  let path: string | undefined;
  if (container) {
    const root = parseXml(decodeXmlBytes(container));
    const rootfile = children(child(root, "rootfiles"), "rootfile").find(
      (r) => !r.attrs["media-type"] || r.attrs["media-type"].includes("musicxml"),
    );
    path = rootfile?.attrs["full-path"];
  }
  path ??= [...files.keys()].find((n) => !n.startsWith("META-INF/"));
  const bytes = path ? files.get(path) : undefined;
  if (!bytes) throw new MusicXmlError("bad_zip", "This .mxl file has no MusicXML score inside.");
  return decodeXmlBytes(bytes);
}
