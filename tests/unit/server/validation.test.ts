// Bad bodies are refused with 422 naming the field, before anything is written.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { createBand } from "@/lib/server/bands";
import { createChart, updateChart } from "@/lib/server/charts";
import { inviteMember, setMyInstrument, updateMember } from "@/lib/server/members";
import { signUp } from "@/lib/server/users";
import { appError, chartInput, cleanupDbs, freshDb, makeBand, type BandCast } from "./helpers";

vi.mock("@/lib/mail", async (importOriginal) => ({ ...(await importOriginal<typeof import("@/lib/mail")>()), sendMail: vi.fn(async () => undefined) }));

let db: Kysely<Database>;
let cast: BandCast;
beforeAll(async () => {
  db = await freshDb();
  cast = await makeBand(db);
});
afterAll(async () => {
  await db.destroy();
  cleanupDbs();
});

async function fieldsOf(fn: () => Promise<unknown>): Promise<{ status: number; fields: string[] }> {
  const err = await appError(fn);
  return { status: err.status, fields: (err.details?.fields ?? []).map((f) => f.field) };
}

function without<T extends Record<string, unknown>>(o: T, key: keyof T): Partial<T> {
  const copy: Partial<T> = { ...o };
  delete copy[key];
  return copy;
}

describe("chart bodies", () => {
  const cases: Array<[string, Record<string, unknown>, string]> = [
    ["missing title", without(chartInput(), "title"), "title"],
    ["empty title", chartInput({ title: "   " }), "title"],
    ["title over 200 characters", chartInput({ title: "x".repeat(201) }), "title"],
    ["missing key", without(chartInput(), "key"), "key"],
    ["a key that is not a key", chartInput({ key: "H" }), "key"],
    ["missing time signature", without(chartInput(), "meter"), "meter"],
    ["a time signature in words", chartInput({ meter: "common" }), "meter"],
    ["tempo as a string", chartInput({ tempo: "fast" }), "tempo"],
    ["tempo out of range", chartInput({ tempo: 4000 }), "tempo"],
    ["tempo with a fraction", chartInput({ tempo: 120.5 }), "tempo"],
    ["missing chart text", without(chartInput(), "sourceText"), "sourceText"],
    ["chart text as a number", chartInput({ sourceText: 42 }), "sourceText"],
    ["chart text over 50,000 characters", chartInput({ sourceText: "|".repeat(50_001) }), "sourceText"],
    ["feel over 60 characters", chartInput({ feel: "f".repeat(61) }), "feel"],
    ["an unknown key", chartInput({ colour: "red" }), "(body)"],
    ["an id that is not a UUID", chartInput({ id: "not-a-uuid" }), "id"],
  ];
  for (const [what, body, field] of cases) {
    it(`createChart refuses ${what} (422 on ${field})`, async () => {
      const r = await fieldsOf(() => createChart(db, cast.leader, cast.bandId, body));
      expect(r.status).toBe(422);
      expect(r.fields).toContain(field);
    });
  }

  it("updateChart needs the revision it edits", async () => {
    const chart = await createChart(db, cast.leader, cast.bandId, chartInput());
    const r = await fieldsOf(() => updateChart(db, cast.leader, cast.bandId, chart.id, chartInput()));
    expect(r).toEqual({ status: 422, fields: ["baseRevision"] });
    const r2 = await fieldsOf(() => updateChart(db, cast.leader, cast.bandId, chart.id, { ...chartInput(), baseRevision: "1" }));
    expect(r2.fields).toContain("baseRevision");
  });

  it("chart text the parser cannot read is a 422 on sourceText with its line and column", async () => {
    const text = "title: Broken\nkey: C\ntime: 4/4\n\nA:\n| Cmaj7 | Qzz9 |\n";
    const err = await appError(() => createChart(db, cast.leader, cast.bandId, chartInput({ sourceText: text })));
    expect(err.status).toBe(422);
    const f = err.details?.fields?.[0];
    expect(f?.field).toBe("sourceText");
    expect(f?.line).toBe(6);
    expect(typeof f?.column).toBe("number");
    const rows = await db.selectFrom("charts").select("id").where("title", "=", "Broken").execute();
    expect(rows).toHaveLength(0);
  });
});

describe("band, member and account bodies", () => {
  it("createBand: missing name, long name, unknown key, wrong type", async () => {
    expect(await fieldsOf(() => createBand(db, cast.leader, {}))).toEqual({ status: 422, fields: ["name"] });
    expect((await fieldsOf(() => createBand(db, cast.leader, { name: "n".repeat(121) }))).fields).toEqual(["name"]);
    expect((await fieldsOf(() => createBand(db, cast.leader, { name: "Ok", owner: "me" }))).fields).toEqual(["(body)"]);
    expect((await fieldsOf(() => createBand(db, cast.leader, { name: 7 }))).fields).toEqual(["name"]);
  });

  it("inviteMember: bad e-mail, unknown role, unknown instrument, past access end", async () => {
    const bad = (body: Record<string, unknown>) => fieldsOf(() => inviteMember(db, cast.leader, cast.bandId, body));
    expect((await bad({ email: "not-an-address", role: "player" })).fields).toEqual(["email"]);
    expect((await bad({ email: "a@band.test", role: "owner" })).fields).toEqual(["role"]);
    expect((await bad({ email: "a@band.test", role: "player", instrument: "kazoo" })).fields).toEqual(["instrument"]);
    expect((await bad({ email: "a@band.test" })).fields).toEqual(["role"]);
    expect((await bad({ email: "a@band.test", role: "sub", accessExpiresAt: "2000-01-01T00:00:00Z" })).fields).toEqual(["accessExpiresAt"]);
    expect((await bad({ email: "a@band.test", role: "sub", accessExpiresAt: "next friday" })).fields).toEqual(["accessExpiresAt"]);
    expect((await bad({ email: `${"a".repeat(250)}@band.test`, role: "player" })).fields).toEqual(["email"]);
  });

  it("updateMember: an empty change and unknown keys are refused", async () => {
    expect((await fieldsOf(() => updateMember(db, cast.leader, cast.bandId, cast.player.userId, {}))).status).toBe(422);
    expect((await fieldsOf(() => updateMember(db, cast.leader, cast.bandId, cast.player.userId, { role: "player", admin: true }))).fields).toEqual(["(body)"]);
  });

  it("setMyInstrument: unknown instrument", async () => {
    expect((await fieldsOf(() => setMyInstrument(db, cast.player, { instrument: "oboe" }))).fields).toEqual(["instrument"]);
  });

  it("signUp: short password, bad e-mail, missing name, unknown key", async () => {
    const base = { name: "New Player", email: "new.player@band.test", password: "long enough" };
    expect((await fieldsOf(() => signUp(db, { ...base, password: "short" }))).fields).toEqual(["password"]);
    expect((await fieldsOf(() => signUp(db, { ...base, email: "nope" }))).fields).toEqual(["email"]);
    expect((await fieldsOf(() => signUp(db, without(base, "name")))).fields).toEqual(["name"]);
    expect((await fieldsOf(() => signUp(db, { ...base, isAdmin: true }))).fields).toEqual(["(body)"]);
    expect((await fieldsOf(() => signUp(db, { ...base, password: "p".repeat(201) }))).fields).toEqual(["password"]);
  });
});
