import { describe, expect, it } from "vitest";
import { applyQuery, DEFAULT_QUERY, facets, readQuery, writeQuery, type LibraryRow } from "@/components/library/query";

// Invented rows for the library's own logic (no music facts are checked here).
const rows: LibraryRow[] = [
  { id: "1", title: "Brass Lantern", composer: "Ada Quill", key: "Eb", feel: "medium swing", tempo: 160, updatedAt: "2026-11-02T10:00:00Z" },
  { id: "2", title: "after hours at the pier", composer: "Ben Rook", key: "F", feel: "ballad", tempo: 60, updatedAt: "2026-11-05T10:00:00Z" },
  { id: "3", title: "Café Tiller", composer: "Ada Quill", key: "F", feel: "Bossa", tempo: null, updatedAt: "2026-10-01T10:00:00Z" },
  { id: "4", title: "Dockside 2", composer: "Cy Lark", key: "Cm", feel: "bossa", tempo: 120, updatedAt: "2026-11-04T10:00:00Z" },
];

const ids = (list: LibraryRow[]) => list.map((r) => r.id);

describe("library query", () => {
  it("round-trips through the address and leaves defaults out", () => {
    const q = { ...DEFAULT_QUERY, q: "pier", sort: "tempo" as const, dir: "desc" as const, key: "F" };
    expect(writeQuery(DEFAULT_QUERY)).toBe("");
    expect(readQuery(new URLSearchParams(writeQuery(q).slice(1)))).toEqual(q);
  });

  it("ignores unknown sort columns in the address", () => {
    expect(readQuery(new URLSearchParams("sort=colour&dir=sideways")).sort).toBe("title");
  });

  it("sorts titles without regard to case", () => {
    expect(ids(applyQuery(rows, DEFAULT_QUERY))).toEqual(["2", "1", "3", "4"]);
  });

  it("searches title, composer and feel, ignoring accents and case", () => {
    expect(ids(applyQuery(rows, { ...DEFAULT_QUERY, q: "cafe" }))).toEqual(["3"]);
    expect(ids(applyQuery(rows, { ...DEFAULT_QUERY, q: "ada" }))).toEqual(["1", "3"]);
    expect(ids(applyQuery(rows, { ...DEFAULT_QUERY, q: "BOSSA" }))).toEqual(["3", "4"]);
  });

  it("filters by key exactly and by feel without regard to case", () => {
    expect(ids(applyQuery(rows, { ...DEFAULT_QUERY, key: "F" }))).toEqual(["2", "3"]);
    expect(ids(applyQuery(rows, { ...DEFAULT_QUERY, feel: "bossa" }))).toEqual(["3", "4"]);
  });

  it("puts charts without a tempo last in either direction", () => {
    expect(ids(applyQuery(rows, { ...DEFAULT_QUERY, sort: "tempo" }))).toEqual(["2", "4", "1", "3"]);
    expect(ids(applyQuery(rows, { ...DEFAULT_QUERY, sort: "tempo", dir: "desc" }))).toEqual(["1", "4", "2", "3"]);
  });

  it("sorts by last update", () => {
    expect(ids(applyQuery(rows, { ...DEFAULT_QUERY, sort: "updated", dir: "desc" }))).toEqual(["2", "4", "1", "3"]);
  });

  it("offers each key and feel once", () => {
    expect(facets(rows)).toEqual({ keys: ["Cm", "Eb", "F"], feels: ["ballad", "Bossa", "medium swing"] });
  });
});
