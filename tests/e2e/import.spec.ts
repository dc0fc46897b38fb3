// Charts in and out: a MusicXML file uploaded, previewed and saved, then read as a B♭ part and
// exported again; a PDF part uploaded and turned with pedal keys with no signal.
import path from "node:path";
import { expect, test, type Page } from "@playwright/test";
import { signIn } from "./helpers/auth";
import { demoLeader } from "./helpers/demo";
import { BandsPage } from "./pages/bands";

const FIXTURES = path.resolve(import.meta.dirname, "../fixtures");
const NOCTURNE = path.join(FIXTURES, "musicxml/cinderpath-nocturne.musicxml");
const LAUGHS = path.join(FIXTURES, "musicxml/billion-laughs.musicxml");
const PDF = path.join(FIXTURES, "attachments/horn-part-two-pages.pdf");
// A 1×1 PNG (the PNG signature and one IDAT chunk): enough for the server's type check.
const PNG = { mimeType: "image/png", buffer: Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==", "base64") };

test.describe.configure({ mode: "serial" });

let bandId = "";
let chartId = "";

async function controlledBySw(page: Page): Promise<void> {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  if (!(await page.evaluate(() => Boolean(navigator.serviceWorker.controller)))) await page.reload();
  await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller)), { timeout: 30_000 }).toBe(true);
}

test("upload MusicXML files, preview what was read and refused, save one, open it as a B♭ part", async ({ page }) => {
  const leader = demoLeader();
  await signIn(page, leader.email, leader.password);
  const bands = new BandsPage(page);
  await bands.goto();
  bandId = await bands.createBand("Import Night Trio");

  await page.goto(`/bands/${bandId}/import`);
  await expect(page.getByTestId("rights-caution")).toContainText("Upload only charts your band owns or is licensed to share");
  await page.getByTestId("import-files").setInputFiles([NOCTURNE, LAUGHS]);

  const items = page.getByTestId("import-item");
  await expect(items).toHaveCount(2);
  const good = items.filter({ hasText: "cinderpath-nocturne.musicxml" });
  const bad = items.filter({ hasText: "billion-laughs.musicxml" });
  await expect(bad.getByTestId("import-refused")).toContainText("declares XML entities", { timeout: 30_000 });
  await expect(good).toHaveAttribute("data-phase", "ready", { timeout: 30_000 });
  // the alto part is written in D minor with <transpose>: the chart is concert F minor
  await expect(good.getByTestId("import-read")).toContainText("Concert key: Fm");
  await expect(good.getByTestId("import-read")).toContainText("Alto Saxophone");
  await expect(good.getByTestId("import-skipped")).toContainText('other parts: "Piano"');
  await expect(good.getByTestId("import-title")).toHaveValue("Cinderpath Nocturne");

  await good.getByTestId("import-save").click();
  await expect(good.getByTestId("import-saved")).toBeVisible({ timeout: 30_000 });
  const href = await good.getByTestId("import-open").getAttribute("href");
  chartId = decodeURIComponent(href!.split("/").pop()!);

  // As a B♭ part: concert Fm7 reads Gm7, a major 2nd higher (REFERENCES.md, MusicXML <transpose>).
  await page.goto(`/bands/${bandId}/charts/${chartId}?instrument=bb`);
  const sheet = page.locator('[data-testid="chart-page"] [data-sheet="1"]');
  await expect(sheet.locator('.pp-chord[data-symbol="Gm7"]').first()).toBeVisible({ timeout: 30_000 });
  await expect(sheet.locator(".pp-part")).toHaveText("B♭ part");

  // And out again as MusicXML for a B♭ instrument.
  const xml = await page.request.get(`/api/bands/${bandId}/charts/${chartId}/musicxml?instrument=bb`);
  expect(xml.status()).toBe(200);
  expect(xml.headers()["content-disposition"]).toContain("attachment");
  const text = await xml.text();
  expect(text).toContain("<transpose><diatonic>-1</diatonic><chromatic>-2</chromatic></transpose>");
  expect(text).toContain("<fifths>-2</fifths>"); // G minor, two flats
});

test("upload a PDF part, then turn its pages with pedal keys and taps with no signal", async ({ page, context }) => {
  const leader = demoLeader();
  await signIn(page, leader.email, leader.password, `/bands/${bandId}`);
  const parts = `/bands/${bandId}/import/parts?chart=${encodeURIComponent(chartId)}`;
  await page.goto(parts);
  await controlledBySw(page);
  await expect(page.getByTestId("rights-caution")).toBeVisible();
  // Item 22: the part's name and instrument are asked before the file; no name, no file.
  await expect(page.getByTestId("part-file")).toBeDisabled();
  await page.getByTestId("part-name").fill("Horn in F, 2nd");
  await page.getByTestId("part-instrument").selectOption("f");
  await page.getByTestId("part-file").setInputFiles(PDF);
  const row = page.getByTestId("part-row").filter({ hasText: "horn-part-two-pages.pdf" });
  await expect(row).toBeVisible({ timeout: 30_000 });
  await expect(row.getByTestId("part-title")).toHaveText("Horn in F, 2nd");
  await expect(row.getByTestId("part-for")).toContainText("For F");
  await expect(row.getByTestId("part-offline")).toHaveText("kept on this device", { timeout: 30_000 });

  // A wrong file type is refused and nothing is added.
  await page.getByTestId("part-name").fill("Notes");
  await page.getByTestId("part-file").setInputFiles({ name: "notes.pdf", mimeType: "application/pdf", buffer: Buffer.from("just words") });
  await expect(page.getByTestId("part-error")).toContainText("PDF, PNG and JPEG");
  await expect(page.getByTestId("part-row")).toHaveCount(1);

  await context.setOffline(true);
  await page.reload();
  await expect(row.getByTestId("part-offline")).toHaveText("kept on this device", { timeout: 30_000 });
  await row.getByTestId("part-open").click();
  await expect(page).toHaveURL(/\/charts\/[^/]+\/bandstand\?part=/); // read in the bandstand view
  const viewer = page.getByTestId("part-viewer");
  await expect(viewer).toHaveAttribute("data-status", "ready", { timeout: 30_000 });
  await expect(viewer).toHaveAttribute("data-pages", "2");
  await expect(page.getByTestId("offline-badge")).toBeVisible();
  await page.keyboard.press("PageDown");
  await expect(viewer).toHaveAttribute("data-page", "2");
  await expect(page.getByTestId("page-counter")).toHaveText("2 / 2");
  await page.keyboard.press("PageDown"); // stops at the end
  await expect(viewer).toHaveAttribute("data-page", "2");
  await page.keyboard.press("ArrowLeft");
  await expect(viewer).toHaveAttribute("data-page", "1");
  await page.getByTestId("tap-next").click();
  await expect(viewer).toHaveAttribute("data-page", "2");
  await page.getByTestId("tap-back").click();
  await expect(viewer).toHaveAttribute("data-page", "1");
  const drawn = await page.locator('[data-part-page="1"] canvas').evaluate((c: HTMLCanvasElement) => c.width > 0 && c.height > 0);
  expect(drawn).toBe(true);
  await context.setOffline(false);
});

test("item 22: a PDF part is replaced under its name, then deleted after an inline question", async ({ page }) => {
  const leader = demoLeader();
  await signIn(page, leader.email, leader.password, `/bands/${bandId}`);
  await page.goto(`/bands/${bandId}/import/parts?chart=${encodeURIComponent(chartId)}`);
  await page.getByTestId("part-name").fill("Lead sheet, big print");
  await page.getByTestId("part-file").setInputFiles({ ...PNG, name: "first-scan.png" });
  const row = () => page.getByTestId("part-row").filter({ hasText: "Lead sheet, big print" });
  await expect(row()).toContainText("first-scan.png", { timeout: 30_000 });
  const before = await page.getByTestId("part-row").count();

  // Replace: the name and instrument stay, the file changes, the list keeps one row for it.
  await row().getByTestId("part-replace").click();
  await expect(page.getByTestId("part-name")).toHaveValue("Lead sheet, big print");
  await page.getByTestId("part-file").setInputFiles({ ...PNG, name: "second-scan.png" });
  await expect(page.getByTestId("part-status")).toHaveText("Lead sheet, big print replaced.");
  await expect(row()).toContainText("second-scan.png", { timeout: 30_000 });
  await expect(page.getByTestId("part-row")).toHaveCount(before);

  // Delete asks inline (no browser pop-up), then the part leaves the list.
  page.on("dialog", () => {
    throw new Error("no browser pop-up");
  });
  await row().getByTestId("part-delete").click();
  await expect(page.getByTestId("part-delete-confirm")).toBeFocused();
  await page.getByTestId("part-delete-confirm-yes").click();
  await expect(page.getByTestId("part-status")).toHaveText("Lead sheet, big print deleted.");
  await expect(row()).toHaveCount(0, { timeout: 30_000 });
  await expect(page.getByTestId("part-row")).toHaveCount(before - 1);
});

test("a score chart text cannot hold as written is imported with the changed bars named", async ({ page }) => {
  const leader = demoLeader();
  await signIn(page, leader.email, leader.password, `/bands/${bandId}`);
  await page.goto(`/bands/${bandId}/import`);
  // MusicXML test suite 61i: one 4/4 measure holding a single quarter note (not a pickup: the piece has one bar)
  await page.getByTestId("import-files").setInputFiles(path.join(FIXTURES, "musicxml/suite/61i-Lyrics-Chords.xml"));
  const item = page.getByTestId("import-item").filter({ hasText: "61i-Lyrics-Chords.xml" });
  await expect(item).toHaveAttribute("data-phase", "ready", { timeout: 30_000 });
  const changed = item.getByTestId("import-changed");
  await expect(changed).toContainText("Imported with changes");
  await expect(changed).toContainText("measures shorter than their time signature: filled with rests (1) — bar 1");
  await expect(item.getByTestId("import-refused")).toHaveCount(0);
  await item.getByTestId("import-save").click();
  await expect(item.getByTestId("import-saved")).toBeVisible({ timeout: 30_000 });
});
