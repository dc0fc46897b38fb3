// The leader moves a band to the band plan through the hosted checkout (the local payment fake,
// driven by the official SDK) and the free plan's chart limit lifts; then cancels.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { signIn } from "./helpers/auth";
import { demoLeader } from "./helpers/demo";
import { BandsPage } from "./pages/bands";

function chartBody(n: number) {
  const title = `Plan Check ${n}`;
  return { title, composer: "", key: "C", meter: "4/4", tempo: 120, feel: "", sourceText: `title: ${title}\nkey: C\ntime: 4/4\n\nA:\n| Cmaj7 | Dm7 G7 |\n` };
}

async function addChart(request: APIRequestContext, bandId: string, n: number) {
  return request.post(`/api/bands/${bandId}/charts`, { data: chartBody(n) });
}

test("the free plan stops at 25 charts; the leader upgrades through the checkout and the limit lifts; cancel keeps it to the renewal date", async ({ page }) => {
  const leader = demoLeader();
  await signIn(page, leader.email, leader.password);
  const bands = new BandsPage(page);
  await bands.goto();
  const bandId = await bands.createBand("Plan Test Quartet");

  for (let n = 1; n <= 25; n++) expect((await addChart(page.request, bandId, n)).status()).toBe(201);
  const refused = await addChart(page.request, bandId, 26);
  expect(refused.status()).toBe(402);
  expect(((await refused.json()) as { error: { message: string } }).error.message).toMatch(/free plan holds up to 25 charts/);

  await page.goto(`/bands/${bandId}/plan`);
  await expect(page.getByTestId("plan-name")).toHaveText("Free plan", { timeout: 30_000 });
  await expect(page.getByTestId("plan-charts")).toHaveText("25 of 25");
  await page.getByTestId("plan-upgrade").click();

  // The hosted checkout page of the local payment fake.
  await expect(page).toHaveURL(/127\.0\.0\.1:\d+\/checkout\/cs_test_/, { timeout: 30_000 });
  await expect(page.getByText("nothing is charged")).toBeVisible();
  await page.getByTestId("fake-pay").click();

  await expect(page).toHaveURL(new RegExp(`/bands/${bandId}/plan\\?checkout=done`), { timeout: 30_000 });
  await expect(page.getByTestId("plan-name")).toHaveText("Band plan", { timeout: 30_000 });
  await expect(page.getByTestId("plan-status")).toHaveText("Active");
  await expect(page.getByTestId("plan-renewal")).not.toBeEmpty();
  await expect(page.getByTestId("plan-charts")).toHaveText("25 (no limit)");
  expect((await addChart(page.request, bandId, 26)).status()).toBe(201);

  await page.getByTestId("plan-cancel").click();
  await page.getByTestId("plan-cancel-confirm").click();
  await expect(page.getByTestId("plan-status")).toHaveText("Cancelled, runs until the renewal date");
  await expect(page.getByTestId("plan-name")).toHaveText("Band plan");
  await expect(page.getByTestId("plan-resume")).toBeVisible();

  // Only the leader sees the plan.
  const player = await page.context().browser()!.newContext();
  const other = await player.newPage();
  const res = await other.request.get(`/api/billing/plan?bandId=${bandId}`);
  expect(res.status()).toBe(401);
  await player.close();
});
