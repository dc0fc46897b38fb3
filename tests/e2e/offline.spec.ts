// With no signal after one sync, a player can do everything on the bandstand; back online, the
// leader's correction arrives (with its "updated" mark) and nothing written offline is lost.
// A sub whose share has ended loses the shared charts at the next sync.
import { randomUUID } from "node:crypto";
import { expect, test, type BrowserContext, type Page } from "@playwright/test";
import { DEMO_ACCOUNTS, DEMO_GIG_ID, demoId } from "../../db/seed";
import { signIn } from "./helpers/auth";
import { DEMO_BAND_ID } from "./helpers/demo";
import { ChartFormPage } from "./pages/chart-form";
import { LibraryPage } from "./pages/library";

const account = (role: string) => {
  const a = DEMO_ACCOUNTS.find((x) => x.role === role);
  if (!a) throw new Error(`no demo ${role}`);
  return a;
};
const CHART_ID = demoId("chart:lanternfish");
const band = `/bands/${DEMO_BAND_ID}`;
const status = (page: Page) => page.getByTestId("sync-status");

/** Signs in, lets the first sync land and waits until the service worker controls the page. */
async function syncedDevice(context: BrowserContext, role: string): Promise<Page> {
  const page = await context.newPage();
  const who = account(role);
  await signIn(page, who.email, who.password, band);
  await page.goto(band);
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  // The first load is not controlled until the worker claims it; a reload always is.
  if (!(await page.evaluate(() => Boolean(navigator.serviceWorker.controller)))) await page.reload();
  await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller)), { timeout: 30_000 }).toBe(true);
  await new LibraryPage(page).waitForBook();
  await expect(status(page)).toHaveAttribute("data-state", "online", { timeout: 30_000 });
  return page;
}

async function serverChart(page: Page, chartId: string) {
  const res = await page.request.get(`/api/bands/${DEMO_BAND_ID}/charts/${chartId}`);
  expect(res.ok()).toBe(true);
  return ((await res.json()) as { chart: { title: string; composer: string; key: string; meter: string; tempo: number | null; feel: string; sourceText: string; revision: number } }).chart;
}

test.describe("no signal on the bandstand", () => {
  test.use({ viewport: { width: 390, height: 700 } });

  test("library, a B♭ part with an intro and the bandstand work offline; reconnecting brings the leader's fix and keeps the player's own", async ({ browser }) => {
    const arrangerContext = await browser.newContext();
    const leaderContext = await browser.newContext();
    const page = await syncedDevice(arrangerContext, "arranger");
    const library = new LibraryPage(page);
    const before = await serverChart(page, CHART_ID);

    // The signal goes.
    await arrangerContext.setOffline(true);
    await expect(status(page)).toHaveAttribute("data-state", "offline");
    await page.reload();
    await library.waitForBook();
    await expect(library.row(before.title)).toBeVisible();

    // A chart as a B♭ part with a ii–V intro, then the bandstand view with page turns.
    await page.goto(`${band}/charts/${CHART_ID}?instrument=bb&intro=two-five`);
    await expect(page.getByRole("heading", { level: 1 })).toContainText(before.title);
    await expect(page.locator('[data-testid="chart-page"]')).toBeVisible({ timeout: 30_000 });
    await page.goto(`${band}/charts/${CHART_ID}/bandstand?instrument=bb&intro=two-five`);
    const sheet = page.locator('[data-testid="chart-page"]');
    await expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached({ timeout: 30_000 });
    const pages = Number(await sheet.getAttribute("data-pages"));
    expect(pages).toBeGreaterThanOrEqual(2);
    await page.keyboard.press("PageDown");
    await expect(sheet).toHaveAttribute("data-page", "2");
    await page.keyboard.press("PageUp");
    await expect(sheet).toHaveAttribute("data-page", "1");
    expect(new URL(page.url()).pathname).toBe(`${band}/charts/${CHART_ID}/bandstand`);

    // Meanwhile the leader, online on another device, publishes a correction of the same chart.
    const leader = await leaderContext.newPage();
    await signIn(leader, account("leader").email, account("leader").password, band);
    const fix = await leader.request.put(`/api/bands/${DEMO_BAND_ID}/charts/${CHART_ID}`, {
      data: { title: before.title, composer: before.composer, key: before.key, meter: before.meter, tempo: before.tempo, feel: "leader's tempo fix", sourceText: before.sourceText, message: "Faster, per the singer", baseRevision: before.revision },
    });
    expect(fix.ok()).toBe(true);

    // Still offline, the arranger makes a change of their own: it waits in the outbox.
    const form = new ChartFormPage(page);
    await page.goto(`${band}/charts/${CHART_ID}/edit`);
    await form.feel.waitFor({ timeout: 30_000 });
    await form.feel.fill("arranger's offline idea");
    await form.save.click();
    // Saved on the device; the form goes back to the chart (a full load from the service worker offline).
    await page.waitForURL((u) => u.pathname === `${band}/charts/${CHART_ID}`, { timeout: 30_000 });
    await expect(page.getByRole("heading", { level: 1 })).toContainText(before.title);
    await page.goto(band);
    await expect(status(page)).toHaveAttribute("data-pending", "1");

    // Back online: the push and pull run; nothing is lost.
    await arrangerContext.setOffline(false);
    await expect(status(page)).toHaveAttribute("data-pending", "0", { timeout: 30_000 });
    await expect(status(page)).toHaveAttribute("data-state", "online", { timeout: 30_000 });
    const after = await serverChart(page, CHART_ID);
    expect(after.revision).toBeGreaterThan(before.revision);
    await expect(library.row(before.title)).toHaveAttribute("data-updated", "true");
    const history = await (await page.request.get(`/api/bands/${DEMO_BAND_ID}/charts/${CHART_ID}/revisions`)).text();
    expect(history).toContain("Faster, per the singer");
    if (!history.includes("arranger's offline idea")) {
      // Not applied (it clashed with the leader's revision), so it is kept as a conflict copy,
      // shown in the sync status until someone decides.
      await expect(status(page)).toHaveAttribute("data-problems", "1");
      await page.getByTestId("sync-status-toggle").click();
      const conflict = page.getByTestId("sync-conflict");
      await expect(conflict).toContainText(before.title);
      await conflict.getByRole("link", { name: "Open my copy" }).click();
      await expect(page.getByRole("heading", { level: 1 })).toContainText("my offline copy");
    }

    // Opening the chart clears its mark (in-app navigation, as a player taps through the library).
    await page.goto(band);
    await library.waitForBook();
    await library.row(before.title).getByTestId("chart-link").click();
    await expect(page.getByRole("heading", { level: 1 })).toContainText(before.title);
    await page.goBack();
    await library.waitForBook();
    await expect(library.row(before.title)).not.toHaveAttribute("data-updated", "true");
    await arrangerContext.close();
    await leaderContext.close();
  });

  test("a sub whose share has ended loses the shared charts at the next sync", async ({ browser }) => {
    const leaderContext = await browser.newContext();
    const leader = await leaderContext.newPage();
    await signIn(leader, account("leader").email, account("leader").password, band);
    // The demo seeds tonight's gig shared with this sub: withdraw it, so the sub holds only this test's share.
    const seeded = await leader.request.get(`/api/bands/${DEMO_BAND_ID}/setlists/${DEMO_GIG_ID}/shares`);
    for (const s of ((await seeded.json()) as { shares: { id: string; state: string }[] }).shares) {
      if (s.state === "waiting" || s.state === "accepted") {
        expect((await leader.request.delete(`/api/bands/${DEMO_BAND_ID}/setlists/${DEMO_GIG_ID}/shares/${s.id}`)).ok()).toBe(true);
      }
    }
    const list = await leader.request.post(`/api/bands/${DEMO_BAND_ID}/setlists`, {
      data: { name: `Pier dance ${randomUUID().slice(0, 4)}`, venue: "The Tide Room", entries: [{ id: randomUUID(), chartId: CHART_ID, setNumber: 1, position: 0 }] },
    });
    expect(list.ok()).toBe(true);
    const setlistId = ((await list.json()) as { setlist: { id: string } }).setlist.id;
    const shared = await leader.request.post(`/api/bands/${DEMO_BAND_ID}/setlists/${setlistId}/shares`, {
      data: { email: account("sub").email, expiresAt: new Date(Date.now() + 86_400_000).toISOString() },
    });
    expect(shared.ok()).toBe(true);
    const { share, link } = (await shared.json()) as { share: { id: string }; link: string };

    const subContext = await browser.newContext();
    const sub = await subContext.newPage();
    await signIn(sub, account("sub").email, account("sub").password, "/bands");
    const token = new URL(link).pathname.split("/").pop()!;
    expect((await sub.request.post(`/api/shares/${token}/accept`, { data: {} })).ok()).toBe(true);
    await sub.goto(band);
    const library = new LibraryPage(sub);
    await library.waitForBook();
    await expect(library.rows).toHaveCount(1);

    // The leader withdraws the share; at the sub's next sync the chart leaves the device.
    expect((await leader.request.delete(`/api/bands/${DEMO_BAND_ID}/setlists/${setlistId}/shares/${share.id}`)).ok()).toBe(true);
    await sub.getByTestId("sync-now").click();
    await expect(library.rows).toHaveCount(0, { timeout: 30_000 });
    const left = await sub.evaluate(async () => {
      const dbs = await indexedDB.databases();
      return dbs.map((d) => d.name);
    });
    expect(left).toContain("pedalpoint");
    await subContext.close();
    await leaderContext.close();
  });
});
