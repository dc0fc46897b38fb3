import type { Role } from "@/db/schema";

export const ROLES: readonly Role[] = ["leader", "arranger", "player", "sub"];

/** Who may do what. Every use case names one of these. */
export const CAN = {
  readBook: ["leader", "arranger", "player"],
  editCharts: ["leader", "arranger"],
  manageMembers: ["leader"],
  manageBand: ["leader"],
  editSetlists: ["leader", "arranger"],
  readSetlists: ["leader", "arranger", "player", "sub"],
  shareWithSubs: ["leader"],
  billing: ["leader"],
  personalMarks: ["leader", "arranger", "player", "sub"],
  /** Anything every member may do about their own membership (their part, leaving the band). */
  belong: ["leader", "arranger", "player", "sub"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof CAN;

const ROLE_NAMES: Record<Role, string> = { leader: "leader", arranger: "arranger", player: "player", sub: "sub" };

/** "the leader role" / "the leader or arranger role" */
export function describeRoles(roles: readonly Role[]): string {
  const names = roles.map((r) => ROLE_NAMES[r]);
  const list = names.length <= 1 ? names.join("") : `${names.slice(0, -1).join(", ")} or ${names[names.length - 1]}`;
  return `the ${list} role`;
}
