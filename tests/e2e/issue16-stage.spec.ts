// Issue 16, what a player sees on the bandstand and in the drawn chart: each test is named after its
// item. Runs in both the laptop and the 390 px phone project (playwright.config.ts).
import { expect, test, type Page } from "@playwright/test";
import { signIn } from "./helpers/auth";
import { DEMO_GIG_ID } from "../../db/seed";
import { DEMO_BAND_ID, demoLeader, demoPlayer } from "./helpers/demo";
import { addChart, addGig, chartId, waitForBook } from "./helpers/gig";
import { CROWDED_TEXT, CROWDED_TITLE } from "./helpers/crowded";

const LANTERNFISH = chartId("lanternfish");
const band = `/bands/${DEMO_BAND_ID}`;
const shown = (page: Page) => page.locator('[data-testid="chart-page"]');
const drawn = (page: Page) => expect(page.locator('[data-testid="chart-page"][data-drawn-all="true"]')).toBeAttached({ timeout: 30_000 });

test.describe("issue 16 on the bandstand and in the drawing", () => {
  test.describe.configure({ mode: "serial" });
  let gig = "";
  let crowded = "";
  let worldly = "";
  const WORLDLY_TITLE = "Ночной порт 夜の港 🎷 Baía";

  test.beforeEach(async ({ page }) => {
    const leader = demoLeader();
    await signIn(page, leader.email, leader.password, band);
    if (!gig) {
      crowded = await addChart(page, { title: CROWDED_TITLE, key: "C", tempo: 180, composer: "Odile Marchbank", text: CROWDED_TEXT });
      worldly = await addChart(page, { title: WORLDLY_TITLE, key: "F", text: "A:\n| Fmaj7 | Gm7 C7 |\n" });
      gig = await addGig(page, "A very long night at the Lanternfish Room", [
        { chartId: chartId("slow-tide-at-fennick-quay") },
        { chartId: chartId("low-fog-over-carrow-point"), ending: { kind: "tag", bars: 4, times: 3 } },
        { chartId: chartId("morning-at-the-ropewalk") },
      ]);
    }
    await waitForBook(page, "Harbourmaster");
  });

  test("item 1: Close on the bandstand view comes back to a chart page with the app header", async ({ page }) => {
    await page.goto(`${band}/charts/${LANTERNFISH}`);
    await drawn(page);
    await page.getByTestId("open-bandstand").click();
    await drawn(page);
    await expect(page.getByTestId("nav-library")).toHaveCount(0);
    await page.getByTestId("bandstand-exit").click();
    await expect(page).not.toHaveURL(/bandstand/);
    await expect(page.getByTestId("nav-library")).toBeVisible();
    await expect(page.getByTestId("sign-out")).toBeVisible();
    await expect(page.getByTestId("sync-bar")).toBeVisible();
  });

  test("item 2: nothing on the set's play bar wraps or leaves a 360–430 px screen; long titles end in an ellipsis", async ({ page }) => {
    for (const width of [360, 390, 430]) {
      await page.setViewportSize({ width, height: 760 });
      await page.goto(`${band}/setlists/${gig}/play`);
      await drawn(page);
      const bar = page.getByRole("navigation", { name: "Bandstand controls" });
      const box = (await bar.boundingBox())!;
      const parts = await bar.evaluate((el) =>
        [...el.children].map((c) => {
          const r = c.getBoundingClientRect();
          const s = getComputedStyle(c);
          return { id: (c as HTMLElement).dataset.testid ?? c.tagName, left: r.left, right: r.right, height: r.height, shown: s.display !== "none", lineHeight: parseFloat(s.lineHeight) || 24 };
        }),
      );
      for (const p of parts.filter((x) => x.shown)) {
        expect(p.left, `${p.id} at ${width}px`).toBeGreaterThanOrEqual(0);
        expect(p.right, `${p.id} at ${width}px`).toBeLessThanOrEqual(width);
        // One line each: no taller than the bar itself.
        expect(p.height, `${p.id} wraps at ${width}px`).toBeLessThanOrEqual(box.height);
      }
      await expect(page.getByTestId("theme-toggle")).toBeInViewport();
      const label = page.getByTestId("tune-label");
      await expect(label).toHaveCSS("text-overflow", "ellipsis");
      await expect(label).toHaveCSS("white-space", "nowrap");
    }
  });

  test("issue 11: the gig's call, follow and tune-list buttons fit the bar of a 390 px phone", async ({ page, browser }) => {
    // The leader's bar has "Call next" and "Tunes"; a player's has "Follow" and "Tunes".
    const player = demoPlayer();
    const ctx = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const other = await ctx.newPage();
    await signIn(other, player.email, player.password, band);
    await waitForBook(other, "Harbourmaster");
    await page.setViewportSize({ width: 390, height: 844 });
    for (const [who, own] of [
      [page, "call-next"],
      [other, "follow-toggle"],
    ] as const) {
      await who.goto(`${band}/setlists/${DEMO_GIG_ID}/play`);
      await drawn(who);
      await expect(who.getByTestId(own)).toBeVisible();
      await expect(who.getByTestId("tune-list-toggle")).toHaveAccessibleName("Tunes");
      const bar = who.getByRole("navigation", { name: "Bandstand controls" });
      const fit = await bar.evaluate((el) => ({ bar: el.scrollWidth - el.clientWidth, page: document.documentElement.scrollWidth - window.innerWidth }));
      expect(fit, `${own}: nothing runs past the bar or the screen`).toEqual({ bar: 0, page: 0 });
      for (const id of [own, "tune-list-toggle", "theme-toggle", "early-turn"]) await expect(who.getByTestId(id)).toBeInViewport({ ratio: 1 });
    }
    await ctx.close();
  });

  test("item 18: the set list and the printed set list name keys in the player's part, concert labelled", async ({ browser }) => {
    // Priya reads the E♭ part: every key is her written key, with the concert key named as such.
    const player = demoPlayer();
    const ctx = await browser.newContext();
    const page = await ctx.newPage();
    await signIn(page, player.email, player.password, band);
    await waitForBook(page, "Harbourmaster");
    const partKey = /^(Key )?–? ?[A-G][♭♯]?m? \(concert [A-G][♭♯]?m?\)$/;
    await page.goto(`${band}/setlists/${DEMO_GIG_ID}`);
    const shownKey = page.getByTestId("tune-key-shown").first();
    await expect(shownKey).toHaveText(partKey, { timeout: 30_000 });
    await page.goto(`${band}/setlists/${DEMO_GIG_ID}/print`);
    await expect(page.getByTestId("printed-key").first()).toHaveText(partKey, { timeout: 30_000 });
    await ctx.close();
  });

  test("item 3: a tag ending is drawn as the tagged bars inside repeat signs marked ×3, on screen and in print", async ({ page }) => {
    await page.goto(`${band}/setlists/${gig}/play?tune=2`);
    await drawn(page);
    const last = shown(page).locator("[data-sheet]").last();
    await expect(last.locator(".pp-label", { hasText: "Tag ×3" })).toHaveCount(1);
    await expect(last.locator(".pp-direction", { hasText: "×3" })).toHaveCount(1);
    await expect(last.locator('[data-part="tag"]')).toHaveCount(4);
    // The tune opened from the set list carries the tag to its chart page and print.
    await page.goto(`${band}/charts/${chartId("low-fog-over-carrow-point")}?tag=4x3`);
    await drawn(page);
    await expect(page.locator(".pp-print .pp-label", { hasText: "Tag ×3" })).toHaveCount(1);
    await expect(page.locator('.pp-print [data-part="tag"]')).toHaveCount(4);
  });

  test("item 13: chord symbols, ending numbers, labels and the title keep clear of each other in the drawn SVG", async ({ page }) => {
    await page.goto(`${band}/charts/${crowded}`);
    await drawn(page);
    const problems = await shown(page).evaluate((root) => {
      type Box = { x1: number; y1: number; x2: number; y2: number };
      const out: string[] = [];
      const boxOf = (el: Element): Box => {
        const b = (el as SVGGraphicsElement).getBBox();
        return { x1: b.x, y1: b.y, x2: b.x + b.width, y2: b.y + b.height };
      };
      const meet = (a: Box, b: Box, gap: number) => a.x1 < b.x2 + gap && b.x1 < a.x2 + gap && a.y1 < b.y2 && b.y1 < a.y2;
      for (const svg of root.querySelectorAll<SVGSVGElement>("[data-sheet] > svg")) {
        const page = svg.closest("[data-sheet]")!.getAttribute("data-sheet");
        const view = svg.viewBox.baseVal;
        for (const t of svg.querySelectorAll(".pp-title, .pp-running")) {
          const b = boxOf(t);
          if (b.x1 < 0 || b.x2 > view.width) out.push(`page ${page}: title runs off the page (${b.x1.toFixed(0)}–${b.x2.toFixed(0)} of ${view.width})`);
        }
        const bars = [...svg.querySelectorAll(".pp-bar")];
        for (const g of bars) {
          const chords = [...g.querySelectorAll(".pp-chord")].map(boxOf);
          chords.forEach((a, i) => chords.slice(i + 1).forEach((b) => meet(a, b, 3) && out.push(`page ${page} bar ${g.getAttribute("data-bar")}: chord symbols touch`)));
          for (const n of g.querySelectorAll(".pp-ending-number")) {
            const nb = boxOf(n);
            if (chords.some((c) => meet(nb, c, 2))) out.push(`page ${page} bar ${g.getAttribute("data-bar")}: ending number touches a chord symbol`);
          }
        }
        // A section box or ending bracket must keep clear of anything drawn in the system above (its clef).
        const marks = [...svg.querySelectorAll(".pp-label-box, .pp-ending")].map((e) => ({ e, b: boxOf(e) }));
        const clefs = [...svg.querySelectorAll(".vf-clef")].map(boxOf);
        for (const m of marks) {
          // A clef's box is its font's em box (far taller than the ink), so only a clef of the system above
        // (its middle above the mark's top) counts; the mark's own system's clef sits below it by design.
        for (const c of clefs) if (meet(m.b, c, 0) && (c.y1 + c.y2) / 2 < m.b.y1) out.push(`page ${page}: a ${m.e.getAttribute("class")} (${m.b.x1.toFixed(0)},${m.b.y1.toFixed(0)}–${m.b.x2.toFixed(0)},${m.b.y2.toFixed(0)}) touches the clef above it (${c.x1.toFixed(0)},${c.y1.toFixed(0)}–${c.x2.toFixed(0)},${c.y2.toFixed(0)})`);
        }
      }
      return out;
    });
    expect(problems).toEqual([]);
  });

  test("item 26: the early turn raises the next page's first systems under a brass rule marked 'next'", async ({ page }) => {
    await page.goto(`/settings`);
    await expect(page.getByText("Early turn", { exact: true })).toBeVisible();
    await expect(page.getByRole("checkbox", { name: /^half/i })).toHaveCount(0); // the old setting is gone
    await page.goto(`${band}/charts/${LANTERNFISH}/bandstand`);
    await drawn(page);
    const toggle = page.getByTestId("early-turn");
    await expect(toggle).toHaveAccessibleName("Early turn");
    await toggle.click();
    await page.keyboard.press("PageDown");
    await expect(shown(page)).toHaveAttribute("data-view", "early");
    const next = shown(page).locator(".pp-early.pp-shown .pp-early-next");
    await expect(next.locator(".pp-early-marker")).toHaveText("next");
    await expect(next).toHaveCSS("border-top-style", "solid");
    await expect(next).toHaveCSS("border-top-width", "1px");
    await expect(next.locator(".pp-early-rise")).toHaveCSS("animation-name", "pp-early-rise");
    await page.keyboard.press("PageDown");
    await expect(shown(page)).toHaveAttribute("data-view", "full");
    await toggle.click();
  });

  test("item 14: Escape closes the bandstand view", async ({ page }) => {
    await page.goto(`${band}/charts/${LANTERNFISH}/bandstand`);
    await drawn(page);
    await page.keyboard.press("Escape");
    await expect(page).toHaveURL(new RegExp(`/charts/${LANTERNFISH}(\\?|$)`));
    await expect(page.getByTestId("nav-library")).toBeVisible();
  });

  test("item 14: reloading set play keeps the tune being read", async ({ page }) => {
    await page.goto(`${band}/setlists/${gig}/play`);
    await drawn(page);
    await page.getByTestId("next-tune").click();
    await expect(page.getByTestId("head-title")).toHaveText("Low Fog over Carrow Point");
    await expect(page).toHaveURL(/[?&]tune=2/);
    await page.reload();
    await drawn(page);
    await expect(page.getByTestId("head-title")).toHaveText("Low Fog over Carrow Point");
  });

  test("item 14: 'Skip to content' is the first tab stop", async ({ page }) => {
    await page.goto(`${band}/charts/${LANTERNFISH}`);
    await drawn(page);
    await page.locator("body").focus();
    await page.keyboard.press("Tab");
    await expect(page.locator(":focus")).toHaveText("Skip to content");
  });

  test("item 14: changing the key and then the part at once keeps both", async ({ page }) => {
    await page.goto(`${band}/charts/${LANTERNFISH}?instrument=concert`);
    await drawn(page);
    await page.getByTestId("key-picker").evaluate((el: HTMLSelectElement) => {
      el.value = "F";
      el.dispatchEvent(new Event("change", { bubbles: true }));
      const part = document.querySelector<HTMLSelectElement>('[data-testid="instrument-picker"]')!;
      setTimeout(() => {
        part.value = "bb";
        part.dispatchEvent(new Event("change", { bubbles: true }));
      }, 30);
    });
    await expect(page).toHaveURL(/instrument=bb/);
    await expect(page).toHaveURL(/key=F/);
  });

  test("item 14: 'Back to the usual settings' leaves no stale key message", async ({ page }) => {
    await page.goto("/settings");
    await page.getByTestId("nextKeys-add").click();
    await page.keyboard.press("ArrowLeft");
    await expect(page.locator("#nextKeys-msg")).toHaveText("ArrowLeft now turns forward.");
    await page.getByTestId("settings-reset").click();
    await expect(page.locator("#nextKeys-msg")).toHaveText("");
    await expect(page.getByTestId("settings-reset-msg")).toContainText("Back to the usual settings");
  });

  test("item 14: non-Latin text and emoji in the drawn header are drawn, not dropped", async ({ page }) => {
    await page.goto(`${band}/charts/${worldly}`);
    await drawn(page);
    const title = shown(page).locator('[data-sheet="1"] .pp-title');
    await expect(title).toHaveText(WORLDLY_TITLE);
    // Every character has a glyph with width: a dropped script leaves the drawn title far narrower.
    const widths = await title.evaluate((t: SVGTextElement) => {
      const n = t.getNumberOfChars();
      return Array.from({ length: n }, (_, i) => t.getExtentOfChar(i).width);
    });
    // Only spaces may be narrow; getNumberOfChars counts UTF-16 units, so the emoji's two halves are
    // one glyph and the low half may report no width of its own.
    const units = [...WORLDLY_TITLE].flatMap((ch) => (ch.length === 2 ? [ch, ""] : [ch]));
    const empty = widths.map((w, i) => ({ ch: units[i], w })).filter(({ ch, w }) => w < 1 && ch !== " " && ch !== "");
    expect(empty).toEqual([]);
  });

  test("items 17 and 18: the pedal is written in the part, and the intro advice names the part's chords", async ({ page }) => {
    await page.goto(`${band}/charts/${LANTERNFISH}?instrument=bb&intro=dominant-pedal`);
    await drawn(page);
    // Concert B♭ pedal under E♭ reads C on a B♭ part (a major 2nd up: MusicXML <transpose> −1/−2).
    await expect(shown(page).locator('[data-sheet="1"] .pp-direction').first()).toHaveText("C pedal");
    const advice = page.getByTestId("intro-picker").locator('[data-kind="dominant-pedal"]');
    await expect(advice).toContainText("C7sus4");
    await expect(advice).not.toContainText("Bb7sus4");
    await expect(advice).not.toContainText("B♭7sus4");
    await page.goto(`${band}/charts/${LANTERNFISH}?instrument=concert&intro=vamp`);
    await drawn(page);
    await expect(shown(page).locator(".pp-direction", { hasText: "till cue" })).toHaveCount(1);
  });
});
