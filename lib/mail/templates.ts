// The words of every e-mail Pedalpoint sends, each with a plain-text and an HTML part.
import type { MailMessage } from "./index";
import { escapeHtml, mailLayout, utcText } from "./html";

function layout(title: string, paragraphs: string[], button: { label: string; href: string }, footer: string): string {
  return mailLayout({ title, paragraphs, button, footer });
}

const ROLE_WORDS: Record<string, string> = {
  leader: "a leader",
  arranger: "an arranger",
  player: "a player",
  sub: "a sub",
};

export function inviteMail(p: {
  to: string;
  bandName: string;
  inviterName: string;
  role: string;
  link: string;
  expiresAt: string;
  accessExpiresAt: string | null;
}): MailMessage {
  const role = ROLE_WORDS[p.role] ?? p.role;
  const lines = [
    `${p.inviterName} invited you to join ${p.bandName} on Pedalpoint as ${role}.`,
    `Pedalpoint keeps the band's book of charts and shows each one in your instrument's key, on your phone or tablet, with or without signal.`,
    p.accessExpiresAt ? `Your access as a sub ends on ${utcText(p.accessExpiresAt)}.` : "",
    `This link works once and expires on ${utcText(p.expiresAt)}.`,
  ].filter(Boolean);
  const footer = "If you did not expect this invite, you can ignore this e-mail.";
  return {
    to: p.to,
    subject: `Join ${p.bandName} on Pedalpoint`,
    text: `${lines.join("\n\n")}\n\nAccept the invite:\n${p.link}\n\n${footer}\n`,
    html: layout(`Join ${p.bandName}`, lines, { label: "Accept the invite", href: p.link }, footer),
  };
}

export function signInLinkMail(p: { to: string; link: string; minutes: number }): MailMessage {
  const lines = [
    `Here is your sign-in link for Pedalpoint.`,
    `It works once and expires in ${p.minutes} minutes.`,
  ];
  const footer = "If you did not ask for this link, you can ignore this e-mail; nobody can sign in without it.";
  return {
    to: p.to,
    subject: "Your Pedalpoint sign-in link",
    text: `${lines.join("\n\n")}\n\nSign in:\n${p.link}\n\n${footer}\n`,
    html: layout("Sign in to Pedalpoint", lines, { label: "Sign in", href: p.link }, footer),
  };
}

/** Sent instead of making a second account when someone signs up with an address that has one. */
export function accountExistsMail(p: { to: string; link: string; minutes: number }): MailMessage {
  const lines = [
    `Someone, perhaps you, tried to create a Pedalpoint account with this address. It already has one, so nothing was changed.`,
    `To get in, use this sign-in link. It works once and expires in ${p.minutes} minutes.`,
  ];
  const footer = "If it was not you, you can ignore this e-mail; nobody can sign in without the link.";
  return {
    to: p.to,
    subject: "You already have a Pedalpoint account",
    text: `${lines.join("\n\n")}\n\nSign in:\n${p.link}\n\n${footer}\n`,
    html: layout("You already have an account", lines, { label: "Sign in", href: p.link }, footer),
  };
}


export interface DigestChart {
  title: string;
  revision: number;
  /** Everyone who published a revision since the last notice, in order. */
  authors: string[];
  /** Each revision's message since the last notice, oldest first. */
  messages: string[];
  removed: boolean;
  link: string;
}

/** The "charts updated" notice: every chart published since the band's last one, each with a link. */
export function chartsUpdatedMail(p: { to: string; bandName: string; senderName: string; charts: DigestChart[]; libraryLink: string }): MailMessage {
  const count = `${p.charts.length} ${p.charts.length === 1 ? "chart" : "charts"}`;
  const intro = `${p.senderName} sent this notice: ${count} in the book of ${p.bandName} changed since the last one. Your devices pick up the new versions at their next sync; open the app once while you have signal before the gig.`;
  const footer = "You get this notice because you are a member of the band. Only the leader or an arranger can send it.";
  const what = (c: DigestChart) => (c.removed ? `removed from the book (revision ${c.revision})` : `revision ${c.revision}`);
  const notes = (c: DigestChart) => c.messages.filter((m) => m.trim() !== "");
  const textItems = p.charts.map((c) =>
    [
      `* ${c.title} — ${what(c)}, by ${c.authors.join(", ")}`,
      ...notes(c).map((m) => `  “${m}”`),
      `  ${c.link}`,
    ].join("\n"),
  );
  const htmlItems = p.charts
    .map(
      (c) => `<li style="margin:0 0 16px">
<a href="${escapeHtml(c.link)}" style="color:#a8620f;font-weight:600">${escapeHtml(c.title)}</a>
<span style="color:#5b6170"> — ${escapeHtml(what(c))}, by ${escapeHtml(c.authors.join(", "))}</span>
${notes(c).map((m) => `<br><span>“${escapeHtml(m)}”</span>`).join("")}
</li>`,
    )
    .join("");
  const html = mailLayout({
    title: `Charts updated in ${p.bandName}`,
    paragraphs: [intro],
    listHtml: `<ul style="margin:0 0 16px;padding-left:20px">${htmlItems}</ul>`,
    button: { label: "Open the library", href: p.libraryLink },
    spellAddress: false,
    footer,
  });
  return {
    to: p.to,
    subject: `${p.bandName}: ${count} updated`,
    text: `${intro}\n\n${textItems.join("\n\n")}\n\nThe library:\n${p.libraryLink}\n\n${footer}\n`,
    html,
  };
}
