// The e-mail that lends a set list to a sub: a plain-text and an HTML part. Pure.
import { SHARING_CAUTION } from "./share";
import { escapeHtml } from "@/lib/mail/html";

function when(iso: string): string {
  return `${new Date(iso).toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

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
  const gig = [p.setlistName, p.venue, p.startsAt ? when(p.startsAt) : ""].filter(Boolean).join(" · ");
  const lines = [
    `${p.leaderName} shared the set list for ${gig} with you on Pedalpoint (${p.bandName}).`,
    p.message,
    "Open the link, sign in or make an account, and the set and its charts are kept on your phone or tablet, so they work with no signal on the gig. Each chart shows in your instrument's key.",
    `You can read it until ${when(p.expiresAt)}.`,
    SHARING_CAUTION,
  ].filter(Boolean);
  const footer = "If you did not expect this, you can ignore this e-mail.";
  const body = lines.map((l) => `<p style="margin:0 0 16px">${escapeHtml(l)}</p>`).join("");
  return {
    to: p.to,
    subject: `Set list from ${p.bandName}: ${p.setlistName}`,
    text: `${lines.join("\n\n")}\n\nOpen the set list:\n${p.link}\n\n${footer}\n`,
    html: `<!doctype html><html lang="en"><body style="margin:0;background:#fbfaf7;font-family:system-ui,sans-serif;color:#15171c">
<div style="max-width:520px;margin:0 auto;padding:32px 24px">
<h1 style="font-size:20px;margin:0 0 20px">${escapeHtml(p.setlistName)}</h1>
${body}
<p style="margin:24px 0"><a href="${escapeHtml(p.link)}" style="background:#a8620f;color:#ffffff;padding:12px 20px;border-radius:6px;text-decoration:none;font-weight:600">Open the set list</a></p>
<p style="margin:0 0 16px;font-size:13px;color:#5b6170">If the button does not work, paste this address into your browser:<br>${escapeHtml(p.link)}</p>
<p style="margin:0;font-size:13px;color:#5b6170">${escapeHtml(footer)}</p>
</div></body></html>`,
  };
}
