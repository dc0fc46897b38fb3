"use client";
// Resolving a conflict copy: the device's version of a chart that clashed with a newer one on the
// server. Nothing happens to it until someone decides; a leader or arranger can publish it.
import { getLocalBook } from "./db";
import { saveChart } from "./mutations";
import type { SaveResult } from "./send";
import { COPY_SUFFIX } from "./push";
import type { ChartRow, LocalChart } from "./types";

async function load(copyId: string): Promise<{ copy: ChartRow; original: ChartRow | null } | null> {
  const book = getLocalBook();
  const copy = await book.charts.get(copyId);
  if (!copy?.conflictOf) return null;
  return { copy, original: (await book.charts.get(copy.conflictOf)) ?? null };
}

function inputOf(copy: ChartRow, title: string, message: string) {
  return { title, composer: copy.composer, key: copy.key, meter: copy.meter, tempo: copy.tempo, feel: copy.feel, sourceText: copy.sourceText, message };
}

export async function discardCopy(copyId: string): Promise<void> {
  const book = getLocalBook();
  await book.transaction("rw", book.charts, book.conflicts, async () => {
    await book.charts.delete(copyId);
    await book.conflicts.delete(copyId);
  });
}

const cleanTitle = (t: string) => (t.endsWith(COPY_SUFFIX) ? t.slice(0, -COPY_SUFFIX.length) : t);

/** Publishes this device's version as the chart's next revision, on top of the band's current one. */
export async function publishCopy(copyId: string): Promise<SaveResult<LocalChart> | null> {
  const got = await load(copyId);
  if (!got) return null;
  const { copy, original } = got;
  const input = inputOf(copy, cleanTitle(copy.title), "Kept the version edited offline");
  const result = original
    ? await saveChart(copy.bandId, { ...input, id: original.id, baseRevision: original.revision })
    : await saveChart(copy.bandId, input);
  if (result.status === "saved" || result.status === "queued") await discardCopy(copyId);
  return result;
}

/** Keeps both: the device's version becomes a chart of its own. */
export async function saveCopyAsNewChart(copyId: string): Promise<SaveResult<LocalChart> | null> {
  const got = await load(copyId);
  if (!got) return null;
  const result = await saveChart(got.copy.bandId, inputOf(got.copy, got.copy.title, "Saved from a version edited offline"));
  if (result.status === "saved" || result.status === "queued") await discardCopy(copyId);
  return result;
}
