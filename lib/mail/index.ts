import "server-only";
// Outgoing e-mail through SMTP (a local fake in dev, demo and tests). One transport per process.
import nodemailer, { type Transporter } from "nodemailer";

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
}

const globalForMail = globalThis as unknown as { pedalpointMail?: Transporter };

function transport(): Transporter {
  globalForMail.pedalpointMail ??= nodemailer.createTransport({
    host: process.env.SMTP_HOST ?? "localhost",
    port: Number(process.env.SMTP_PORT ?? 2525),
    secure: false,
    // The local fake speaks plain SMTP; a real relay would be configured with TLS and auth.
    ignoreTLS: process.env.SMTP_TLS !== "1",
    auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASS ?? "" } : undefined,
  });
  return globalForMail.pedalpointMail;
}

export const MAIL_FROM = process.env.MAIL_FROM ?? "Pedalpoint <no-reply@pedalpoint.test>";

export async function sendMail(message: MailMessage): Promise<void> {
  await transport().sendMail({ from: MAIL_FROM, ...message });
}

export { accountExistsMail, inviteMail, signInLinkMail } from "./templates";
