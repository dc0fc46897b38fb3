// The e-mail that lends a set list to a sub: a plain-text and an HTML part. Pure.
import { SHARING_CAUTION } from "./share";
import { mailLayout, utcText } from "@/lib/mail/html";

export function shareMail(p: {
  to: string;
  bandName: string;
  leaderName: string;
  setlistName: string;
  startsAt: string | null;
  venue: string;
  expiresAt: string;
  message: string;
  link: string;
}): { to: string; subject: string; text: string; html: string } {
  const gig = [p.setlistName, p.venue, p.startsAt ? utcText(p.startsAt) : ""].filter(Boolean).join(" · ");
  const lines = [
    `${p.leaderName} shared the set list for ${gig} with you on Pedalpoint (${p.bandName}).`,
    p.message,
    "Open the link, sign in or make an account, and the set and its charts are kept on your phone or tablet, so they work with no signal on the gig. Each chart shows in your instrument's key.",
    `You can read it until ${utcText(p.expiresAt)}.`,
    SHARING_CAUTION,
  ].filter(Boolean);
  const footer = "If you did not expect this, you can ignore this e-mail.";
  return {
    to: p.to,
    subject: `Set list from ${p.bandName}: ${p.setlistName}`,
    text: `${lines.join("\n\n")}\n\nOpen the set list:\n${p.link}\n\n${footer}\n`,
    html: mailLayout({ title: p.setlistName, paragraphs: lines, button: { label: "Open the set list", href: p.link }, footer }),
  };
}
