// The one notification a device shows for pushed changes, in words: "Friday at the Lanternfish Room:
// Tidewater Waltz now in A♭, 2 charts updated". A burst of pushes folds into the notification already
// showing (same tag), its chart count growing, so ten edits in a minute are still one notification.
import { headline, type ChangeLine } from "@/lib/chart/changes";

export interface ChangedTune {
  chartId: string;
  title: string;
  lines: ChangeLine[];
}

/** Kept on the notification itself (its `data`), so the next push can fold into it. */
export interface NoticeData {
  bandId: string;
  setlistId: string | null;
  chartIds: string[];
  lead: string | null;
  url: string;
}

export interface Notice {
  title: string;
  body: string;
  tag: string;
  data: NoticeData;
}

export interface NoticeInput {
  bandId: string;
  bandName: string;
  /** Tonight's set list the changes sit on, if any. */
  setlist: { id: string; name: string } | null;
  changed: ChangedTune[];
  /** The notification already showing for this band, if any. */
  previous: NoticeData | null;
  /** A nudge from the leader (nothing may have changed). */
  nudge?: boolean;
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

/** The key move is what a player most needs to know before the count-off; else the first change. */
const movesKey = (c: ChangedTune) => c.lines.some((l) => l.text.startsWith("key:") || l.text.startsWith("tonight's key:"));

/** A key move in this push leads; otherwise the lead already showing stays; otherwise the first change. */
function leadOf(changed: ChangedTune[], previous: string | null): string | null {
  const keyed = changed.find(movesKey);
  if (keyed) return headline(keyed.title, keyed.lines);
  if (previous) return previous;
  const pick = changed.find((c) => c.lines.length > 0) ?? changed[0];
  return pick ? headline(pick.title, pick.lines) : null;
}

export function noticeTag(bandId: string): string {
  return `pedalpoint-changes-${bandId}`;
}

export function composeNotice(input: NoticeInput): Notice {
  const prev = input.previous && input.previous.bandId === input.bandId ? input.previous : null;
  const chartIds = [...new Set([...(prev?.chartIds ?? []), ...input.changed.map((c) => c.chartId)])];
  const lead = leadOf(input.changed, prev?.lead ?? null);
  const setlistId = input.setlist?.id ?? prev?.setlistId ?? null;
  const band = `/bands/${encodeURIComponent(input.bandId)}`;
  // Tapping opens the one chart that changed, else tonight's set list, else the library.
  const only = chartIds.length === 1 ? chartIds[0]! : null;
  const url = only ? `${band}/charts/${encodeURIComponent(only)}` : setlistId ? `${band}/setlists/${encodeURIComponent(setlistId)}` : band;
  const title = input.setlist?.name ?? input.bandName;
  let body: string;
  if (chartIds.length === 0) body = input.nudge ? "The leader asked you to sync before the gig: this device now holds the latest book." : "The book on this device is up to date.";
  else if (chartIds.length === 1) body = lead ?? "1 chart updated";
  else body = lead ? `${lead}, ${plural(chartIds.length, "chart")} updated` : `${plural(chartIds.length, "chart")} updated`;
  return { title, body, tag: noticeTag(input.bandId), data: { bandId: input.bandId, setlistId, chartIds, lead, url } };
}
