// The foundation, end to end: a new leader starts a band and invites a player who can read but not
// edit; the demo book opens for a demo account; the library's search, sort and filters; chart text
// errors at their line; accessibility; and the library on a phone.
import { expect, test, type Browser, type Page } from "@playwright/test";
import { DEMO_CHARTS } from "../../db/demo-charts";
import { expectNoSeriousA11yIssues } from "./helpers/axe";
import { fillSignUp, newPerson, signIn, signUp } from "./helpers/auth";
import { DEMO_BAND, DEMO_BAND_ID, demoLeader, demoPlayer } from "./helpers/demo";
import { waitForLink } from "./helpers/mail";
import { BandsPage } from "./pages/bands";
import { ChartFormPage } from "./pages/chart-form";
import { LibraryPage } from "./pages/library";
import { MembersPage } from "./pages/members";

// The header lines of the seeded chart texts: what the library must show.
const header = (text: string, name: string) => new RegExp(`^${name}:\\s*(.+)$`, "m").exec(text)?.[1]?.trim() ?? "";
const demo = DEMO_CHARTS.map((c) => ({
  title: header(c.text, "title"),
  composer: header(c.text, "composer"),
  key: header(c.text, "key"),
  feel: header(c.text, "feel"),
}));
const demoTitles = demo.map((c) => c.title);

async function freshPage(browser: Browser): Promise<Page> {
  const context = await browser.newContext();
  return context.newPage();
}

/** Signs in as a demo account and opens its band's library; returns the band id. */
async function openDemoLibrary(page: Page, who = demoLeader()): Promise<string> {
  await signIn(page, who.email, who.password, "/bands");
  const bands = new BandsPage(page);
  // A one-band player lands on the library at once (issue 16 item 21); a leader picks the band.
  if (who.role === "leader") {
    await expect(bands.bandLinks.filter({ hasText: DEMO_BAND.name })).toBeVisible({ timeout: 30_000 });
    await bands.bandLinks.filter({ hasText: DEMO_BAND.name }).click();
  }
  await page.waitForURL(new RegExp(`/bands/${DEMO_BAND_ID}$`));
  await new LibraryPage(page).waitForBook(demoTitles.length);
  return DEMO_BAND_ID;
}

test("a new leader starts a band and invites a player, who reads the book but cannot change it", async ({ browser }) => {
  // The whole journey of two people through several screens: longer than one screen's test.
  test.setTimeout(180_000);
  const leader = newPerson("Leader");
  const player = newPerson("Player");
  const lp = await freshPage(browser);

  await signUp(lp, leader);
  const bands = new BandsPage(lp);
  await bands.goto();
  const bandId = await bands.createBand("The Harbour Lights Quintet", "Port Wenna");

  // A chart for the player to find (and to try to change).
  const form = new ChartFormPage(lp);
  await form.gotoNew(bandId);
  await form.fill({ title: "Salt Road Shuffle", composer: "The band", key: "F", tempo: "112", feel: "shuffle", text: "A:\n| F7 | Bb7 | F7 | C7 |\n", message: "first version" });
  await form.save.click();
  await lp.waitForURL(new RegExp(`/bands/${bandId}/charts/(?!new$)[^/]+$`), { timeout: 30_000 });
  const chartId = decodeURIComponent(new URL(lp.url()).pathname.split("/")[4] ?? "");
  expect(chartId).not.toBe("");
  expect((await lp.request.get(`/api/bands/${bandId}/charts/${chartId}`)).status(), "the chart reached the server").toBe(200);

  const members = new MembersPage(lp);
  await members.goto(bandId);
  await members.invite(player.email, "player", "bb");
  await expect(members.inviteResult).toContainText(`Invite sent to ${player.email}`);

  const link = await waitForLink(lp.request, player.email, /https?:\/\/[^\s"'<>]+\/invite\/[A-Za-z0-9_-]+/);

  // The player follows the link, makes an account on the way, and joins.
  const pp = await freshPage(browser);
  await pp.goto(link);
  await expect(pp.getByRole("heading", { level: 1 })).toContainText("The Harbour Lights Quintet");
  await fillSignUp(pp, player);
  await pp.waitForURL(new RegExp(`/bands/${bandId}`), { timeout: 30_000 });

  const library = new LibraryPage(pp);
  await library.goto(bandId);
  await expect(library.row("Salt Road Shuffle")).toBeVisible();
  await expect(library.newChart).toHaveCount(0);
  await expect(library.editLinks).toHaveCount(0);
  await expect(pp.getByTestId("nav-members")).toHaveCount(0);

  // Hidden controls are not the lock: the server refuses the player's edit itself.
  const res = await pp.request.put(`/api/bands/${bandId}/charts/${chartId}`, {
    data: { title: "Salt Road Shuffle", composer: "", key: "F", meter: "4/4", tempo: 112, feel: "shuffle", sourceText: "title: Salt Road Shuffle\nkey: F\n\nA:\n| F7 | F7 | F7 | F7 |\n", message: "", baseRevision: 1 },
  });
  expect(res.status()).toBe(403);
  const body = (await res.json()) as { error?: { message?: string } };
  expect(body.error?.message).toMatch(/leader or arranger/);

  // The member screen is the leader's: the server says no to a player.
  await pp.goto(`/bands/${bandId}/members`);
  await expect(pp.getByTestId("members-refused")).toBeVisible();
  await expect(pp.getByTestId("invite-form")).toHaveCount(0);

  // A change by the leader shows up in the player's library as updated since they last looked.
  const fix = await lp.request.put(`/api/bands/${bandId}/charts/${chartId}`, {
    data: { title: "Salt Road Shuffle", composer: "The band", key: "F", meter: "4/4", tempo: 104, feel: "shuffle", sourceText: "title: Salt Road Shuffle\nkey: F\n\nA:\n| F7 | Bb7 | F7 | F7 |\n", message: "bar 4 stays on F7", baseRevision: 1 },
  });
  expect(fix.status(), await fix.text()).toBe(200);
  await library.goto(bandId);
  await expect(library.row("Salt Road Shuffle")).toHaveAttribute("data-updated", "true", { timeout: 30_000 });
  await expect(library.row("Salt Road Shuffle").getByTestId("updated-mark")).toBeVisible();

  // The leader makes the player an arranger; the player's library then offers editing.
  await members.goto(bandId);
  await expectNoSeriousA11yIssues(lp, "the member screen");
  const row = members.rowFor(player.email);
  await row.getByTestId("member-role").selectOption("arranger");
  await row.getByTestId("member-save").click();
  await expect(row.getByTestId("member-result")).toContainText("arranger");
  await library.goto(bandId);
  await expect(library.newChart).toBeVisible({ timeout: 30_000 });
});

test("a demo account signs in and lands on a library of the demo charts", async ({ page }) => {
  await openDemoLibrary(page);
  const library = new LibraryPage(page);
  await expect(library.rows).toHaveCount(demoTitles.length);
  for (const title of demoTitles) await expect(library.row(title)).toBeVisible();
  await expect(library.newChart).toBeVisible();

  // Signed in, the front page goes straight on to the bands.
  await page.goto("/");
  await expect(page).toHaveURL(/\/bands$/);

  // Signing out clears the device and leaves for the sign-in page; the front page stays put then.
  await page.getByTestId("sign-out").click();
  await expect(page).toHaveURL(/\/signin/, { timeout: 30_000 });
  await page.goto("/");
  await expect(page.getByTestId("landing-signin")).toBeVisible();
});

test("the app installs as Pedalpoint with its own icons", async ({ request }) => {
  const res = await request.get("/manifest.webmanifest");
  expect(res.ok()).toBe(true);
  const manifest = (await res.json()) as { name: string; start_url: string; display: string; icons: { src: string; sizes: string; type: string }[] };
  expect(manifest.name).toBe("Pedalpoint");
  expect(manifest.display).toBe("standalone");
  // Installable in Chromium: a 192 and a 512 PNG icon (web.dev install criteria, from memory).
  for (const size of ["192x192", "512x512"]) {
    const icon = manifest.icons.find((i) => i.sizes === size && i.type === "image/png");
    expect(icon, `a ${size} PNG icon`).toBeTruthy();
    const png = await request.get(icon!.src);
    expect(png.headers()["content-type"]).toContain("image/png");
  }
});

test("search, sort and filters narrow the library and live in the address", async ({ page }) => {
  const bandId = await openDemoLibrary(page);
  const library = new LibraryPage(page);

  await library.search.fill("waltz");
  await expect(page).toHaveURL(/[?&]q=waltz/);
  const waltzes = demo.filter((c) => /waltz/i.test(`${c.title} ${c.composer} ${c.feel}`));
  expect(waltzes.length).toBeGreaterThan(1);
  await expect(library.rows).toHaveCount(waltzes.length);
  for (const c of waltzes) await expect(library.row(c.title)).toBeVisible();

  await library.goto(bandId, "?feel=jazz+waltz");
  await expect(library.rows).toHaveCount(demo.filter((c) => c.feel === "jazz waltz").length);
  expect(new Set(await library.column("cell-feel"))).toEqual(new Set(["jazz waltz"]));

  await library.goto(bandId);
  await library.keyFilter.selectOption("F");
  await expect(page).toHaveURL(/[?&]key=F(&|$)/);
  await expect(library.rows).toHaveCount(demo.filter((c) => c.key === "F").length);
  expect(new Set(await library.column("cell-key"))).toEqual(new Set(["F"]));

  await library.goto(bandId, "?sort=tempo&dir=desc");
  const tempos = (await library.column("cell-tempo")).map((t) => Number(t)).filter((n) => !Number.isNaN(n));
  expect(tempos.length).toBeGreaterThan(2);
  expect(tempos).toEqual([...tempos].sort((a, b) => b - a));

  await page.getByTestId("sort-title").click();
  await expect(page).toHaveURL(/\/bands\/[^?]+$/);
  const titles = await library.titles();
  expect(titles).toEqual([...titles].sort((a, b) => a.localeCompare(b, "en", { sensitivity: "base" })));
});

test("a chart text error is shown at its line", async ({ page }) => {
  const bandId = await openDemoLibrary(page);
  const form = new ChartFormPage(page);
  await form.gotoNew(bandId);
  await form.fill({ title: "Broken Compass", text: "A:\n| Cmaj7 | Am7 |\n| Dm7 | Hx7 |\n| Cmaj7 |\n" });
  await expect(form.textError).toBeVisible();
  await expect(form.textError).toHaveAttribute("data-line", "3");
  await expect(form.problemLine).toHaveText("3");
  await form.text.fill("A:\n| Cmaj7 | Am7 |\n| Dm7 | G7 |\n");
  await expect(form.textError).toHaveCount(0);
});

test("landing, sign-in, library and chart form have no serious accessibility problems", async ({ page }) => {
  await page.goto("/");
  await expect(page.getByRole("heading", { level: 1, name: "Pedalpoint" })).toBeVisible();
  await expectNoSeriousA11yIssues(page, "the landing page");

  await page.goto("/signin");
  await expect(page.getByLabel("Email", { exact: true })).toBeVisible();
  await expectNoSeriousA11yIssues(page, "the sign-in page");

  const bandId = await openDemoLibrary(page);
  await expectNoSeriousA11yIssues(page, "the library");

  const form = new ChartFormPage(page);
  await form.gotoNew(bandId);
  await expectNoSeriousA11yIssues(page, "the new-chart form");
});

test("a stale edit meets the newer version, and an earlier revision can be restored", async ({ page }) => {
  const bandId = await openDemoLibrary(page);
  const library = new LibraryPage(page);
  const title = "Weatherglass";
  await library.row(title).getByTestId("edit-chart").click();
  await page.waitForURL(/\/edit$/);
  const chartId = decodeURIComponent(new URL(page.url()).pathname.split("/")[4] ?? "");
  const form = new ChartFormPage(page);
  await expect(form.title).toHaveValue(title);
  // Revision 1 is the seeded chart, whose tempo the demo text states.
  const seeded = header(DEMO_CHARTS.find((c) => header(c.text, "title") === title)?.text ?? "", "tempo");
  expect(seeded).not.toBe("");

  // Someone else publishes a tempo change while this form is open.
  const got = await page.request.get(`/api/bands/${bandId}/charts/${chartId}`);
  const { chart } = (await got.json()) as { chart: { composer: string; key: string; meter: string; tempo: number | null; feel: string; sourceText: string; revision: number } };
  const theirs = await page.request.put(`/api/bands/${bandId}/charts/${chartId}`, {
    data: { title, composer: chart.composer, key: chart.key, meter: chart.meter, tempo: 199, feel: chart.feel, sourceText: chart.sourceText, message: "pushed it", baseRevision: chart.revision },
  });
  expect(theirs.status(), await theirs.text()).toBe(200);

  await form.tempo.fill("120");
  await form.message.fill("slower for the singer");
  await form.save.click();
  await expect(page.getByTestId("chart-conflict")).toBeVisible();
  await page.getByTestId("conflict-load").click();
  await expect(form.tempo).toHaveValue("199");
  await form.tempo.fill("120");
  await form.save.click();
  await page.waitForURL(new RegExp(`/charts/${chartId}$`));
  await expect(page.getByTestId("meta-tempo")).toHaveText("120 bpm");

  const history = page.getByTestId("chart-history");
  const first = history.locator('[data-testid="history-entry"][data-revision="1"]');
  await expect(history.locator('[data-testid="history-entry"]').first()).toContainText("slower for the singer", { timeout: 30_000 });
  await first.getByTestId("restore-revision").click();
  await first.getByTestId("restore-confirm").click();
  await expect(history).toContainText("Version 1 is the current chart again");
  await expect(page.getByTestId("meta-tempo")).toHaveText(`${seeded} bpm`);
});

test.describe("on a phone", () => {
  test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });

  test("the library fits the screen and its rows can be tapped", async ({ page }) => {
    await openDemoLibrary(page, demoPlayer());
    const library = new LibraryPage(page);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    const link = page.getByTestId("chart-link").first();
    const box = await link.boundingBox();
    expect(box?.height ?? 0).toBeGreaterThanOrEqual(44);
    await expect(library.search).toBeVisible();
    const title = (await link.innerText()).trim();
    await link.tap();
    await page.waitForURL(/\/charts\/[^/]+$/);
    await expect(page.getByText(title).first()).toBeVisible();
  });
});
