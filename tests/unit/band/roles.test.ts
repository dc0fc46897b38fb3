// The one table of who may do what; the server's role × action matrix checks the same rules end to end.
import { describe, expect, it } from "vitest";
import { PERMISSIONS, ROLES, RoleSchema, aRole, accessEnds, byRole, can, describePermission } from "@/lib/band/roles";

describe("roles", () => {
  it("lets leaders and arrangers edit charts and set lists, not players or subs", () => {
    expect(ROLES.filter((r) => can(r, "editCharts"))).toEqual(["leader", "arranger"]);
    expect(ROLES.filter((r) => can(r, "editSetlists"))).toEqual(["leader", "arranger"]);
  });

  it("keeps the whole book from subs and the roster to leaders", () => {
    expect(can("sub", "readBook")).toBe(false);
    expect(can("player", "readBook")).toBe(true);
    expect(ROLES.filter((r) => can(r, "manageMembers"))).toEqual(["leader"]);
  });

  it("grants nothing without a role", () => {
    for (const p of Object.keys(PERMISSIONS) as (keyof typeof PERMISSIONS)[]) {
      expect(can(null, p)).toBe(false);
      expect(can(undefined, p)).toBe(false);
    }
  });

  it("gives a leader every permission (the role order is one of reach)", () => {
    for (const p of Object.keys(PERMISSIONS) as (keyof typeof PERMISSIONS)[]) expect(can("leader", p)).toBe(true);
  });

  it("parses only the four roles and names them in words", () => {
    expect(RoleSchema.safeParse("guest").success).toBe(false);
    expect(RoleSchema.parse("sub")).toBe("sub");
    expect(describePermission("editCharts")).toBe("the leader or arranger role");
    expect(aRole("arranger")).toBe("an arranger");
    expect(aRole("player")).toBe("a player");
    expect(accessEnds("sub")).toBe(true);
    expect(accessEnds("player")).toBe(false);
    expect(["sub", "leader", "player"].sort((a, b) => byRole(RoleSchema.parse(a), RoleSchema.parse(b)))).toEqual(["leader", "player", "sub"]);
  });
});
