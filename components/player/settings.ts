// What the player remembers on this device: the listening level, the last mutes, whether the count-in
// plays and whether the bandstand view turns pages while playing. Kept in localStorage, read with
// useSyncExternalStore so every control on the page shows the same values.
import { useSyncExternalStore } from "react";
import { z } from "zod";

const KEY = "pedalpoint.player";

const PlayerSettingsSchema = z.object({
  volume: z.number().min(0).max(1).catch(0.6),
  mutes: z.object({ piano: z.boolean().catch(false), bass: z.boolean().catch(false), drums: z.boolean().catch(false) }).catch({ piano: false, bass: false, drums: false }),
  countIn: z.boolean().catch(true),
  autoTurn: z.boolean().catch(true),
});
export type PlayerSettings = z.infer<typeof PlayerSettingsSchema>;

export const DEFAULT_PLAYER_SETTINGS: PlayerSettings = { volume: 0.6, mutes: { piano: false, bass: false, drums: false }, countIn: true, autoTurn: true };

const listeners = new Set<() => void>();
let cachedRaw: string | null | undefined;
let cached: PlayerSettings = DEFAULT_PLAYER_SETTINGS;

function read(): PlayerSettings {
  let raw: string | null = null;
  try {
    raw = window.localStorage.getItem(KEY);
  } catch {
    return cached; // storage refused (private mode): keep what this page has
  }
  if (raw === cachedRaw) return cached;
  cachedRaw = raw;
  try {
    cached = raw ? PlayerSettingsSchema.parse(JSON.parse(raw)) : DEFAULT_PLAYER_SETTINGS;
  } catch {
    cached = DEFAULT_PLAYER_SETTINGS;
  }
  return cached;
}

export function savePlayerSettings(next: PlayerSettings): void {
  cached = next;
  try {
    cachedRaw = JSON.stringify(next);
    window.localStorage.setItem(KEY, cachedRaw);
  } catch {
    // Not stored; this page still uses the new values.
  }
  for (const l of listeners) l();
}

function subscribe(l: () => void): () => void {
  listeners.add(l);
  const onStorage = (e: StorageEvent) => e.key === KEY && l();
  window.addEventListener("storage", onStorage);
  return () => {
    listeners.delete(l);
    window.removeEventListener("storage", onStorage);
  };
}

export function usePlayerSettings(): PlayerSettings {
  return useSyncExternalStore(subscribe, read, () => DEFAULT_PLAYER_SETTINGS);
}
