import { chromium } from "@playwright/test";
const base = "http://localhost:3700";
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox", "--headless", "--disable-gpu"] });
const page = await browser.newPage({ viewport: { width: 390, height: 800 } });
page.setDefaultTimeout(180000); page.setDefaultNavigationTimeout(240000);
page.on("console", (m) => { if (m.type() === "error") console.log("console:", m.text()); });
page.on("pageerror", (e) => console.log("pageerror:", e.message));
const step = async (name, fn) => { try { await fn(); console.log("ok", name); } catch (e) { console.log("FAIL", name, e.message.split("\n")[0]); await page.screenshot({ path: `/tmp/setlist-run/${name}.png`, fullPage: true }); throw e; } };
await step("signin", async () => {
  await page.goto(`${base}/signin?callbackUrl=${encodeURIComponent("/bands")}`);
  await page.getByLabel("Email", { exact: true }).fill("odile@saltmarsh.test");
  await page.getByLabel("Password", { exact: true }).fill("pedalpoint-demo");
  await page.getByRole("button", { name: /^sign in/i }).click();
  await page.waitForURL(/\/bands/, { timeout: 60000, waitUntil: "commit" });
});
const bandUrl = await page.evaluate(async () => { const r = await fetch("/api/me/bootstrap"); return (await r.json()).bands[0].id; });
await step("setlists", async () => {
  await page.goto(`${base}/bands/${bandUrl}/setlists`, { timeout: 120000 });
  await page.getByTestId("new-setlist").click({ timeout: 60000 });
  await page.getByTestId("gig-name").waitFor({ timeout: 60000 });
});
await step("edit", async () => {
  await page.getByTestId("gig-name").fill("Thursday at the Lanternfish Room");
  await page.getByTestId("add-chart-1").selectOption({ label: "Lanternfish (Eb)" });
  await page.getByTestId("add-tune-1").click();
  await page.getByTestId("add-set").click();
  await page.getByTestId("add-chart-2").selectOption({ label: "Tidewater Waltz (G)" });
  await page.getByTestId("add-tune-2").click();
  const t = page.getByTestId("set-1").getByTestId("set-tune").first();
  await t.getByTestId("arrange-tune").click();
  await t.getByTestId("tune-key").selectOption("F");
  await t.getByTestId("intro-kind").selectOption("dominant-pedal");
  console.log("fit:", await t.getByTestId("intro-fit").textContent());
  await t.getByTestId("intro-kind").selectOption("vamp");
  console.log("fit vamp:", await t.getByTestId("intro-fit").textContent());
  await t.getByTestId("intro-kind").selectOption("dominant-pedal");
  await t.getByTestId("intro-bars").fill("4");
  await t.getByTestId("arrange-tune").click();
  await page.getByTestId("save-setlist").click();
  await page.getByTestId("save-state").filter({ hasText: "Saved." }).waitFor({ timeout: 150000 });
  console.log("tune1:", await page.getByTestId("set-1").getByTestId("set-tune").first().textContent());
  await page.screenshot({ path: "/tmp/setlist-run/editor.png", fullPage: true });
});
await step("share", async () => {
  await page.getByTestId("share-email").fill("newsub@example.test");
  await page.getByTestId("share-send").click();
  await page.getByTestId("share-result").waitFor({ timeout: 150000 });
  console.log("share:", await page.getByTestId("share-result").textContent());
});
const url = page.url();
await step("play", async () => {
  await page.goto(`${url}/play?instrument=eb`);
  await page.locator('[data-testid="chart-page"][data-drawn-all="true"]').waitFor({ state: "attached", timeout: 60000 });
  console.log("label:", await page.getByTestId("tune-label").textContent(), "|", await page.getByTestId("next-up").textContent());
  const pages = Number(await page.getByTestId("chart-page").getAttribute("data-pages"));
  for (let i = 0; i < pages; i++) await page.keyboard.press("PageDown");
  await page.waitForTimeout(1500);
  console.log("after:", await page.getByTestId("tune-label").textContent());
  await page.screenshot({ path: "/tmp/setlist-run/play.png" });
});
await step("print", async () => {
  await page.goto(`${url}/print`);
  await page.getByTestId("printable-setlist").waitFor({ timeout: 60000 });
  await page.screenshot({ path: "/tmp/setlist-run/print.png", fullPage: true });
});
await browser.close();
