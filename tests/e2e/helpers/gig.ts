// Puts a chart or a set list into the demo band through the real routes, as the leader's device
// would, then waits until this browser's local book holds it.
import { randomUUID } from "node:crypto";
import { expect, type Page } from "@playwright/test";
import { demoId } from "../../../db/seed";
import { DEMO_BAND_ID } from "./demo";

const api = (path: string) => `/api/bands/${DEMO_BAND_ID}${path}`;

async function post(page: Page, path: string, data: unknown): Promise<Record<string, unknown>> {
  const origin = new URL(page.url() === "about:blank" ? "http://localhost" : page.url()).origin;
  const res = await page.request.post(api(path), { data, headers: { Origin: origin } });
  expect(res.ok(), `POST ${path} answered ${res.status()}: ${await res.text()}`).toBeTruthy();
  return (await res.json()) as Record<string, unknown>;
}

/** Creates a chart from chart text (the page must be signed in as a leader or arranger). Returns its id. */
export async function addChart(page: Page, fields: { title: string; key: string; meter?: string; tempo?: number; composer?: string; text: string }): Promise<string> {
  const id = randomUUID();
  await post(page, "/charts", {
    id,
    title: fields.title,
    composer: fields.composer ?? "",
    key: fields.key,
    meter: fields.meter ?? "4/4",
    tempo: fields.tempo ?? null,
    sourceText: fields.text,
  });
  return id;
}

export interface GigTune {
  chartId: string;
  setNumber?: number;
  key?: string | null;
  ending?: { kind: "tag"; bars: number; times: number } | { kind: "cold" } | null;
  intro?: Record<string, unknown> | null;
}

/** Creates a set list; every tune in set 1 unless it says otherwise. Returns its id. */
export async function addGig(page: Page, name: string, tunes: GigTune[]): Promise<string> {
  const id = randomUUID();
  const positions = new Map<number, number>();
  const entries = tunes.map((t) => {
    const set = t.setNumber ?? 1;
    const position = positions.get(set) ?? 0;
    positions.set(set, position + 1);
    return { id: randomUUID(), chartId: t.chartId, setNumber: set, position, key: t.key ?? null, intro: t.intro ?? null, ending: t.ending ?? null };
  });
  await post(page, "/setlists", { id, name, entries });
  return id;
}

export const chartId = (slug: string) => demoId(`chart:${slug}`);

/** Opens the library and waits until the device's book lists `title` (a sync has brought it). */
export async function waitForBook(page: Page, title: string): Promise<void> {
  await page.goto(`/bands/${DEMO_BAND_ID}`);
  await expect(page.getByText(title, { exact: false }).first()).toBeVisible({ timeout: 30_000 });
}
