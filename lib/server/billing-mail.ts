import "server-only";
// The receipt sent to the leader when the band plan starts: a plain-text and an HTML part.
import type { MailMessage } from "@/lib/mail";
import { escapeHtml } from "@/lib/mail/html";

export function receiptMail(p: { to: string; bandName: string; amount: string; renewsAt: string | null; link: string }): MailMessage {
  const renews = p.renewsAt ? new Date(p.renewsAt).toUTCString().slice(0, 16) : "next month";
  const lines = [
    `${p.bandName} is now on the Pedalpoint band plan: no limit on charts or members.`,
    `Paid: ${p.amount}. The plan renews on ${renews}; you can cancel any time from the plan page.`,
  ];
  return {
    to: p.to,
    subject: `Receipt: band plan for ${p.bandName}`,
    text: `${lines.join("\n\n")}\n\nPlan page: ${p.link}\n`,
    html: `<!doctype html><html lang="en"><body style="font-family:system-ui,sans-serif;color:#15171c"><div style="max-width:520px;margin:0 auto;padding:24px">
<h1 style="font-size:20px">Band plan receipt</h1>${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join("")}
<p><a href="${escapeHtml(p.link)}">Open the plan page</a></p></div></body></html>`,
  };
}
