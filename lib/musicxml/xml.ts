// Safe XML reading for MusicXML: entity processing is off in the parser, a DOCTYPE that declares
// entities is refused outright (billion laughs, external entities), and nothing is ever fetched.
// Only the five predefined entities and numeric character references are decoded, by us.
import { XMLParser } from "fast-xml-parser";
import { assertWellFormed } from "./xml-errors";

export const MAX_MUSICXML_BYTES = 5 * 1024 * 1024;

export type MusicXmlErrorCode = "wrong_type" | "too_large" | "entities" | "not_xml" | "not_musicxml" | "bad_zip" | "zip_limits" | "unsupported";

/** A refusal with a message fit for the person uploading. */
export class MusicXmlError extends Error {
  constructor(
    readonly code: MusicXmlErrorCode,
    message: string,
  ) {
    super(message);
    this.name = "MusicXmlError";
  }
}

export interface XNode {
  name: string;
  attrs: Record<string, string>;
  children: XNode[];
  /** Concatenated text directly inside this element, trimmed. */
  text: string;
}

const PREDEFINED: Record<string, string> = { amp: "&", lt: "<", gt: ">", quot: '"', apos: "'" };

export function decodeText(s: string): string {
  if (!s.includes("&")) return s;
  return s.replace(/&(#x[0-9a-fA-F]{1,6}|#[0-9]{1,7}|[a-zA-Z]{2,4});/g, (all, ref: string) => {
    if (ref.startsWith("#x") || ref.startsWith("#X")) return safeCodePoint(parseInt(ref.slice(2), 16), all);
    if (ref.startsWith("#")) return safeCodePoint(parseInt(ref.slice(1), 10), all);
    return PREDEFINED[ref] ?? all;
  });
}

function safeCodePoint(cp: number, fallback: string): string {
  return Number.isFinite(cp) && cp > 0 && cp <= 0x10ffff ? String.fromCodePoint(cp) : fallback;
}

/**
 * Where the root element starts: the prolog is read whole, however long its comments are (a fixed
 * window let a DOCTYPE hide behind a long comment). One pass over the text.
 */
export function prologEnd(text: string): number {
  let i = 0;
  for (;;) {
    const lt = text.indexOf("<", i);
    if (lt < 0) return text.length;
    const close = text.startsWith("<!--", lt) ? "-->" : text.startsWith("<?", lt) ? "?>" : null;
    if (close) {
      const end = text.indexOf(close, lt + 2);
      if (end < 0) return text.length;
      i = end + close.length;
    } else if (text.startsWith("<!", lt)) i = lt + 2; // DOCTYPE and its internal subset
    else return lt;
  }
}

/** Refuses entity declarations anywhere before the root element. */
export function assertNoEntityDeclarations(text: string): void {
  const head = text.slice(0, prologEnd(text));
  const doctype = /<!DOCTYPE/i.exec(head);
  if (!doctype) return;
  if (/<!ENTITY/i.test(text.slice(doctype.index))) {
    throw new MusicXmlError(
      "entities",
      "This file declares XML entities in its DOCTYPE. Pedalpoint never expands entities or fetches external references, so the file was refused. Export it again from your notation program.",
    );
  }
}

type Ordered = Record<string, unknown>;

function toNode(name: string, raw: Ordered): XNode {
  const node: XNode = { name, attrs: {}, children: [], text: "" };
  const attrs = raw[":@"];
  if (attrs && typeof attrs === "object") {
    for (const [k, v] of Object.entries(attrs as Record<string, unknown>)) node.attrs[k] = decodeText(String(v));
  }
  const kids = raw[name];
  if (Array.isArray(kids)) {
    const texts: string[] = [];
    for (const kid of kids as Ordered[]) {
      for (const key of Object.keys(kid)) {
        if (key === ":@") continue;
        if (key === "#text") texts.push(String(kid[key]));
        else node.children.push(toNode(key, kid));
      }
    }
    node.text = decodeText(texts.join("").trim());
  }
  return node;
}

/** Parses XML text into a small ordered tree. Throws MusicXmlError on refusal or malformed input. */
export function parseXml(text: string): XNode {
  if (text.length > MAX_MUSICXML_BYTES) {
    throw new MusicXmlError("too_large", "This MusicXML file is larger than 5 MB, the most Pedalpoint reads.");
  }
  assertNoEntityDeclarations(text);
  assertWellFormed(text);
  const parser = new XMLParser({
    preserveOrder: true,
    ignoreAttributes: false,
    attributeNamePrefix: "",
    processEntities: false,
    htmlEntities: false,
    parseTagValue: false,
    parseAttributeValue: false,
    trimValues: true,
    ignoreDeclaration: true,
    ignorePiTags: true,
  });
  let out: unknown;
  try {
    out = parser.parse(text, true);
  } catch (err) {
    const detail = err instanceof Error ? err.message.split("\n")[0] : "";
    throw new MusicXmlError("not_xml", `This file is not well-formed XML${detail ? ` (${detail})` : ""}.`);
  }
  if (!Array.isArray(out)) throw new MusicXmlError("not_xml", "This file is not well-formed XML.");
  for (const top of out as Ordered[]) {
    for (const key of Object.keys(top)) {
      if (key !== ":@" && key !== "#text" && !key.startsWith("?")) return toNode(key, top);
    }
  }
  throw new MusicXmlError("not_xml", "This file has no XML root element.");
}

export function child(node: XNode | undefined, name: string): XNode | undefined {
  return node?.children.find((c) => c.name === name);
}

export function children(node: XNode | undefined, name: string): XNode[] {
  return node ? node.children.filter((c) => c.name === name) : [];
}

export function textOf(node: XNode | undefined, name: string): string | undefined {
  const c = child(node, name);
  return c ? c.text : undefined;
}

export function numberOf(node: XNode | undefined, name: string): number | undefined {
  const t = textOf(node, name);
  if (t === undefined || t === "") return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : undefined;
}

/** Escapes text for XML content and attribute values. */
export function esc(s: string): string {
  return s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
}
