// Reading settings kept on this device only (pedals and light differ per stand): which keys turn
// pages, the bandstand theme, the early turn, and the last instrument chosen per band.
import { useSyncExternalStore } from "react";
import { z } from "zod";

export const THEMES = ["stage", "ember"] as const;
export type Theme = (typeof THEMES)[number];

export const ReadingSettingsSchema = z.object({
  nextKeys: z.array(z.string().min(1).max(40)).max(8),
  backKeys: z.array(z.string().min(1).max(40)).max(8),
  theme: z.enum(THEMES),
  // Defaulted so an entry saved before this setting existed keeps its pedal keys.
  earlyTurn: z.boolean().default(false),
});
export type ReadingSettings = z.infer<typeof ReadingSettingsSchema>;

export const DEFAULT_SETTINGS: ReadingSettings = {
  nextKeys: ["PageDown", "ArrowRight", "ArrowDown", " "],
  backKeys: ["PageUp", "ArrowLeft", "ArrowUp"],
  theme: "stage",
  earlyTurn: false,
};

const STORE_KEY = "pedalpoint.reading";
const listeners = new Set<() => void>();
let cached: { raw: string | null; value: ReadingSettings } | null = null;

function read(): ReadingSettings {
  if (typeof localStorage === "undefined") return DEFAULT_SETTINGS;
  const raw = localStorage.getItem(STORE_KEY);
  if (cached && cached.raw === raw) return cached.value;
  let value = DEFAULT_SETTINGS;
  try {
    const r = ReadingSettingsSchema.safeParse(raw ? JSON.parse(raw) : null);
    if (r.success) value = r.data;
  } catch {
    // A damaged entry reads as the defaults.
  }
  cached = { raw, value };
  return value;
}

export function saveReadingSettings(next: ReadingSettings): void {
  localStorage.setItem(STORE_KEY, JSON.stringify(ReadingSettingsSchema.parse(next)));
  listeners.forEach((l) => l());
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  const onStorage = (e: StorageEvent) => e.key === STORE_KEY && listener();
  window.addEventListener("storage", onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener("storage", onStorage);
  };
}

export function useReadingSettings(): ReadingSettings {
  return useSyncExternalStore(subscribe, read, () => DEFAULT_SETTINGS);
}

/** "Space" for " ", otherwise the key's own name. */
export function keyName(key: string): string {
  return key === " " ? "Space" : key;
}

const INSTRUMENT_KEY = "pedalpoint.instrument.";

export function rememberedInstrument(bandId: string): string | null {
  if (typeof localStorage === "undefined") return null;
  return localStorage.getItem(INSTRUMENT_KEY + bandId);
}

export function rememberInstrument(bandId: string, instrument: string): void {
  localStorage.setItem(INSTRUMENT_KEY + bandId, instrument);
}
