// Helpers for the gig tests: a set list for tonight made through the API, a chart edit as the
// leader's desk sends it, and the local push fake's HTTP side.
import { randomUUID } from "node:crypto";
import { expect, type BrowserContext, type Page } from "@playwright/test";
import { DEMO_ACCOUNTS, demoId } from "../../../db/seed";
import { signIn } from "./auth";
import { DEMO_BAND_ID } from "./demo";

export const band = `/bands/${DEMO_BAND_ID}`;
export const TIDEWATER = demoId("chart:tidewater-waltz");
export const LANTERNFISH = demoId("chart:lanternfish");
export const PUSH_FAKE = `http://127.0.0.1:${process.env.PUSH_FAKE_PORT}`;
export const shot = (name: string) => `test-results/screenshots/${name}.png`;

export function account(role: string, index = 0) {
  const a = DEMO_ACCOUNTS.filter((x) => x.role === role)[index];
  if (!a) throw new Error(`no demo ${role} #${index}`);
  return a;
}

/** Unsafe requests carry the app's own Origin, as the browser's would. */
export function origin(page: Page): Record<string, string> {
  return { origin: new URL(page.url()).origin };
}

/** Signs in on a fresh page and waits until the service worker controls it and the book is here. */
export async function syncedPage(context: BrowserContext, email: string, password: string): Promise<Page> {
  const page = await context.newPage();
  await signIn(page, email, password, band);
  await page.goto(band);
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  if (!(await page.evaluate(() => Boolean(navigator.serviceWorker.controller)))) await page.reload();
  await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller)), { timeout: 30_000 }).toBe(true);
  await expect(page.getByTestId("sync-status")).toHaveAttribute("data-state", "online", { timeout: 30_000 });
  return page;
}

export async function makeGig(page: Page, name: string, chartIds: string[]): Promise<{ id: string; entries: { id: string; chartId: string }[] }> {
  const entries = chartIds.map((chartId, position) => ({ id: randomUUID(), chartId, setNumber: 1, position }));
  const startsAt = new Date(Date.now() + 3 * 3600_000).toISOString();
  const res = await page.request.post(`/api/bands/${DEMO_BAND_ID}/setlists`, { headers: origin(page), data: { name, startsAt, venue: "The Lanternfish Room", notes: "", entries } });
  expect(res.ok(), await res.text()).toBe(true);
  return ((await res.json()) as { setlist: { id: string; entries: { id: string; chartId: string }[] } }).setlist;
}

interface ServerChart {
  title: string;
  composer: string;
  key: string;
  meter: string;
  tempo: number | null;
  feel: string;
  sourceText: string;
  revision: number;
}

/** The leader publishes an edit of one chart, as the chart form does. */
export async function editChart(page: Page, chartId: string, edit: (text: string) => string, tempo?: number): Promise<number> {
  const got = await page.request.get(`/api/bands/${DEMO_BAND_ID}/charts/${chartId}`);
  const c = ((await got.json()) as { chart: ServerChart }).chart;
  const sourceText = edit(c.sourceText);
  const data = { title: c.title, composer: c.composer, key: c.key, meter: c.meter, tempo: tempo ?? c.tempo, feel: c.feel, sourceText, baseRevision: c.revision };
  const res = await page.request.put(`/api/bands/${DEMO_BAND_ID}/charts/${chartId}`, { headers: origin(page), data });
  expect(res.ok(), await res.text()).toBe(true);
  return ((await res.json()) as { chart: ServerChart }).chart.revision;
}

export interface FakeSubscriber {
  id: string;
  endpoint: string;
  keys: { p256dh: string; auth: string };
}

export async function fakeSubscriber(page: Page): Promise<FakeSubscriber> {
  const res = await page.request.post(`${PUSH_FAKE}/subscribers`, { data: {} });
  return (await res.json()) as FakeSubscriber;
}

export async function pushesFor(page: Page, subscriber: string): Promise<{ payload: string | null; topic: string | null }[]> {
  const res = await page.request.get(`${PUSH_FAKE}/messages?subscriber=${subscriber}`);
  return ((await res.json()) as { messages: { payload: string | null; topic: string | null }[] }).messages;
}
