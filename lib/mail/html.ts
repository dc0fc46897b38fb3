// The HTML part of every mail: one page layout, escaped text, times in UTC. Pure: the pure set-list
// mail imports it too.

const ENTITIES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ENTITIES[c] ?? c);
}

/** "2026-12-02 02:00 UTC": a mail cannot know the reader's time zone. */
export function utcText(iso: string): string {
  return `${new Date(iso).toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

export interface MailPage {
  title: string;
  paragraphs: string[];
  /** Markup already escaped by the caller, set after the paragraphs (the digest's list of charts). */
  listHtml?: string;
  button: { label: string; href: string };
  /** The button's address written out for mail readers that drop links; off where the list carries the links. */
  spellAddress?: boolean;
  footer: string;
}

export function mailLayout({ title, paragraphs, listHtml = "", button, spellAddress = true, footer }: MailPage): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 16px">${escapeHtml(p)}</p>`).join("");
  const address = spellAddress
    ? `<p style="margin:0 0 16px;font-size:13px;color:#5b6170">If the button does not work, paste this address into your browser:<br>${escapeHtml(button.href)}</p>\n`
    : "";
  return `<!doctype html><html lang="en"><body style="margin:0;background:#fbfaf7;font-family:system-ui,sans-serif;color:#15171c">
<div style="max-width:520px;margin:0 auto;padding:32px 24px">
<h1 style="font-size:20px;margin:0 0 20px">${escapeHtml(title)}</h1>
${body}${listHtml}
<p style="margin:24px 0"><a href="${escapeHtml(button.href)}" style="background:#a8620f;color:#ffffff;padding:12px 20px;border-radius:6px;text-decoration:none;font-weight:600">${escapeHtml(button.label)}</a></p>
${address}<p style="margin:0;font-size:13px;color:#5b6170">${escapeHtml(footer)}</p>
</div></body></html>`;
}
