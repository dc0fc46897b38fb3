import { chromium } from "@playwright/test";
const base = "http://localhost:3704";
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox", "--headless", "--disable-gpu"] });
const page = await browser.newPage();
page.on("console", (m) => console.log("console:", m.type(), m.text()));
await page.goto(`${base}/signin`);
await page.getByLabel("Email", { exact: true }).fill("priya@saltmarsh.test");
await page.getByLabel("Password", { exact: true }).fill("pedalpoint-demo");
await page.getByRole("button", { name: /^sign in/i }).click();
await page.waitForURL(/\/bands/, { waitUntil: "commit" });
await page.waitForTimeout(3000);
for (let i = 0; i < 10; i++) {
  const s = await page.evaluate(async () => { const r = await navigator.serviceWorker.getRegistration(); return r ? { a: !!r.active, i: !!r.installing, w: !!r.waiting, c: !!navigator.serviceWorker.controller } : "none"; });
  console.log(JSON.stringify(s));
  await page.waitForTimeout(3000);
}
await browser.close();
