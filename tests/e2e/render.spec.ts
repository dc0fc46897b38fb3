// The chart page draws each part in its written key with the chosen intro, with no request leaving
// the origin while it draws. Runs against the built app with the demo seed.
import { expect, test, type Page } from "@playwright/test";
import { arrange, parseChartText, INTRO_KINDS } from "../../lib/chart";
import { DEMO_CHARTS } from "../../db/demo-charts";
import { demoId } from "../../db/seed";
import { signIn } from "./helpers/auth";
import { expectNoSeriousA11yIssues } from "./helpers/axe";
import { DEMO_BAND_ID, demoPlayer } from "./helpers/demo";

const LANTERNFISH = DEMO_CHARTS.find((c) => c.slug === "lanternfish")!;
const CHART_ID = demoId("chart:lanternfish");
const chartUrl = (query: string) => `/bands/${DEMO_BAND_ID}/charts/${CHART_ID}${query}`;
// SMuFL code points (SMuFL 1.4, "Standard accidentals"): accidentalFlat U+E260, accidentalSharp U+E262.
const FLAT = "\uE260";
const SHARP = "\uE262";

async function openChart(page: Page, query: string) {
  await page.goto(chartUrl(query));
  await expect(page.locator('[data-testid="chart-page"][data-drawn="true"]')).toBeVisible({ timeout: 30_000 });
}

/** Accidentals in the first line's key signature of the shown page. */
async function keySignature(page: Page): Promise<{ flats: number; sharps: number }> {
  const text = await page.locator('[data-testid="chart-page"] [data-sheet="1"] svg').evaluate((svg) => {
    const ks = svg.querySelector(".vf-keysignature");
    return ks ? (ks.textContent ?? "") : "";
  });
  return { flats: [...text].filter((c) => c === FLAT).length, sharps: [...text].filter((c) => c === SHARP).length };
}

test.describe("chart page", () => {
  test.beforeEach(async ({ page }) => {
    const player = demoPlayer();
    await signIn(page, player.email, player.password, `/bands/${DEMO_BAND_ID}`);
  });

  test("a concert E♭ chart read as a B♭ part is in F (one flat) with C7sus4 for Bb7sus4", async ({ page }) => {
    const outside: string[] = [];
    const origin = new URL(page.url()).origin;
    page.on("request", (r) => {
      const u = r.url();
      if (!u.startsWith(origin) && !u.startsWith("data:") && !u.startsWith("blob:")) outside.push(u);
    });
    await openChart(page, "?instrument=bb");
    // A B♭ part is written a major 2nd above concert (MusicXML 4.0 <transpose> −1/−2, REFERENCES.md):
    // E♭ major → F major, one flat (Gardner 1912); Bb7sus4 → C7sus4.
    expect(await keySignature(page)).toEqual({ flats: 1, sharps: 0 });
    const sheet = page.locator('[data-testid="chart-page"] [data-sheet="1"]');
    await expect(sheet.locator('.pp-chord[data-symbol="C7sus4"]').first()).toBeVisible();
    await expect(sheet.locator('.pp-chord[data-symbol="Bb7sus4"]')).toHaveCount(0);
    await expect(sheet.locator(".pp-part")).toHaveText("B♭ part");
    await expect(sheet.locator(".pp-title")).toHaveText("Lanternfish");
    await expect(page.locator('[data-testid="chart-page"]')).toHaveAttribute("data-page", "1");
    await expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached();
    expect(outside, "requests that left the origin while drawing").toEqual([]);
    await page.screenshot({ path: "test-results/screenshots/chart-page-bb.png" });
  });

  test("the same chart as an E♭ part is in C major: no sharps or flats", async ({ page }) => {
    await openChart(page, "?instrument=eb");
    // E♭ part: a major 6th above concert (MusicXML <transpose> −5/−9): E♭ → C, no accidentals.
    expect(await keySignature(page)).toEqual({ flats: 0, sharps: 0 });
    // Bb7sus4 a major 6th up is G7sus4.
    await expect(page.locator('[data-testid="chart-page"] [data-sheet="1"] .pp-chord[data-symbol="G7sus4"]').first()).toBeVisible();
  });

  test("the concert part keeps E♭ (three flats) and Bb7sus4", async ({ page }) => {
    await openChart(page, "?instrument=concert");
    expect(await keySignature(page)).toEqual({ flats: 3, sharps: 0 });
    await expect(page.locator('[data-testid="chart-page"] [data-sheet="1"] .pp-chord[data-symbol="Bb7sus4"]').first()).toBeVisible();
  });

  for (const kind of INTRO_KINDS) {
    test(`the ${kind} intro is drawn bar for bar under an intro label`, async ({ page }) => {
      const chart = parseChartText(LANTERNFISH.text);
      const expected = arrange(chart, { instrument: "concert", intro: { kind } }).bars.filter((b) => b.part === "intro");
      await openChart(page, `?instrument=concert&intro=${kind}`);
      await expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached();
      const drawn = page.locator('[data-testid="chart-page"] [data-sheet] .pp-bar.pp-intro');
      await expect(drawn).toHaveCount(expected.length);
      if (expected.length === 0) return;
      await expect(page.locator('[data-testid="chart-page"] [data-sheet="1"] .pp-intro-label').first()).toHaveText("Intro");
      // The first intro bar's symbols, as the arrangement has them.
      const first = expected[0]!;
      const symbols = await drawn.first().locator(".pp-chord").evaluateAll((els) => els.map((e) => e.getAttribute("data-symbol")));
      expect(symbols).toEqual(first.simile ? [] : first.chords.map((c) => c.symbol));
    });
  }

  test("the pickers change the part and the intro and keep them in the address", async ({ page }) => {
    await openChart(page, "?instrument=concert");
    await page.getByTestId("instrument-picker").selectOption("bb");
    await expect(page).toHaveURL(/instrument=bb/);
    await expect(page.locator('[data-testid="chart-page"] [data-sheet="1"] .pp-part')).toHaveText("B♭ part");
    await page.getByTestId("intro-picker").locator('[data-kind="vamp"] input').click();
    await expect(page).toHaveURL(/intro=vamp/);
    await expect(page.getByTestId("intro-picker").locator('[data-kind="vamp"] input')).toBeChecked();
    await expect(page.locator('[data-testid="chart-page"] [data-sheet="1"] .pp-intro-label').first()).toHaveText("Intro");
    await expect(page.getByTestId("intro-picker").locator("[data-kind]")).toHaveCount(INTRO_KINDS.length);
  });

  test("the print view is the part alone, black on white, one page per sheet", async ({ page }) => {
    await openChart(page, "?instrument=bb");
    await expect(page.locator(".pp-print [data-sheet] svg").first()).toBeAttached({ timeout: 10_000 });
    await page.emulateMedia({ media: "print" });
    await expect(page.locator(".pp-print [data-sheet]").first()).toBeVisible();
    await expect(page.getByTestId("chart-page")).toBeHidden();
    await expect(page.getByTestId("instrument-picker")).toBeHidden();
    const color = await page.locator(".pp-print").evaluate((el) => getComputedStyle(el).color);
    expect(color).toBe("rgb(0, 0, 0)");
    const breaks = await page.locator(".pp-print [data-sheet]").first().evaluate((el) => getComputedStyle(el).breakAfter);
    expect(breaks).toBe("page");
    await page.emulateMedia({ media: "screen" });
  });

  test("a laptop screen (1280×720) shows at least four systems on the first page", async ({ page }) => {
    await page.setViewportSize({ width: 1280, height: 720 });
    await openChart(page, "?instrument=bb");
    const chartPage = page.locator('[data-testid="chart-page"]');
    await page.screenshot({ path: "test-results/screenshots/chart-page-laptop.png" });
    expect(Number(await chartPage.getAttribute("data-systems"))).toBeGreaterThanOrEqual(4);
    // Counted on the drawing too: distinct staves on the first sheet, each inside the page frame.
    const staves = await chartPage.locator('[data-sheet="1"] .vf-stave').evaluateAll((els) =>
      els.map((e) => {
        const r = e.getBoundingClientRect();
        return { top: Math.round(r.top), bottom: r.bottom };
      }),
    );
    expect(new Set(staves.map((t) => t.top)).size).toBeGreaterThanOrEqual(4);
    const frame = (await chartPage.boundingBox())!;
    for (const t of staves) expect(t.bottom).toBeLessThanOrEqual(Math.min(720, frame.y + frame.height));
  });

  test("a set list's tempo replaces the chart's in the title block", async ({ page }) => {
    await openChart(page, "?instrument=bb&tempo=132");
    const details = page.locator('[data-testid="chart-page"] [data-sheet="1"] .pp-details');
    await expect(details).toContainText("♩ = 132");
    // Lanternfish is written at 152 (demo chart); an unreadable tempo falls back to it.
    await expect(details).not.toContainText("♩ = 152");
    await openChart(page, "?instrument=bb&tempo=fast");
    await expect(page.locator('[data-testid="chart-page"] [data-sheet="1"] .pp-details')).toContainText("♩ = 152");
  });

  test("the intro previews show the chords as the part reads them", async ({ page }) => {
    const chart = parseChartText(LANTERNFISH.text);
    for (const instrument of ["bb", "eb", "concert"] as const) {
      await openChart(page, `?instrument=${instrument}`);
      for (const kind of ["dominant-pedal", "two-five"] as const) {
        // The arrangement's intro bars are already in the part's written key (lib/chart arrange).
        const bars = arrange(chart, { instrument, intro: { kind } }).bars.filter((b) => b.part === "intro");
        const firstChords = bars.find((b) => !b.simile && b.chords.length)!.chords.map((c) => c.symbol);
        const preview = page.getByTestId("intro-picker").locator(`[data-kind="${kind}"] [data-testid="intro-preview"]`);
        for (const symbol of firstChords) await expect(preview).toContainText(symbol);
      }
    }
    // Concert Bb7sus4 (the dominant pedal in E♭) is read as C7sus4 on a B♭ part.
    await openChart(page, "?instrument=bb");
    const pedal = page.getByTestId("intro-picker").locator('[data-kind="dominant-pedal"] [data-testid="intro-preview"]');
    await expect(pedal).not.toContainText("Bb7sus4");
  });

  test("on a 390px phone the intro options wrap inside the screen", async ({ page }) => {
    await page.setViewportSize({ width: 390, height: 844 });
    await openChart(page, "?instrument=eb");
    const options = page.getByTestId("intro-picker").locator("label");
    const count = await options.count();
    expect(count).toBe(INTRO_KINDS.length + 1);
    for (let i = 0; i < count; i++) {
      const box = (await options.nth(i).boundingBox())!;
      expect(box.x).toBeGreaterThanOrEqual(0);
      expect(box.x + box.width, `intro option ${i} fits the phone`).toBeLessThanOrEqual(390);
    }
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await expectNoSeriousA11yIssues(page, "the chart page on a phone");
  });

  test("the chart page has no serious accessibility problems", async ({ page }) => {
    await openChart(page, "?instrument=bb");
    await expectNoSeriousA11yIssues(page, "the chart page");
  });
});
