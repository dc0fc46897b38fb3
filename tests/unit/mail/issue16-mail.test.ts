import { describe, expect, it } from "vitest";
import { chartsUpdatedMail } from "@/lib/mail/templates";

describe("item 12: the charts-updated e-mail reads right for a band whose name starts with 'The'", () => {
  it("never says 'the The'", () => {
    const mail = chartsUpdatedMail({
      to: "a@example.test",
      bandName: "The Saltmarsh Five",
      senderName: "Odile",
      charts: [{ title: "Crooked Signal", revision: 3, authors: ["Odile"], messages: [], removed: false, link: "http://x.test/c" }],
      libraryLink: "http://x.test/b",
    });
    const words = `${mail.subject}\n${mail.text}\n${mail.html}`;
    expect(words).not.toMatch(/\bthe The\b/i);
    expect(mail.text).toContain("the book of The Saltmarsh Five");
  });
});
