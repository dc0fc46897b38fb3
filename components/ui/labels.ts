// Words the screens use for roles, instruments and times, in one place so every screen says the same.
import type { Role } from "@/lib/band/roles";
import { INSTRUMENT_IDS, INSTRUMENTS, isInstrumentId } from "@/lib/music/instruments";

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

export const ROLE_OPTIONS = (Object.keys(ROLE_LABELS) as Role[]).map((r) => ({ value: r, label: ROLE_LABELS[r] }));
/** The part pickers' choices, from lib/music/instruments: "B♭ (trumpet, tenor sax, clarinet)". */
export const INSTRUMENT_OPTIONS = INSTRUMENT_IDS.map((i) => ({ value: i, label: `${INSTRUMENTS[i].short} (${INSTRUMENTS[i].readBy})` }));

export function instrumentLabel(id: string): string {
  return isInstrumentId(id) ? INSTRUMENTS[id].short : id;
}

export function roleLabel(role: string): string {
  return (ROLE_LABELS as Record<string, string>)[role] ?? role;
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
