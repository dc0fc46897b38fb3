// Issue 16, the desk items, as a person sees them: set durations (24), the demo's gig (25), a new set
// list that stores nothing until saved, a Save that says why it is disabled and one inline way of
// asking (14), a share's end that follows the gig time on screen (5), intro and key choices (20),
// archiving a chart (19), where a one-band player lands and what a phone shows first (21), the sub's
// screens (10), and zero console errors on every page (11: a guard that stays off until the hydration mismatch is found).
import { expect, test, type Page } from "@playwright/test";
import { DEMO_ACCOUNTS, DEMO_GIG_ID } from "../../db/seed";
import { signIn } from "./helpers/auth";
import { expectNoSeriousA11yIssues } from "./helpers/axe";
import { watchConsole } from "./helpers/console";
import { DEMO_BAND_ID } from "./helpers/demo";
import { addChart, chartId } from "./helpers/gig";

const band = `/bands/${DEMO_BAND_ID}`;
const account = (role: string) => DEMO_ACCOUNTS.find((a) => a.role === role)!;
const asRole = (page: Page, role: string, to: string) => signIn(page, account(role).email, account(role).password, to);

test.describe("desk items of issue 16", () => {
  

  test("item 11: pages load with no console error and /favicon.ico is served", async ({ page, request }) => {
    test.setTimeout(180_000);
    const watch = watchConsole(page);
    expect((await request.get("/favicon.ico")).status()).toBe(200);
    for (const path of ["/", "/signin", "/signup"]) {
      await page.goto(path);
      await page.waitForLoadState("networkidle");
    }
    await asRole(page, "leader", band);
    await expect(page.getByTestId("library-row").first()).toBeVisible({ timeout: 30_000 });
    for (const path of [
      band,
      `${band}/setlists`,
      `${band}/setlists/${DEMO_GIG_ID}`,
      `${band}/charts/${chartId("lanternfish")}`,
      `${band}/charts/${chartId("lanternfish")}/edit`,
      `${band}/charts/new`,
      `${band}/plan`,
      `${band}/members`,
      `${band}/import`,
      "/settings",
    ]) {
      await page.goto(path);
      await page.waitForLoadState("networkidle");
    }
    watch.expectClean();
  });

  test("items 24 and 25: tonight's demo gig shows each set's length against the leader's, and follows a tempo change live", async ({ page }) => {
    await asRole(page, "leader", `${band}/setlists`);
    const link = page.getByTestId("setlist-link").filter({ hasText: "Tonight at The Lanternfish Room" });
    await expect(link).toContainText("The Lanternfish Room", { timeout: 30_000 });
    await expect(link).toContainText("12 tunes");
    await link.click();
    await expect(page.getByTestId("set-1").getByTestId("set-tune")).toHaveCount(6, { timeout: 30_000 });
    await expect(page.getByTestId("set-2").getByTestId("set-tune")).toHaveCount(6);
    const length = page.getByTestId("set-length-1");
    await expect(length).toHaveText(/^Set 1: \d+ min of 45/);
    await expect(page.getByTestId("set-length-2")).toHaveText(/^Set 2: \d+ min of 45/);
    const before = await length.innerText();
    const first = page.getByTestId("set-1").getByTestId("set-tune").first();
    await expect(first.getByTestId("tune-length")).toHaveText(/about \d+:\d\d/);
    await first.getByTestId("arrange-tune").click();
    await first.getByTestId("tune-tempo").fill("60");
    await expect(length).not.toHaveText(before);
    await page.getByTestId("set-target-1").fill("30");
    await expect(length).toContainText("of 30");
    await expectNoSeriousA11yIssues(page, "gig editor with set lengths");
  });

  test("item 14: a new set list stores nothing until saved, a disabled Save says why, and delete asks inline", async ({ page }) => {
    page.on("dialog", (d) => {
      throw new Error(`a browser pop-up asked: ${d.message()}`);
    });
    await asRole(page, "leader", `${band}/setlists`);
    await expect(page.getByTestId("setlist-link").first()).toBeVisible({ timeout: 30_000 });
    const count = await page.getByTestId("setlist-link").count();
    await page.getByTestId("new-setlist").click();
    await expect(page.getByTestId("gig-name")).toBeVisible({ timeout: 20_000 });
    await expect(page.getByTestId("save-setlist")).toBeDisabled();
    await expect(page.getByTestId("save-blocked")).toHaveText("Give the set list a name to save it.");
    await page.goto(`${band}/setlists`);
    await expect(page.getByTestId("setlist-link").first()).toBeVisible({ timeout: 30_000 });
    await expect(page.getByTestId("setlist-link")).toHaveCount(count);

    // Item 5: a share's end follows the gig's time as it stands on the screen, before any reload.
    await page.getByTestId("new-setlist").click();
    await page.getByTestId("gig-name").fill("Harbour wall matinee");
    await page.getByTestId("save-setlist").click();
    await expect(page.getByTestId("save-state")).toHaveText("Saved.");
    await page.getByTestId("gig-when").fill("2027-03-05T20:00");
    await expect(page.getByTestId("share-until")).toHaveValue("2027-03-06T06:00");

    await page.getByTestId("delete-setlist").click();
    await expect(page.getByTestId("delete-setlist-confirm")).toContainText("Delete “Harbour wall matinee” for the whole band?");
    await page.getByTestId("delete-setlist-confirm-yes").click();
    await expect(page).toHaveURL(new RegExp(`${band}/setlists$`));
    await expect(page.getByTestId("setlist-link")).toHaveCount(count);
  });

  test("item 20: one as-written intro, a way to go straight in, and no repeated key", async ({ page }) => {
    await asRole(page, "leader", `${band}/setlists/${DEMO_GIG_ID}`);
    const lanternfish = page.getByTestId("set-2").getByTestId("set-tune").first();
    await expect(lanternfish).toHaveAttribute("data-title", "Lanternfish", { timeout: 30_000 });
    await lanternfish.getByTestId("arrange-tune").click();
    const intro = lanternfish.getByTestId("intro-kind").locator("option");
    const labels = await intro.allInnerTexts();
    expect(labels.filter((l) => /own intro|composed/i.test(l))).toHaveLength(1);
    expect(labels[0]).toMatch(/^The chart's own intro \(\d+ bars\)$/);
    expect(labels.filter((l) => l === "No intro, straight in at the top")).toHaveLength(1);
    const keys = await lanternfish.getByTestId("tune-key").locator("option").allInnerTexts();
    expect(keys.filter((k) => k === "E♭")).toEqual([]);
    expect(keys[0]).toBe("As written (E♭)");
    await lanternfish.getByTestId("intro-kind").selectOption({ label: "No intro, straight in at the top" });
    await lanternfish.getByTestId("arrange-tune").click();
    await expect(lanternfish).toContainText("Intro: none, straight in at the top");
  });

  test("item 19: a leader archives a chart, it leaves the library, and comes back from the archive", async ({ page }) => {
    await asRole(page, "leader", band);
    await expect(page.getByTestId("library-row").first()).toBeVisible({ timeout: 30_000 });
    const id = await addChart(page, { title: "Barnacle Two-Step", key: "G", tempo: 140, text: "A:\n| G | C | D7 | G |\n" });
    await page.goto(`${band}/charts/${id}/edit`);
    await page.getByTestId("archive-chart").click();
    await page.getByTestId("archive-confirm-yes").click();
    await expect(page).toHaveURL(new RegExp(`${band}$`), { timeout: 30_000 });
    await expect(page.getByTestId("library-row").first()).toBeVisible({ timeout: 30_000 });
    await expect(page.getByTestId("library-row").filter({ hasText: "Barnacle Two-Step" })).toHaveCount(0, { timeout: 30_000 });
    await page.getByTestId("archive").locator("summary").click();
    const held = page.getByTestId("archived-chart").filter({ hasText: "Barnacle Two-Step" });
    await held.getByTestId("bring-back").click();
    await expect(page.getByTestId("library-row").filter({ hasText: "Barnacle Two-Step" })).toHaveCount(1, { timeout: 30_000 });
    // Leave the book as the demo seeded it for the specs that count its charts.
    const origin = new URL(page.url()).origin;
    const gone = await page.request.delete(`/api/bands/${DEMO_BAND_ID}/charts/${id}`, { headers: { Origin: origin } });
    expect(gone.ok(), `DELETE answered ${gone.status()}`).toBeTruthy();
  });

  test("item 21: a one-band player lands on the library, and on a phone the first chart shows above the fold", async ({ page }) => {
    await page.setViewportSize({ width: 390, height: 700 });
    await asRole(page, "player", "/bands");
    await expect(page).toHaveURL(new RegExp(`${band}$`), { timeout: 30_000 });
    const first = page.getByTestId("library-row").first();
    await expect(first).toBeVisible({ timeout: 30_000 });
    const box = await first.boundingBox();
    expect(box!.y + Math.min(box!.height, 44)).toBeLessThanOrEqual(700);
  });

  test("item 10: a sub has no MusicXML button they cannot use, and a chart not shared reads as a refusal", async ({ page }) => {
    await asRole(page, "sub", `${band}/setlists/${DEMO_GIG_ID}`);
    await expect(page.getByTestId("gig-title")).toHaveText("Tonight at The Lanternfish Room", { timeout: 30_000 });
    await page.goto(`${band}/charts/${chartId("lanternfish")}`);
    await expect(page.locator('[data-testid="chart-page"]')).toBeVisible({ timeout: 30_000 });
    await expect(page.getByTestId("export-musicxml")).toHaveCount(0);
    await page.goto(`${band}/charts/${chartId("driftwood-ledger")}`);
    await expect(page.getByTestId("sub-refused")).toContainText("This chart is not shared with you", { timeout: 30_000 });
    await expect(page.getByText(/not reached this device/)).toHaveCount(0);
  });
});
