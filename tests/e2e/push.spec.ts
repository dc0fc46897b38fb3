// The whole band on the same page: a leader's edit reaches a player's closed device by Web Push, the
// player reads what changed with no signal, and the leader sees the device ready only after that.
// Then a gig followed on two devices: the leader calls a tune, the follower is on it within a second.
import { expect, test, type CDPSession, type Page } from "@playwright/test";
import { DEMO_BAND_ID } from "./helpers/demo";
import { account, band, editChart, fakeSubscriber, LANTERNFISH, makeGig, origin, pushesFor, shot, syncedPage, TIDEWATER } from "./helpers/push-gig";

/** The worker's registration id, through the DevTools protocol (see NOTES.md: push without a push service). */
async function registrationId(cdp: CDPSession, scope: string): Promise<string> {
  const found = new Promise<string>((resolve) => {
    cdp.on("ServiceWorker.workerRegistrationUpdated", (e: { registrations: { registrationId: string; scopeURL: string; isDeleted: boolean }[] }) => {
      const r = e.registrations.find((x) => x.scopeURL.startsWith(scope) && !x.isDeleted);
      if (r) resolve(r.registrationId);
    });
  });
  await cdp.send("ServiceWorker.enable");
  return found;
}

/** This browser profile's device id, as the app keeps it (lib/offline/device.ts: IndexedDB "pedalpoint-device"). */
async function deviceIdOf(page: Page): Promise<string> {
  return page.evaluate(
    () =>
      new Promise<string>((resolve, reject) => {
        const open = indexedDB.open("pedalpoint-device");
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const get = open.result.transaction("kv").objectStore("kv").get("id");
          get.onsuccess = () => resolve((get.result as { value: string }).value);
          get.onerror = () => reject(get.error);
        };
      }),
  );
}

async function readiness(page: Page) {
  const el = page.getByTestId("readiness");
  await expect(el).toBeVisible({ timeout: 30_000 });
  return el;
}

test.describe("pushed updates and readiness", () => {
  test.use({ viewport: { width: 390, height: 760 } });

  test("a closed player's device gets the leader's edit by push, shows what changed offline, and only then counts as ready", async ({ browser, baseURL }) => {
    test.setTimeout(180_000);
    const leaderCtx = await browser.newContext({ viewport: { width: 1200, height: 900 } });
    const playerCtx = await browser.newContext();
    const lead = account("leader");
    const priya = account("player", 0); // alto sax: reads the E♭ part

    const leader = await syncedPage(leaderCtx, lead.email, lead.password);
    const gig = await makeGig(leader, `Tonight ${Date.now().toString(36)}`, [LANTERNFISH, TIDEWATER]);
    const gigPath = `${band}/setlists/${gig.id}`;

    // The player opens tonight's set list: Pedalpoint asks about notices there, with its reason.
    const player = await syncedPage(playerCtx, priya.email, priya.password);
    // Headless Chromium answers "denied" for notifications until told otherwise: make it ask, as a phone would.
    const { targetInfo } = await (await playerCtx.newCDPSession(player)).send("Target.getTargetInfo");
    const browserCdp = await browser.newBrowserCDPSession();
    await browserCdp.send("Browser.setPermission", { permission: { name: "notifications" }, setting: "prompt", origin: baseURL!, browserContextId: targetInfo.browserContextId });
    await player.goto(gigPath);
    await expect(player.getByTestId("push-prompt")).toContainText("brings the change onto this device", { timeout: 30_000 });
    await player.screenshot({ path: shot("push-01-player-asked-about-notices") });
    // This headless browser has no push service of its own, so its subscription is one the local push
    // fake holds the keys for; the server sends to it exactly as to a browser vendor's service.
    const sub = await fakeSubscriber(player);
    // The player said yes to notices.
    await playerCtx.grantPermissions(["notifications"], { origin: baseURL });
    const saved = await player.request.post("/api/push/subscriptions", {
      headers: origin(player),
      data: { deviceId: "e2e-priya-phone", bandIds: [DEMO_BAND_ID], subscription: { endpoint: sub.endpoint, keys: sub.keys } },
    });
    expect(saved.ok(), await saved.text()).toBe(true);
    await expect(player.getByTestId("set-tune").first()).toBeVisible({ timeout: 30_000 });

    // Leader: the player's device holds tonight's book. (Other specs sign the same player in from
    // browsers of their own, each a device of hers that never saw this gig: follow this one.)
    const phone = await deviceIdOf(player);
    await leader.goto(gigPath);
    await (await readiness(leader)).isVisible();
    await leader.getByTestId("readiness-details").click();
    const priyaRow = leader.locator(`[data-testid="ready-member"][data-name="${"Priya Halloran"}"]`);
    const phoneRow = priyaRow.locator(`[data-testid="ready-device"][data-device="${phone}"]`);
    // The panel shows the reports it loaded; the player's device may report just after, so refresh until it has.
    await expect.poll(async () => {
      await leader.getByRole("button", { name: "Refresh" }).click();
      return phoneRow.getAttribute("data-ready");
    }, { timeout: 30_000, intervals: [500, 1000] }).toBe("true");

    // The player's page closes; a blank tab of the same browser stays for the DevTools session.
    const blank = await playerCtx.newPage();
    const cdp = await playerCtx.newCDPSession(blank);
    const regId = await registrationId(cdp, baseURL!);
    await player.close();

    // The leader moves the tempo and changes bar 6 of a tune on tonight's set.
    const revision = await editChart(leader, TIDEWATER, (t) => t.replace("tempo: 138", "tempo: 144").replace("| Em7 | A7 | Am7 | D7 |\nB:", "| Em7 | Eb7 | Am7 | D7 |\nB:"), 144);
    await expect.poll(async () => (await leader.getByTestId("readiness").getAttribute("data-ready")) ?? "", { timeout: 30_000 }).not.toBe("");
    await leader.getByRole("button", { name: "Refresh" }).click();
    await expect(phoneRow).toHaveAttribute("data-ready", "false", { timeout: 20_000 });
    await expect(priyaRow).toHaveAttribute("data-ready", "false");
    await expect(phoneRow).toContainText(`Tidewater Waltz (has revision ${revision - 1} of ${revision})`);
    await leader.screenshot({ path: shot("push-02-leader-sees-player-behind"), fullPage: true });

    // The server pushed to the player's subscription; the push service decrypted it (RFC 8291).
    await expect.poll(async () => (await pushesFor(leader, sub.id)).length, { timeout: 20_000 }).toBeGreaterThan(0);
    const [message] = await pushesFor(leader, sub.id);
    expect(JSON.parse(message!.payload!)).toMatchObject({ bandId: DEMO_BAND_ID, kind: "chart", chartIds: [TIDEWATER] });

    // Delivered to the player's service worker with no page of the app open: it syncs in the background.
    await cdp.send("ServiceWorker.deliverPushMessage", { origin: new URL(baseURL!).origin, registrationId: regId, data: message!.payload! });
    await leader.getByRole("button", { name: "Refresh" }).click();
    await expect.poll(async () => {
      await leader.getByRole("button", { name: "Refresh" }).click();
      return phoneRow.getAttribute("data-ready");
    }, { timeout: 30_000, intervals: [500, 1000] }).toBe("true");
    await leader.screenshot({ path: shot("push-05-leader-sees-player-ready"), fullPage: true });

    // No signal now. The library marks the tune; the notification says what changed in words.
    await playerCtx.setOffline(true);
    const offline = await playerCtx.newPage();
    await offline.goto(band);
    await expect(offline.locator(`[data-testid="library-row"][data-changed="true"]`)).toBeVisible({ timeout: 30_000 });
    const notices = await offline.evaluate(async () => (await (await navigator.serviceWorker.ready).getNotifications()).map((n) => ({ title: n.title, body: n.body })));
    expect(notices).toHaveLength(1);
    expect(notices[0]!.title).toContain("Tonight");
    expect(notices[0]!.body).toBe("Tidewater Waltz: tempo: 138 → 144");
    await offline.screenshot({ path: shot("push-03-player-library-offline-changed") });

    // The bandstand view of tonight's set, on Tidewater Waltz: the new revision with what changed.
    await offline.goto(`${gigPath}/play?tune=2`);
    const summary = offline.getByTestId("change-summary");
    await expect(summary).toBeVisible({ timeout: 30_000 });
    await expect(summary).toContainText("tempo: 138 → 144");
    // E♭ part: concert A7 reads F♯7 and concert E♭7 reads C7 (up a major 6th; common practice).
    await expect(summary).toContainText("bar 6: F♯7 → C7");
    await expect(offline.getByTestId("head-tempo")).toContainText("144");
    await offline.screenshot({ path: shot("push-04-player-bandstand-offline-summary") });
    await offline.getByTestId("side-by-side").click();
    await expect(offline.getByTestId("revision-compare")).toContainText(`Revision ${revision - 1}`);
  });
});

test.describe("calling the tune", () => {
  test("the leader calls a tune and the follower's bandstand view is on it within a second", async ({ browser }) => {
    test.setTimeout(180_000);
    const leaderCtx = await browser.newContext();
    const followerCtx = await browser.newContext();
    const lead = account("leader");
    const gus = account("player", 1);
    const leader = await syncedPage(leaderCtx, lead.email, lead.password);
    const gig = await makeGig(leader, `Called ${Date.now().toString(36)}`, [LANTERNFISH, TIDEWATER]);
    const play = `${band}/setlists/${gig.id}/play`;

    const follower = await syncedPage(followerCtx, gus.email, gus.password);
    await follower.goto(play);
    await expect(follower.getByTestId("head-title")).toHaveText("Lanternfish", { timeout: 30_000 });
    await follower.getByTestId("follow-toggle").click();
    await expect(follower.getByTestId("follow-toggle")).toHaveAttribute("aria-pressed", "true");
    await expect(follower.getByTestId("chart-page")).toHaveAttribute("data-following", "true");

    await leader.goto(play);
    await expect(leader.getByTestId("head-title")).toHaveText("Lanternfish", { timeout: 30_000 });
    await leader.getByTestId("tune-list-toggle").click();
    await leader.screenshot({ path: shot("call-01-leader-tune-list") });
    // Give the follower's stream a moment to be open before the call (a real band is on it for minutes).
    await follower.waitForTimeout(500);
    const t0 = Date.now();
    await leader.getByRole("button", { name: "Call Tidewater Waltz" }).click();
    await expect(follower.getByTestId("head-title")).toHaveText("Tidewater Waltz", { timeout: 5_000 });
    const took = Date.now() - t0;
    expect(took).toBeLessThan(1_000);
    await expect(follower.getByTestId("chart-page")).toHaveAttribute("data-following", "true");
    await expect(follower.getByTestId("page-counter")).toHaveText(/^1 \//);
    await follower.screenshot({ path: shot("call-02-follower-on-called-tune") });
    // The contexts (with their open event streams) close with the browser at the end of the run.
  });
});
