// Words the screens use for roles, instruments and times, in one place so every screen says the same.
import type { Role } from "@/lib/band/roles";
import type { InstrumentId } from "@/lib/validation/common";

export const ROLE_LABELS: Record<Role, string> = {
  leader: "Leader",
  arranger: "Arranger",
  player: "Player",
  sub: "Sub",
};

export const ROLE_HINTS: Record<Role, string> = {
  leader: "keeps the book, the roster and the set lists",
  arranger: "writes and fixes charts and set lists",
  player: "reads the whole book",
  sub: "reads what the leader shares, until an end time",
};

export const INSTRUMENT_LABELS: Record<InstrumentId, string> = {
  concert: "Concert pitch (piano, guitar, voice, vibes)",
  "concert-bass": "Concert, bass clef (bass, trombone)",
  bb: "B♭ (trumpet, tenor sax, clarinet)",
  eb: "E♭ (alto and baritone sax)",
  f: "F (horn)",
};

export const INSTRUMENT_SHORT: Record<InstrumentId, string> = {
  concert: "Concert",
  "concert-bass": "Bass clef",
  bb: "B♭",
  eb: "E♭",
  f: "F",
};

export const ROLE_OPTIONS = (Object.keys(ROLE_LABELS) as Role[]).map((r) => ({ value: r, label: ROLE_LABELS[r] }));
export const INSTRUMENT_OPTIONS = (Object.keys(INSTRUMENT_LABELS) as InstrumentId[]).map((i) => ({
  value: i,
  label: INSTRUMENT_LABELS[i],
}));

export function instrumentLabel(id: string): string {
  return (INSTRUMENT_SHORT as Record<string, string>)[id] ?? id;
}

export function roleLabel(role: string): string {
  return (ROLE_LABELS as Record<string, string>)[role] ?? role;
}

/** Display a key the way it is printed: Bb → B♭, F# → F♯. */
export function prettyKey(key: string): string {
  return key.replace(/^([A-G])b/, "$1♭").replace(/^([A-G])#/, "$1♯");
}

const DATE = new Intl.DateTimeFormat("en", { day: "numeric", month: "short", year: "numeric" });
const DATE_TIME = new Intl.DateTimeFormat("en", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" });

export function formatDate(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? "" : DATE.format(d);
}

export function formatDateTime(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? "" : DATE_TIME.format(d);
}
