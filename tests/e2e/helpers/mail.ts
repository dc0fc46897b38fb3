// Reads what the local SMTP fake captured, through its HTTP side.
import { expect, type APIRequestContext } from "@playwright/test";

export const MAIL_FAKE_URL = `http://localhost:${process.env.MAIL_FAKE_HTTP_PORT ?? 3126}/messages`;

export interface CapturedMail {
  to: string;
  subject: string;
  body: string;
}

function asText(v: unknown): string {
  if (typeof v === "string") return v;
  if (Array.isArray(v)) return v.map(asText).join(" ");
  if (v && typeof v === "object") {
    const o = v as Record<string, unknown>;
    if (typeof o.address === "string") return o.address;
    if (typeof o.text === "string") return o.text;
    return Object.values(o).map(asText).join(" ");
  }
  return "";
}

function normalise(raw: unknown): CapturedMail[] {
  const list = Array.isArray(raw) ? raw : raw && typeof raw === "object" ? (raw as { messages?: unknown[] }).messages ?? [] : [];
  return list.map((m) => {
    const o = (m ?? {}) as Record<string, unknown>;
    return {
      to: asText(o.to ?? o.recipients ?? o.envelopeTo).toLowerCase(),
      subject: asText(o.subject),
      body: [o.text, o.html, o.body, o.raw].map(asText).join("\n"),
    };
  });
}

export async function readMail(request: APIRequestContext): Promise<CapturedMail[]> {
  const res = await request.get(MAIL_FAKE_URL);
  expect(res.ok(), `mail fake answered ${res.status()}`).toBeTruthy();
  return normalise(await res.json());
}

/** Waits for a mail to `to` carrying a link that matches `pattern`, and returns the link. */
export async function waitForLink(request: APIRequestContext, to: string, pattern: RegExp): Promise<string> {
  const found: { link?: string } = {};
  await expect
    .poll(
      async () => {
        const mails = (await readMail(request)).filter((m) => m.to.includes(to.toLowerCase()));
        for (const m of mails.reverse()) {
          const hit = m.body.replace(/&amp;/g, "&").match(pattern);
          if (hit) {
            found.link = hit[0];
            return true;
          }
        }
        return false;
      },
      { message: `a mail to ${to} with a link like ${pattern}`, timeout: 15_000 },
    )
    .toBe(true);
  if (!found.link) throw new Error(`no link in the mail to ${to}`);
  return found.link;
}
