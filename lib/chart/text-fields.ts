// The metadata lines of chart text (`title:`, `key:`, `time:` …): what each accepts and its errors.
import { keyFifths, readKey, simplestKey } from "@/lib/music";
import type { Meter } from "./model";
import { ChartTextError } from "./text-error";

export const METADATA_FIELDS = ["title", "composer", "key", "time", "tempo", "feel", "pickup"] as const;
export type Field = (typeof METADATA_FIELDS)[number];

export interface Meta {
  title?: string;
  composer?: string;
  key?: string;
  meter?: Meter;
  tempo?: number | null;
  feel?: string;
  /** Beats of the short first bar (`pickup: 1 beat`). */
  pickup?: number;
}

function readMeter(text: string): Meter | null {
  const t = text.trim().toLowerCase();
  if (t === "c" || t === "common") return { beats: 4, unit: 4 };
  if (t === "cut" || t === "¢") return { beats: 2, unit: 2 };
  const m = /^(\d{1,2})\s*\/\s*(\d{1,2})$/.exec(t);
  if (!m) return null;
  const beats = Number(m[1]);
  const unit = Number(m[2]);
  if (beats < 1 || beats > 16 || (unit !== 2 && unit !== 4 && unit !== 8)) return null;
  return { beats, unit };
}

export function readField(field: Field, value: string, line: number, column: number, meta: Meta): void {
  const fail = (msg: string): never => {
    throw new ChartTextError(line, column, msg);
  };
  switch (field) {
    case "title":
      if (!value) fail("The title is empty: write it after `title:`");
      if (value.length > 200) fail("The title is too long (200 characters at most)");
      meta.title = value;
      return;
    case "composer":
      if (value.length > 200) fail("The composer line is too long (200 characters at most)");
      meta.composer = value;
      return;
    case "key": {
      const k = readKey(value);
      if (!k) fail(`"${value}" is not a key: write a major key like Eb or F#, or a minor key like Cm`);
      const fifths = keyFifths(k!);
      if (Math.abs(fifths) > 7) {
        fail(`"${value}" would need ${Math.abs(fifths)} ${fifths > 0 ? "sharps" : "flats"}: write it as ${simplestKey(k!, false).name}`);
      }
      meta.key = k!.name;
      return;
    }
    case "time": {
      const m = readMeter(value);
      if (!m) fail(`"${value}" is not a time signature we read: write it like 4/4, 3/4, 6/8 or 12/8 (up to 16 beats)`);
      meta.meter = m!;
      return;
    }
    case "tempo": {
      if (!value) {
        meta.tempo = null;
        return;
      }
      const m = /^(\d{1,3})(?:\s*bpm)?$/i.exec(value);
      const n = m ? Number(m[1]) : NaN;
      if (!(n >= 20 && n <= 400)) fail(`"${value}" is not a tempo: write beats per minute between 20 and 400, like 160`);
      meta.tempo = n;
      return;
    }
    case "feel":
      if (value.length > 60) fail("The feel is too long (60 characters at most)");
      meta.feel = value;
      return;
    case "pickup": {
      const m = /^(\d{1,2})(?:\s*beats?)?$/i.exec(value);
      const n = m ? Number(m[1]) : NaN;
      if (!(n >= 1 && n <= 15)) fail(`"${value}" is not a pickup: write how many beats the short first bar has, like \`pickup: 1 beat\` or \`pickup: 2 beats\``);
      meta.pickup = n;
    }
  }
}
