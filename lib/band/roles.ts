// Roles and what each may do, in one pure module shared by the server's access check and the screens.
// No I/O and no React: the device, the route handlers and the sync push all ask `can()`.
import { z } from "zod";

/** The roles in order of reach: a leader can do everything an arranger can, and so on down. */
export const ROLES = ["leader", "arranger", "player", "sub"] as const;

export const RoleSchema = z.enum(ROLES, { message: "Choose a role: leader, arranger, player or sub" });
export type Role = z.infer<typeof RoleSchema>;

/** Who may do what. Every use case and every screen that hides a control names one of these. */
export const PERMISSIONS = {
  readBook: ["leader", "arranger", "player"],
  editCharts: ["leader", "arranger"],
  manageMembers: ["leader"],
  manageBand: ["leader"],
  editSetlists: ["leader", "arranger"],
  readSetlists: ["leader", "arranger", "player", "sub"],
  /** Every set list of the band, not only the ones shared with the member. */
  readAllSetlists: ["leader", "arranger", "player"],
  shareWithSubs: ["leader"],
  /** Ask the band whether their devices are ready for a gig. */
  nudgeBand: ["leader"],
  /** Call the next tune on the bandstand for everyone (the gig's chosen caller may too). */
  callTunes: ["leader"],
  billing: ["leader"],
  personalMarks: ["leader", "arranger", "player", "sub"],
  /** Anything every member may do about their own membership (their part, leaving the band). */
  belong: ["leader", "arranger", "player", "sub"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

/** Whether a role holds a permission; no role (not a member, not signed in) holds none. */
export function can(role: Role | null | undefined, permission: Permission): boolean {
  if (!role) return false;
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

/** A sub's membership ends at a set time; the other roles stay until changed. */
export function accessEnds(role: string | null | undefined): boolean {
  return role === "sub";
}

/** "the leader role" / "the leader or arranger role" */
export function describeRoles(roles: readonly Role[]): string {
  const list = roles.length <= 1 ? roles.join("") : `${roles.slice(0, -1).join(", ")} or ${roles[roles.length - 1]}`;
  return `the ${list} role`;
}

/** The roles that hold a permission, as words for a message: "the leader or arranger role". */
export function describePermission(permission: Permission): string {
  return describeRoles(PERMISSIONS[permission]);
}

/** "an arranger", "a leader": a role named in a sentence. */
export function aRole(role: Role): string {
  return `${role === "arranger" ? "an" : "a"} ${role}`;
}

/** Leaders first, then arrangers, players and subs. */
export function byRole(a: Role, b: Role): number {
  return ROLES.indexOf(a) - ROLES.indexOf(b);
}
