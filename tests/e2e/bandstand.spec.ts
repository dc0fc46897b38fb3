// The bandstand view: pedal keys and taps turn pages and stop at the ends, both themes draw, the
// screen stays on while it is open. Screenshots go to test-results/screenshots/ for review.
import { expect, test, type Page } from "@playwright/test";
import { demoId } from "../../db/seed";
import { signIn } from "./helpers/auth";
import { expectNoSeriousA11yIssues } from "./helpers/axe";
import { DEMO_BAND_ID, demoPlayer } from "./helpers/demo";

const CHART_ID = demoId("chart:lanternfish");
const SECOND_ID = demoId("chart:tidewater-waltz");
const bandstandUrl = (query: string) => `/bands/${DEMO_BAND_ID}/charts/${CHART_ID}/bandstand${query}`;
const shown = (page: Page) => page.locator('[data-testid="chart-page"]');

async function openBandstand(page: Page, query = "?instrument=bb") {
  await page.goto(bandstandUrl(query));
  await expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached({ timeout: 30_000 });
}

async function pageCount(page: Page): Promise<number> {
  return Number(await shown(page).getAttribute("data-pages"));
}

test.describe("bandstand view", { tag: "@phone" }, () => {
  // A phone on a stand: small enough that the tune takes several pages.
  test.use({ viewport: { width: 390, height: 700 } });

  test.beforeEach(async ({ page }) => {
    // Record Wake Lock use (headless Chromium may refuse the real one).
    await page.addInitScript(() => {
      const log: string[] = [];
      (window as unknown as { wakeLog: string[] }).wakeLog = log;
      Object.defineProperty(navigator, "wakeLock", {
        configurable: true,
        value: { request: async () => (log.push("request"), { release: async () => void log.push("release") }) },
      });
    });
    const player = demoPlayer();
    await signIn(page, player.email, player.password, `/bands/${DEMO_BAND_ID}`);
  });

  test("pedal keys turn forward and back and stop at both ends", async ({ page }) => {
    await openBandstand(page);
    const pages = await pageCount(page);
    expect(pages).toBeGreaterThanOrEqual(3);
    const forward = ["PageDown", "ArrowRight", "ArrowDown", "Space"];
    for (let p = 2; p <= pages; p++) {
      await page.keyboard.press(forward[(p - 2) % forward.length]!);
      await expect(shown(page)).toHaveAttribute("data-page", String(p));
    }
    await page.keyboard.press("PageDown");
    await expect(shown(page)).toHaveAttribute("data-page", String(pages));
    await expect(page.getByTestId("page-counter")).toHaveText(`${pages} / ${pages}`);
    const back = ["PageUp", "ArrowLeft", "ArrowUp"];
    for (let p = pages - 1; p >= 1; p--) {
      await page.keyboard.press(back[(pages - 1 - p) % back.length]!);
      await expect(shown(page)).toHaveAttribute("data-page", String(p));
    }
    await page.keyboard.press("PageUp");
    await expect(shown(page)).toHaveAttribute("data-page", "1");
    // Only the shown page's sheet is visible.
    await expect(shown(page).locator("[data-sheet].pp-shown")).toHaveCount(1);
  });

  test("taps on the right turn forward, on the left back, stopping at the ends", async ({ page }) => {
    await openBandstand(page);
    const pages = await pageCount(page);
    await page.getByTestId("tap-back").click();
    await expect(shown(page)).toHaveAttribute("data-page", "1");
    for (let p = 2; p <= pages; p++) {
      await page.mouse.click(330, 300);
      await expect(shown(page)).toHaveAttribute("data-page", String(p));
    }
    await page.getByTestId("tap-next").click();
    await expect(shown(page)).toHaveAttribute("data-page", String(pages));
    await page.mouse.click(40, 300);
    await expect(shown(page)).toHaveAttribute("data-page", String(pages - 1));
  });

  test("the early turn raises the next page's first systems under a brass rule before the full turn", async ({ page }) => {
    await openBandstand(page);
    await page.getByTestId("early-turn").click();
    await page.keyboard.press("PageDown");
    await expect(shown(page)).toHaveAttribute("data-view", "early");
    await expect(shown(page).locator(".pp-early.pp-shown svg")).toHaveCount(2);
    await page.keyboard.press("PageDown");
    await expect(shown(page)).toHaveAttribute("data-view", "full");
    await expect(shown(page)).toHaveAttribute("data-page", "2");
    await page.getByTestId("early-turn").click();
  });

  test("a key remapped in settings turns the page", async ({ page }) => {
    await page.goto("/settings");
    await page.getByTestId("nextKeys-add").click();
    await page.keyboard.press("n");
    await expect(page.getByTestId("nextKeys-list")).toContainText("n");
    await openBandstand(page);
    await page.keyboard.press("n");
    await expect(shown(page)).toHaveAttribute("data-page", "2");
  });

  test("both themes draw the chart; screenshots saved for review", async ({ page }) => {
    await openBandstand(page);
    const stand = page.getByTestId("bandstand");
    await expect(stand).toHaveAttribute("data-theme", "stage");
    await page.screenshot({ path: "test-results/screenshots/bandstand-stage.png" });
    await page.getByTestId("theme-toggle").click();
    await expect(stand).toHaveAttribute("data-theme", "ember");
    await page.screenshot({ path: "test-results/screenshots/bandstand-ember.png" });
    // The drawing takes the theme's colour (currentColor), so the night theme is red on black.
    const color = await shown(page).evaluate((el) => getComputedStyle(el).color);
    expect(color).toBe("rgb(200, 70, 59)");
    await page.getByTestId("theme-toggle").click();
    await expect(stand).toHaveAttribute("data-theme", "stage");
  });

  test("keeps the screen on while open and lets go on leaving", async ({ page }) => {
    await openBandstand(page);
    await expect.poll(() => page.evaluate(() => (window as unknown as { wakeLog: string[] }).wakeLog.join(","))).toContain("request");
    await page.getByTestId("bandstand-exit").click();
    await expect(page).not.toHaveURL(/bandstand/);
    await expect.poll(() => page.evaluate(() => (window as unknown as { wakeLog: string[] }).wakeLog.join(","))).toContain("release");
  });

  test("moves to the next and previous tune of a list", async ({ page }) => {
    await openBandstand(page, `?instrument=bb&list=${CHART_ID},${SECOND_ID}`);
    await expect(page.getByTestId("tune-label")).toContainText("Lanternfish");
    await page.getByTestId("next-tune").click();
    await expect(page.getByTestId("tune-label")).toContainText("Tidewater Waltz");
    await expect(shown(page).locator('[data-sheet="1"] .pp-title')).toHaveText("Tidewater Waltz");
    await page.getByTestId("prev-tune").click();
    await expect(page.getByTestId("tune-label")).toContainText("Lanternfish");
  });

  test("shows the tune's key, tempo and intro at the top, and backs into the last page of the tune before", async ({ page }) => {
    await openBandstand(page, `?instrument=bb&list=${CHART_ID},${SECOND_ID}`);
    const head = page.getByTestId("tune-head");
    await expect(head.getByTestId("head-title")).toHaveText("Lanternfish");
    // A B♭ part reads a major 2nd above concert (MusicXML <transpose> −1/−2): E♭ concert → F written.
    await expect(head.getByTestId("head-key")).toHaveText("Key E♭ concert · F written");
    await expect(head.getByTestId("head-tempo")).toHaveText("♩ = 152");
    await expect(head.getByTestId("head-intro")).toContainText("Intro:");
    await expect(head.getByTestId("head-next")).toHaveText("next: Tidewater Waltz");
    const box = await head.boundingBox();
    expect(box!.y).toBeLessThanOrEqual(1);
    expect(box!.x + box!.width).toBeLessThanOrEqual(390);

    const pages = await pageCount(page);
    for (let p = 2; p <= pages; p++) {
      await page.keyboard.press("PageDown");
      await expect(shown(page)).toHaveAttribute("data-page", String(p));
    }
    await page.keyboard.press("PageDown");
    await expect(head.getByTestId("head-title")).toHaveText("Tidewater Waltz");
    await expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached({ timeout: 30_000 });
    await expect(shown(page)).toHaveAttribute("data-page", "1");
    // The same back pedal, and a tap on the left, each go back across the tune boundary to its last page.
    await page.keyboard.press("PageUp");
    await expect(head.getByTestId("head-title")).toHaveText("Lanternfish");
    await expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached({ timeout: 30_000 });
    await expect(shown(page)).toHaveAttribute("data-page", String(pages));
    await expect(page.getByTestId("page-counter")).toHaveText(`${pages} / ${pages}`);
    await page.keyboard.press("PageDown");
    await expect(head.getByTestId("head-title")).toHaveText("Tidewater Waltz");
    await expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached({ timeout: 30_000 });
    await page.getByTestId("tap-back").click();
    await expect(head.getByTestId("head-title")).toHaveText("Lanternfish");
    await expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached({ timeout: 30_000 });
    await expect(shown(page)).toHaveAttribute("data-page", String(pages));
  });

  test("the bandstand view has no serious accessibility problems", async ({ page }) => {
    await openBandstand(page);
    await expectNoSeriousA11yIssues(page, "the bandstand view");
  });
});
