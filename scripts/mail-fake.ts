// A local stand-in for an SMTP relay: accepts every message, keeps it in memory and serves the
// captured mail as JSON over HTTP (GET /messages, newest first; DELETE /messages clears).
// Used by `npm run demo`, the dev mail page and the end-to-end tests. Never for production.
import http from "node:http";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import { findLinks, parseMail } from "./mail-parse";

export interface CapturedMail {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  links: string[];
}

export interface MailFake {
  smtpPort: number;
  httpPort: number;
  messages: () => CapturedMail[];
  close: () => Promise<void>;
}

const MAX_KEPT = 500;

export async function startMailFake({ smtpPort = 2525, httpPort = 2526 }: { smtpPort?: number; httpPort?: number } = {}): Promise<MailFake> {
  const store: CapturedMail[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", () => {
        const parsed = parseMail(Buffer.concat(chunks).toString("utf8"));
        const rcpt = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
        store.unshift({
          id: nextId++,
          receivedAt: new Date().toISOString(),
          from: parsed.from,
          to: rcpt.length ? rcpt : [parsed.to],
          subject: parsed.subject,
          text: parsed.text,
          html: parsed.html,
          links: findLinks(parsed.text || parsed.html),
        });
        store.length = Math.min(store.length, MAX_KEPT);
        callback();
      });
    },
  });

  const web = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://localhost");
    if (url.pathname === "/messages" && req.method === "GET") {
      const to = url.searchParams.get("to")?.toLowerCase();
      const list = to ? store.filter((m) => m.to.includes(to)) : store;
      res.writeHead(200, { "content-type": "application/json" });
      res.end(JSON.stringify({ messages: list }));
    } else if (url.pathname === "/messages" && req.method === "DELETE") {
      store.length = 0;
      res.writeHead(204).end();
    } else {
      res.writeHead(404, { "content-type": "application/json" });
      res.end(JSON.stringify({ error: "not found" }));
    }
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(smtpPort, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    web.once("error", reject);
    web.listen(httpPort, () => resolve());
  });

  return {
    smtpPort: (smtp.server.address() as AddressInfo).port,
    httpPort: (web.address() as AddressInfo).port,
    messages: () => [...store],
    close: () =>
      Promise.all([
        new Promise<void>((r) => smtp.close(() => r())),
        new Promise<void>((r) => web.close(() => r())),
      ]).then(() => undefined),
  };
}

// Run on its own: `tsx scripts/mail-fake.ts`
if (process.argv[1] && import.meta.url === `file://${process.argv[1]}`) {
  const fake = await startMailFake({
    smtpPort: Number(process.env.SMTP_PORT ?? 2525),
    httpPort: Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2526),
  });
  console.log(`mail fake: SMTP on ${fake.smtpPort}, captured mail at http://localhost:${fake.httpPort}/messages`);
}
