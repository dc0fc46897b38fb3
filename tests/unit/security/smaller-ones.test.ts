// Issue 10 item 13, the remaining smaller ones, against real SQLite and real files: what a sub may
// read, a sub's full pull, a DOCTYPE hidden behind a long comment, unfinished upload files.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { assertNoEntityDeclarations } from "@/lib/musicxml/xml";
import { createChart, getChart, listRevisions } from "@/lib/server/charts";
import { exportChartMusicXml } from "@/lib/server/musicxml-export";
import { removeStaleUploads } from "@/lib/server/stale-uploads";
import { chartInput, cleanupDbs, freshDb, makeBand, outcome, type BandCast } from "../server/helpers";
import { makeSetlist, pull, shareWith } from "../sync/helpers";

let db: Kysely<Database>;
let cast: BandCast;
let shared = "";
let unshared = "";
let sharedList = "";
let otherList = "";
beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
  shared = (await createChart(db, cast.leader, cast.bandId, chartInput({ title: "On The Shared Set" }))).id;
  unshared = (await createChart(db, cast.leader, cast.bandId, chartInput({ title: "Not For Subs" }))).id;
  sharedList = await makeSetlist(db, cast.bandId, cast.leader, [shared], "Shared Friday");
  otherList = await makeSetlist(db, cast.bandId, cast.leader, [unshared], "Private Saturday");
  await shareWith(db, cast.bandId, sharedList, cast.sub, cast.leader, new Date(Date.now() + 86_400_000));
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

describe("one rule for what a sub may read", () => {
  it("a chart shared with the sub: its text, history and MusicXML, as its parts and sync give it", async () => {
    expect((await getChart(db, cast.sub, cast.bandId, shared)).title).toBe("On The Shared Set");
    expect((await listRevisions(db, cast.sub, cast.bandId, shared)).map((r) => r.revision)).toEqual([1]);
    expect((await exportChartMusicXml(db, cast.sub, cast.bandId, shared, "bb")).xml).toContain("<score-partwise");
  });

  it("a chart not shared with the sub stays refused everywhere", async () => {
    expect(await outcome(() => getChart(db, cast.sub, cast.bandId, unshared))).toBe(403);
    expect(await outcome(() => listRevisions(db, cast.sub, cast.bandId, unshared))).toBe(403);
    expect(await outcome(() => exportChartMusicXml(db, cast.sub, cast.bandId, unshared, "concert"))).toBe(403);
  });
});

describe("a sub's full pull", () => {
  it("names only the set lists shared with them, never the ids of the band's other set lists", async () => {
    const page = await pull(db, cast.sub, cast.bandId, { since: 0, limit: 500 });
    const text = JSON.stringify(page);
    expect(page.changes.filter((c) => c.entity === "setlist").map((c) => [c.id, c.op])).toEqual([[sharedList, "upsert"]]);
    expect(text).not.toContain(otherList);
  });
});

describe("the entity check of an upload reads the whole prolog", () => {
  it("a DOCTYPE with an entity after a 300 KB comment is refused", () => {
    const xml = `<?xml version="1.0"?>\n<!--${" ".repeat(300_000)}-->\n<!DOCTYPE score-partwise [<!ENTITY lol "lol">]>\n<score-partwise/>`;
    expect(() => assertNoEntityDeclarations(xml)).toThrow(/entities/);
  });

  it("an entity-like text inside the score body after the root is not mistaken for a declaration", () => {
    expect(() => assertNoEntityDeclarations(`<score-partwise><credit-words>&lt;!ENTITY</credit-words></score-partwise>`)).not.toThrow();
  });
});

describe("unfinished uploads", () => {
  it("a *.part file left by a killed upload is removed at start; stored parts stay", () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-parts-"));
    fs.mkdirSync(path.join(dir, "attachments"), { recursive: true });
    fs.writeFileSync(path.join(dir, "attachments", "abc.123.456.part"), "half a file");
    fs.writeFileSync(path.join(dir, "attachments", "abc"), "a whole part");
    expect(removeStaleUploads(dir)).toBe(1);
    expect(fs.readdirSync(path.join(dir, "attachments"))).toEqual(["abc"]);
    fs.rmSync(dir, { recursive: true, force: true });
  });
});
