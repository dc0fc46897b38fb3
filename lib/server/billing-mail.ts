import "server-only";
// The receipt sent to the leader when the band plan starts: a plain-text and an HTML part.
import type { MailMessage } from "@/lib/mail";
import { mailLayout, utcText } from "@/lib/mail/html";

export function receiptMail(p: { to: string; bandName: string; amount: string; renewsAt: string | null; link: string }): MailMessage {
  const renews = p.renewsAt ? utcText(p.renewsAt) : "next month";
  const lines = [
    `${p.bandName} is now on the Pedalpoint band plan: no limit on charts or members.`,
    `Paid: ${p.amount}. The plan renews on ${renews}; you can cancel any time from the plan page.`,
  ];
  return {
    to: p.to,
    subject: `Receipt: band plan for ${p.bandName}`,
    text: `${lines.join("\n\n")}\n\nPlan page: ${p.link}\n`,
    html: mailLayout({ title: "Band plan receipt", paragraphs: lines, button: { label: "Open the plan page", href: p.link }, footer: "Pedalpoint band plan." }),
  };
}
