// Tonight's gig end to end: the leader builds a two-set gig with per-tune keys and intros and
// shares it with a sub; the sub opens it with no signal as an E♭ part and pedals across the tune
// boundary; a player's private mark shows for them in B♭ and concert, and never for the leader.
import { expect, test, type Browser, type Page } from "@playwright/test";
import { demoId } from "../../db/seed";
import { newPerson, fillSignUp, signIn } from "./helpers/auth";
import { DEMO_BAND_ID, demoLeader, demoPlayer } from "./helpers/demo";
import { waitForLink } from "./helpers/mail";

const LANTERNFISH = demoId("chart:lanternfish");
const setlistsUrl = `/bands/${DEMO_BAND_ID}/setlists`;
const shown = (page: Page) => page.locator('[data-testid="chart-page"]');

async function drawn(page: Page) {
  await expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached({ timeout: 30_000 });
}

async function freshPage(browser: Browser): Promise<Page> {
  const context = await browser.newContext();
  return context.newPage();
}

/** Opens the arrangement of the n-th tune in a set and sets key and intro. */
async function arrange(page: Page, set: number, key: string, introKind: string, bars?: string) {
  const tune = page.getByTestId(`set-${set}`).getByTestId("set-tune").first();
  await tune.getByTestId("arrange-tune").click();
  await tune.getByTestId("tune-key").selectOption(key);
  await tune.getByTestId("intro-kind").selectOption(introKind);
  if (bars) await tune.getByTestId("intro-bars").fill(bars);
  await expect(tune.getByTestId("intro-fit")).not.toBeEmpty();
  await tune.getByTestId("arrange-tune").click();
}

test.describe("tonight's gig", () => {
  test.describe.configure({ mode: "serial" });
  test.use({ viewport: { width: 390, height: 700 } });

  const sub = newPerson("Sub");
  let setlistUrl = "";

  test("the leader builds a two-set gig with keys and intros and shares it with a sub", async ({ page, request }) => {
    const leader = demoLeader();
    await signIn(page, leader.email, leader.password, setlistsUrl);
    await page.getByTestId("new-setlist").click();
    await expect(page.getByTestId("gig-name")).toBeVisible({ timeout: 20_000 });
    setlistUrl = new URL(page.url()).pathname;

    await page.getByTestId("gig-name").fill("Thursday at the Lanternfish Room");
    await page.getByTestId("gig-venue").fill("The Lanternfish Room");
    await page.getByTestId("add-chart-1").selectOption({ label: "Lanternfish (Eb)" });
    await page.getByTestId("add-tune-1").click();
    await page.getByTestId("add-set").click();
    await page.getByTestId("add-chart-2").selectOption({ label: "Tidewater Waltz (G)" });
    await page.getByTestId("add-tune-2").click();
    await arrange(page, 1, "F", "dominant-pedal", "4");
    await arrange(page, 2, "A", "turnaround");
    // Tonight's tempo for the first tune, carried to its chart page and the bandstand header.
    const first = page.getByTestId("set-1").getByTestId("set-tune").first();
    await first.getByTestId("arrange-tune").click();
    await first.getByTestId("tune-tempo").fill("144");
    await first.getByTestId("arrange-tune").click();
    await page.getByTestId("save-setlist").click();
    await expect(page.getByTestId("save-state")).toHaveText("Saved.");
    await expect(page.getByTestId("set-1").getByTestId("set-tune")).toContainText("Key F");
    await expect(page.getByTestId("set-2").getByTestId("set-tune")).toContainText("Intro: I-vi-ii-V turnaround");

    await page.getByTestId("share-email").fill(sub.email);
    await page.getByTestId("share-send").click();
    await expect(page.getByTestId("share-result")).toContainText(`Sent to ${sub.email}`);
    await expect(page.getByTestId("share-row")).toContainText("not opened yet");
    expect(await waitForLink(request, sub.email, /http:\/\/[^\s"<]+\/share\/[A-Za-z0-9_-]+/)).toContain("/share/");

    // Opened on its own chart page, the tune keeps tonight's tempo (not the chart's 152) in the title block.
    await page.getByTestId("set-1").getByTestId("open-tune").first().click();
    await expect(page).toHaveURL(/[?&]tempo=144(&|$)/);
    await expect(page).toHaveURL(/[?&]key=F(&|$)/);
    await drawn(page);
    const details = shown(page).locator('[data-sheet="1"] .pp-details');
    await expect(details).toContainText("♩ = 144");
    await expect(details).not.toContainText("♩ = 152");
  });

  test("the sub signs up from the link and plays the set offline as an E♭ part", async ({ browser, request }) => {
    const link = await waitForLink(request, sub.email, /http:\/\/[^\s"<]+\/share\/[A-Za-z0-9_-]+/);
    const page = await freshPage(browser);
    await page.goto(new URL(link).pathname);
    await expect(page.getByTestId("share-title")).toHaveText("Thursday at the Lanternfish Room");
    await page.getByTestId("share-signup").click();
    await fillSignUp(page, sub);
    await page.getByTestId("share-accept").click();
    await expect(page.getByTestId("gig-title")).toHaveText("Thursday at the Lanternfish Room", { timeout: 30_000 });
    await expect(page.getByTestId("set-tune")).toHaveCount(2);

    // Once online, so the service worker holds the shells; then no signal at all.
    await page.goto(`${setlistUrl}/play?instrument=eb`);
    await drawn(page);
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    // The first load is not controlled until the worker claims it; a reload always is.
    if (!(await page.evaluate(() => Boolean(navigator.serviceWorker.controller)))) await page.reload();
    await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller)), { timeout: 30_000 }).toBe(true);
    await drawn(page);
    await page.context().setOffline(true);
    await page.reload();
    await drawn(page);
    await expect(page.getByTestId("offline-badge")).toBeVisible();

    const label = page.getByTestId("tune-label");
    await expect(label).toContainText("Lanternfish");
    // in the player's part key, concert named beside it (E♭ part: concert F reads D, a major 6th above)
    await expect(label).toContainText("Key D (concert F)");
    await expect(label).toContainText("Intro: dominant pedal, 4 bars");
    await expect(page.getByTestId("next-up")).toContainText("Next: Tidewater Waltz");
    // The same plan at the top of the screen, inside a 390px phone's width.
    // An E♭ part reads a major 6th above concert (MusicXML <transpose> −5/−9): F concert → D written.
    const head = page.getByTestId("tune-head");
    await expect(head.getByTestId("head-title")).toHaveText("Lanternfish");
    await expect(head.getByTestId("head-key")).toHaveText("Key F concert · D written");
    await expect(head.getByTestId("head-tempo")).toHaveText("♩ = 144");
    await expect(head.getByTestId("head-intro")).toHaveText("Intro: dominant pedal, 4 bars");
    await expect(head.getByTestId("head-next")).toHaveText("next: Tidewater Waltz");
    const headBox = await head.boundingBox();
    const chartBox = await shown(page).boundingBox();
    expect(headBox!.y).toBeLessThanOrEqual(1);
    expect(chartBox!.y).toBeGreaterThanOrEqual(headBox!.y + headBox!.height - 1);
    for (const part of ["head-title", "head-key", "head-tempo", "head-intro", "head-next"]) {
      const box = await head.getByTestId(part).boundingBox();
      expect(box!.x + box!.width, `${part} fits the phone`).toBeLessThanOrEqual(390);
    }
    await expect(shown(page).locator(".pp-part").first()).toContainText("E♭");

    const pages = Number(await shown(page).getAttribute("data-pages"));
    for (let p = 2; p <= pages; p++) {
      await page.keyboard.press("PageDown");
      await expect(shown(page)).toHaveAttribute("data-page", String(p));
    }
    // The same pedal on the last page goes on to the next tune's first page.
    await page.keyboard.press("PageDown");
    await expect(label).toContainText("Tidewater Waltz");
    await expect(label).toContainText("Intro: I-vi-ii-V turnaround");
    await drawn(page);
    await expect(shown(page)).toHaveAttribute("data-page", "1");
    await expect(head.getByTestId("head-title")).toHaveText("Tidewater Waltz");
    await expect(head.getByTestId("head-key")).toContainText("Key A concert");
    await expect(head.getByTestId("head-next")).toHaveCount(0);
    // Back from the first page of a tune is the last page of the one before, as the band played it.
    await page.keyboard.press("PageUp");
    await expect(label).toContainText("Lanternfish");
    await drawn(page);
    await expect(shown(page)).toHaveAttribute("data-page", String(pages));
    await expect(head.getByTestId("head-title")).toHaveText("Lanternfish");
    await page.context().close();
  });

  test("a player's mark shows for them in B♭ and concert, and not for the leader", async ({ browser }) => {
    const player = demoPlayer();
    const page = await freshPage(browser);
    const chartUrl = `/bands/${DEMO_BAND_ID}/charts/${LANTERNFISH}`;
    await signIn(page, player.email, player.password, `${chartUrl}?instrument=bb`);
    await drawn(page);
    const panel = page.getByTestId("marks-panel");
    await panel.getByTestId("mark-section").selectOption({ index: 1 });
    await panel.getByTestId("mark-bar").fill("2");
    await panel.getByTestId("mark-text").fill("watch the Gb7");
    await panel.getByTestId("mark-save").click();
    await expect(panel.getByTestId("my-mark")).toContainText("watch the Gb7");
    await expect(shown(page).locator('[data-mark="watch the Gb7"]').first()).toBeAttached({ timeout: 15_000 });

    await page.goto(`${chartUrl}?instrument=concert`);
    await drawn(page);
    await expect(shown(page).locator('[data-mark="watch the Gb7"]').first()).toBeAttached({ timeout: 15_000 });
    await page.context().close();

    const leaderPage = await freshPage(browser);
    const leader = demoLeader();
    await signIn(leaderPage, leader.email, leader.password, `${chartUrl}?instrument=concert`);
    await drawn(leaderPage);
    await expect(leaderPage.getByTestId("marks-panel")).toBeVisible();
    await expect(leaderPage.getByTestId("my-mark")).toHaveCount(0);
    await expect(shown(leaderPage).locator("[data-mark]")).toHaveCount(0);
    await leaderPage.context().close();
  });
});
