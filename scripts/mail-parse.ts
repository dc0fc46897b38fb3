// Just enough MIME to read what nodemailer sends: headers, multipart/alternative, quoted-printable
// and base64 bodies, encoded-word subjects. For the local mail fake only.

export interface ParsedMail {
  headers: Record<string, string>;
  subject: string;
  from: string;
  to: string;
  text: string;
  html: string;
}

function splitHead(raw: string): [string, string] {
  const i = raw.search(/\r?\n\r?\n/);
  if (i < 0) return [raw, ""];
  const sep = raw.slice(i).match(/^\r?\n\r?\n/)?.[0].length ?? 2;
  return [raw.slice(0, i), raw.slice(i + sep)];
}

function parseHeaders(head: string): Record<string, string> {
  const out: Record<string, string> = {};
  const unfolded = head.replace(/\r?\n[ \t]+/g, " ");
  for (const line of unfolded.split(/\r?\n/)) {
    const c = line.indexOf(":");
    if (c > 0) out[line.slice(0, c).trim().toLowerCase()] = line.slice(c + 1).trim();
  }
  return out;
}

function decodeQuotedPrintable(s: string): string {
  const bytes: number[] = [];
  const soft = s.replace(/=\r?\n/g, "");
  for (let i = 0; i < soft.length; i++) {
    const ch = soft[i] ?? "";
    const hex = soft.slice(i + 1, i + 3);
    if (ch === "=" && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(ch, "utf8"));
    }
  }
  return Buffer.from(bytes).toString("utf8");
}

function decodeBody(body: string, encoding: string | undefined): string {
  const enc = (encoding ?? "7bit").toLowerCase();
  const decoded =
    enc === "base64"
      ? Buffer.from(body.replace(/\s+/g, ""), "base64").toString("utf8")
      : enc === "quoted-printable"
        ? decodeQuotedPrintable(body)
        : body;
  return decoded.replace(/\r\n/g, "\n");
}

export function decodeWords(s: string): string {
  // RFC 2047: white space between two encoded words is not part of the text.
  return s.replace(/(\?=)\s+(?==\?)/g, "$1").replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_m, _charset: string, kind: string, text: string) =>
    kind.toUpperCase() === "B"
      ? Buffer.from(text, "base64").toString("utf8")
      : decodeQuotedPrintable(text.replace(/_/g, " ")),
  );
}

function walk(raw: string, acc: { text: string; html: string }): Record<string, string> {
  const [head, body] = splitHead(raw);
  const headers = parseHeaders(head);
  const type = headers["content-type"] ?? "text/plain";
  const boundary = type.match(/boundary="?([^";]+)"?/i)?.[1];
  if (/^multipart\//i.test(type) && boundary) {
    const parts = body.split(`--${boundary}`).slice(1);
    for (const part of parts) {
      if (part.startsWith("--")) break;
      walk(part.replace(/^\r?\n/, ""), acc);
    }
  } else if (/^text\/html/i.test(type)) {
    acc.html ||= decodeBody(body, headers["content-transfer-encoding"]).trim();
  } else if (/^text\/plain/i.test(type)) {
    acc.text ||= decodeBody(body, headers["content-transfer-encoding"]).trim();
  }
  return headers;
}

export function parseMail(raw: string): ParsedMail {
  const acc = { text: "", html: "" };
  const headers = walk(raw, acc);
  return {
    headers,
    subject: decodeWords(headers["subject"] ?? ""),
    from: decodeWords(headers["from"] ?? ""),
    to: decodeWords(headers["to"] ?? ""),
    text: acc.text,
    html: acc.html,
  };
}

export function findLinks(text: string): string[] {
  return [...new Set(text.match(/https?:\/\/[^\s<>"')]+/g) ?? [])];
}
