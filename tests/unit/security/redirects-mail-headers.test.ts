// Issue 10 items 3, 4, 10 and 13 (unknown checkout): redirect rules, who reads captured mail, the
// security headers the proxy sets, and a made-up checkout session.
import { afterAll, describe, expect, it } from "vitest";
import { NextRequest } from "next/server";
import { proxy } from "@/proxy";
import { authOptions } from "@/lib/server/auth-options";
import { confirmCheckout } from "@/lib/server/billing";
import { mailBoxAccess } from "@/lib/server/dev-mail";
import { safeCallbackPath } from "@/lib/validation/callback";
import { startPaymentFake } from "@/scripts/payment-fake";
import { appError, cleanupDbs, freshDb, makeBand } from "../server/helpers";

afterAll(cleanupDbs);

describe("callbackUrl after sign-in stays on this site", () => {
  const attacks = ["/\\otherhost/x", "/\totherhost", "/\t/otherhost", "//otherhost", "/\n/otherhost", "https://otherhost/", "javascript:alert(1)", " /x", "\\\\otherhost"];
  it.each(attacks)("refuses %j (the form and the server rule alike)", (url) => {
    const path = safeCallbackPath(url, "/bands");
    expect(new URL(path, "https://app.test").origin).toBe("https://app.test");
    expect(path).not.toMatch(/otherhost/);
  });

  it("keeps same-site paths with their query", () => {
    expect(safeCallbackPath("/bands/b1/charts?sort=title#top")).toBe("/bands/b1/charts?sort=title#top");
  });

  it("next-auth's redirect rule sends foreign and tricky URLs home", async () => {
    const redirect = authOptions.callbacks!.redirect!;
    const base = "http://localhost:3000";
    expect(await redirect({ url: "/\\otherhost/x", baseUrl: base })).toBe(`${base}/`);
    expect(await redirect({ url: "https://otherhost.test/", baseUrl: base })).toBe(base);
    expect(await redirect({ url: `${base}/bands`, baseUrl: base })).toBe(`${base}/bands`);
  });
});

describe("captured demo mail", () => {
  const actor = { userId: "u1", email: "Priya@Band.test", name: "Priya" };
  it("an anonymous caller sees none; a signed-in person only their own; the start key everything", () => {
    process.env.MAIL_VIEW_KEY = "k".repeat(24);
    expect(mailBoxAccess(null, null)).toEqual({ kind: "none" });
    expect(mailBoxAccess("guess", null)).toEqual({ kind: "none" });
    expect(mailBoxAccess("k".repeat(23), null)).toEqual({ kind: "none" });
    expect(mailBoxAccess(null, actor)).toEqual({ kind: "own", email: "priya@band.test" });
    expect(mailBoxAccess("k".repeat(24), null)).toEqual({ kind: "all" });
  });

  it("with no key configured, no guess opens the whole box", () => {
    delete process.env.MAIL_VIEW_KEY;
    expect(mailBoxAccess("", null)).toEqual({ kind: "none" });
    expect(mailBoxAccess("undefined", null)).toEqual({ kind: "none" });
  });
});

describe("security headers on every page", () => {
  it("a nonce-based CSP, fresh per request, with framing, referrer and sniffing closed; HSTS on https", () => {
    const a = proxy(new NextRequest("http://localhost:3000/bands"));
    const b = proxy(new NextRequest("https://pedalpoint.example/bands"));
    const csp = a.headers.get("content-security-policy") ?? "";
    const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
    expect(nonce).toMatch(/^[A-Za-z0-9+/=]{20,}$/);
    expect(b.headers.get("content-security-policy")).not.toContain(nonce);
    expect(csp).toMatch(/frame-ancestors 'none'/);
    expect(csp).toMatch(/object-src 'none'/);
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
    expect(a.headers.get("x-frame-options")).toBe("DENY");
    expect(a.headers.get("referrer-policy")).toBe("same-origin");
    expect(a.headers.get("x-content-type-options")).toBe("nosniff");
    expect(a.headers.get("strict-transport-security")).toBeNull();
    expect(b.headers.get("strict-transport-security")).toMatch(/max-age=\d+/);
  });
});

describe("billing confirm", () => {
  it("confirming a checkout session the provider never made is 404 and stores nothing", async () => {
    process.env.PAYMENT_FAKE = "1";
    const fake = await startPaymentFake({ port: 0, deliver: async () => undefined });
    process.env.PAYMENT_FAKE_PORT = String(fake.port);
    try {
      const db = await freshDb();
      const { bandId, leader } = await makeBand(db);
      expect((await appError(() => confirmCheckout(db, leader, bandId, "cs_test_madeup1234"))).status).toBe(404);
      expect(await db.selectFrom("subscriptions").selectAll().execute()).toEqual([]);
      await db.destroy();
    } finally {
      await fake.close();
    }
  });
});
