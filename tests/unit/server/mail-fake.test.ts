// The local mail fake reads what nodemailer sends: both parts, encoded subjects, the links.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import nodemailer from "nodemailer";
import { startMailFake, type MailFake } from "@/scripts/mail-fake";
import { inviteMail } from "@/lib/mail/templates";

let fake: MailFake;
beforeAll(async () => {
  fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
});
afterAll(async () => {
  await fake.close();
});

describe("mail fake", () => {
  it("captures mail and serves it newest first over HTTP", async () => {
    const t = nodemailer.createTransport({ host: "localhost", port: fake.smtpPort, secure: false, ignoreTLS: true });
    const link = "http://localhost:3000/invite/Abc_def-123456789";
    const m = inviteMail({ to: "sax@band.test", bandName: "Crème Brûlée Trio", inviterName: "Lead", role: "sub", link, expiresAt: "2026-12-08T12:00:00Z", accessExpiresAt: "2026-12-02T02:00:00Z" });
    await t.sendMail({ from: "app@pedalpoint.test", ...m });
    await t.sendMail({ from: "app@pedalpoint.test", to: "other@band.test", subject: "Second", text: "no links here", html: "<p>no links</p>" });
    const res = await fetch(`http://localhost:${fake.httpPort}/messages`);
    const { messages } = (await res.json()) as { messages: { to: string[]; subject: string; text: string; html: string; links: string[] }[] };
    expect(messages.map((x) => x.subject)).toEqual(["Second", "Join Crème Brûlée Trio on Pedalpoint"]);
    const invite = messages[1];
    expect(invite?.to).toEqual(["sax@band.test"]);
    expect(invite?.links).toEqual([link]);
    expect(invite?.text).toContain("Your access as a sub ends on 2026-12-02 02:00 UTC.");
    expect(invite?.html).toContain("<a href=");
    const filtered = await fetch(`http://localhost:${fake.httpPort}/messages?to=other@band.test`).then((r) => r.json() as Promise<{ messages: unknown[] }>);
    expect(filtered.messages).toHaveLength(1);
    await fetch(`http://localhost:${fake.httpPort}/messages`, { method: "DELETE" });
    expect(fake.messages()).toHaveLength(0);
  });
});
