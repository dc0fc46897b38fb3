import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));
const { readPartDetails } = await import("@/lib/server/parts");

describe("item 22: a part's name and instrument, read at the boundary", () => {
  it("takes a name, an instrument id and the part it replaces", () => {
    expect(readPartDetails({ partName: "  2nd trumpet ", instrument: "bb" })).toEqual({ partName: "2nd trumpet", instrument: "bb" });
    const id = "11111111-2222-4333-8444-555555555555";
    expect(readPartDetails({ partName: "Bass", instrument: "concert-bass", replaces: id })).toMatchObject({ replaces: id });
  });
  it("refuses an empty name or an unknown instrument, naming the field in plain words", () => {
    expect(() => readPartDetails({ partName: " ", instrument: "bb" })).toThrow(/Give the part a name/);
    try {
      readPartDetails({ partName: "Horn", instrument: "tuba-in-z" });
      expect.unreachable();
    } catch (err) {
      expect((err as { status: number }).status).toBe(422);
      expect((err as { details: { fields: { field: string }[] } }).details.fields[0]!.field).toBe("instrument");
    }
  });
  it("leaves a bare file (an older client) unnamed", () => {
    expect(readPartDetails({})).toBeUndefined();
  });
});
