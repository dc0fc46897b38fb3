// Issue 16, the forms a person fills in: errors at their field in plain words (item 6), personal
// marks that refuse what they cannot keep and say so (item 7), and a refused invite that keeps what
// was typed and points to the plan (item 12), and a sub's access end that follows the gig time on
// the screen (item 5). Each test is named after its item.
import { expect, test, type Locator, type Page } from "@playwright/test";
import { signIn, newPerson } from "./helpers/auth";
import { DEMO_BAND_ID, demoLeader, demoPlayer } from "./helpers/demo";
import { addGig, chartId } from "./helpers/gig";
import { BandsPage } from "./pages/bands";
import { ChartFormPage } from "./pages/chart-form";
import { MembersPage } from "./pages/members";

const band = `/bands/${DEMO_BAND_ID}`;
const FIELD_PREFIX = /^\s*(email|password|name|instrument|title|sourceText|tempo|key|meter|text)\s*:/i;

/** The error a field shows under itself (Field wires it through aria-describedby), or "" for none. */
function fieldError(control: Locator): Promise<string> {
  return control.evaluate((el) => {
    const ids = (el.getAttribute("aria-describedby") ?? "").split(/\s+/).filter((id) => id.endsWith("-error"));
    return ids.map((id) => document.getElementById(id)?.textContent ?? "").join(" ");
  });
}

async function openMarks(page: Page, chart: string) {
  const player = demoPlayer();
  await signIn(page, player.email, player.password, `${band}/charts/${chartId(chart)}`);
  await expect(page.locator('[data-testid="chart-page"][data-drawn="true"]')).toBeAttached({ timeout: 30_000 });
  return page.getByTestId("marks-panel");
}

test.describe("issue 16 forms", () => {
  test("item 6: the empty chart-text error sits at the chart-text field, not under Time signature, without backticks", async ({ page }) => {
    const leader = demoLeader();
    await signIn(page, leader.email, leader.password, band);
    const form = new ChartFormPage(page);
    await form.gotoNew(DEMO_BAND_ID);
    await form.title.fill("Tidewater Clock");
    await form.text.fill("");
    await expect(form.textError).toBeVisible();
    await expect(form.textError).toContainText("The chart has no bars yet");
    await expect(form.textError).not.toContainText("`");
    await expect(form.textError).toHaveAttribute("data-line", "1");
    expect(await fieldError(form.meter)).toBe("");
    await expect(form.meter).not.toHaveAttribute("aria-invalid", "true");
  });

  test("item 6: sign-up messages sit under their fields in plain words, with no field names in front", async ({ page }) => {
    await page.goto("/signup");
    const form = page.getByTestId("signup-form");
    await form.getByLabel("Name", { exact: true }).fill(" ");
    await form.getByLabel("Email", { exact: true }).fill("not-an-address");
    await form.getByLabel("Password", { exact: true }).fill("short");
    await form.getByRole("button", { name: /create my account/i }).click();
    const notice = page.getByTestId("signup-error");
    await expect(notice).toBeVisible({ timeout: 15_000 });
    await expect(notice).not.toHaveText(FIELD_PREFIX);
    const errors = {
      name: await fieldError(form.getByLabel("Name", { exact: true })),
      email: await fieldError(form.getByLabel("Email", { exact: true })),
      password: await fieldError(form.getByLabel("Password", { exact: true })),
    };
    expect(errors.email).toBe("Enter an e-mail address like name@example.com");
    for (const [field, message] of Object.entries(errors)) {
      expect(message, field).not.toMatch(FIELD_PREFIX);
      expect(message, field).not.toContain("`");
    }
    expect(errors.name.length + errors.password.length).toBeGreaterThan(0);
  });

  test("item 7: a bar number past the end is refused, not saved at the last bar", async ({ page }) => {
    const panel = await openMarks(page, "slow-tide-at-fennick-quay");
    await panel.getByTestId("mark-section").selectOption({ index: 0 });
    const bar = panel.getByTestId("mark-bar");
    const last = Number(await bar.getAttribute("max"));
    expect(last).toBeGreaterThan(1);
    const before = await panel.getByTestId("my-mark").count();
    await bar.fill(String(last + 3));
    await panel.getByTestId("mark-text").fill("past the end");
    await panel.getByTestId("mark-save").click();
    await expect.poll(() => fieldError(bar)).toBe(`This section has ${last} bars: give a bar number from 1 to ${last}.`);
    await expect(panel.getByTestId("mark-status")).not.toHaveText("Mark added.");
    await expect(panel.getByTestId("my-mark")).toHaveCount(before);
    await expect(panel.getByTestId("my-mark").filter({ hasText: "past the end" })).toHaveCount(0);
  });

  test("item 7: words over the limit say so, are kept in the field, and are not cut at 60 characters", async ({ page }) => {
    const panel = await openMarks(page, "slow-tide-at-fennick-quay");
    const long = "keep the brushes soft under the singer until the last chorus, then dig in";
    const words = panel.getByTestId("mark-text");
    await words.fill(long);
    await expect(words).toHaveValue(long);
    await expect(panel.getByText(`${long.length} of 60 characters`)).toBeVisible();
    await panel.getByTestId("mark-save").click();
    await expect.poll(() => fieldError(words)).toBe(`A mark holds up to 60 characters; this one has ${long.length}. Shorten it to fit over one bar.`);
    await expect(words).toHaveValue(long);
    await expect(panel.getByTestId("my-mark").filter({ hasText: "brushes soft" })).toHaveCount(0);
  });

  test("item 7: 'Mark added.' gives way to 'Mark removed.' after removing", async ({ page }) => {
    const panel = await openMarks(page, "slow-tide-at-fennick-quay");
    await panel.getByTestId("mark-section").selectOption({ index: 0 });
    await panel.getByTestId("mark-bar").fill("2");
    await panel.getByTestId("mark-text").fill("lift here");
    await panel.getByTestId("mark-save").click();
    await expect(panel.getByTestId("mark-status")).toHaveText("Mark added.");
    const mark = panel.getByTestId("my-mark").filter({ hasText: "lift here" });
    await expect(mark).toHaveCount(1);
    await mark.getByRole("button", { name: /^Remove the mark/ }).click();
    await expect(mark).toHaveCount(0);
    await expect(panel.getByTestId("mark-status")).toHaveText("Mark removed.");
  });

  test("item 5: a new set list's share ends the morning after the gig time on the screen, before any reload", async ({ page }) => {
    const leader = demoLeader();
    await signIn(page, leader.email, leader.password, band);
    const id = await addGig(page, "Undated night at the ropewalk", [{ chartId: chartId("morning-at-the-ropewalk") }]);
    await page.goto(`${band}/setlists/${id}`);
    const when = page.getByTestId("gig-when");
    const until = page.getByTestId("share-until");
    await expect(until).toBeVisible({ timeout: 30_000 });
    await when.fill("2031-05-17T20:30");
    await expect(until).toHaveValue("2031-05-18T06:00");
    await when.fill("2031-06-02T21:00");
    await expect(until).toHaveValue("2031-06-03T06:00");
  });

  test("item 12: an invite refused by the member cap keeps the e-mail address and links to the plan page", async ({ page }) => {
    test.setTimeout(120_000);
    const leader = demoLeader();
    await signIn(page, leader.email, leader.password);
    const bands = new BandsPage(page);
    await bands.goto();
    const bandId = await bands.createBand("Cap Check Trio");
    // The free plan holds 8 members, open invites counted: the leader and seven invites fill it.
    const origin = new URL(page.url()).origin;
    for (let n = 1; n <= 7; n++) {
      const res = await page.request.post(`/api/bands/${bandId}/invites`, { data: { email: newPerson(`seat${n}`).email, role: "player" }, headers: { Origin: origin } });
      expect(res.status(), await res.text()).toBe(201);
    }
    const members = new MembersPage(page);
    await members.goto(bandId);
    const address = newPerson("eighth").email;
    await members.invite(address, "player");
    await expect(members.inviteResult).toContainText("Invite not sent");
    await expect(members.inviteResult).toContainText("allows up to 8 members");
    await expect(members.inviteEmail).toHaveValue(address);
    const plan = page.getByTestId("invite-plan-link");
    await expect(plan).toHaveAttribute("href", `/bands/${bandId}/plan`);
    await plan.click();
    await expect(page).toHaveURL(new RegExp(`/bands/${bandId}/plan$`));
    await expect(page.getByTestId("plan-name")).toHaveText("Free plan", { timeout: 30_000 });
  });
});
