// An in-memory database with one invented band, its people and two invented charts.
import type { Kysely } from "kysely";
import { openTestDatabase } from "@/db/test-database";
import type { Database } from "@/db/schema";
import type { Role } from "@/lib/band/roles";
import { ChartSchema, type Bar, type Chart } from "@/lib/chart/model";
import type { Actor } from "@/lib/server/access";

export const NOW = new Date("2026-12-01T18:00:00.000Z");
export const LATER = new Date("2026-12-05T18:00:00.000Z");

export function bar(...symbols: string[]): Bar {
  const beats = 4 / Math.max(1, symbols.length);
  return {
    chords: symbols.map((s, i) => ({ symbol: s, beat: i * beats, beats })),
    simile: false,
    repeatStart: false,
    repeatEnd: false,
    ending: null,
  };
}

/** "Harbour Lights at Dusk": an invented AABA tune in F, no composed intro. */
export function harbourChart(): Chart {
  return ChartSchema.parse({
    title: "Harbour Lights at Dusk",
    key: "F",
    meter: { beats: 4, unit: 4 },
    sections: [
      { label: "A", bars: [bar("Fmaj7"), bar("D7"), bar("Gm7"), bar("C7"), bar("Am7"), bar("Abdim7"), bar("Gm7", "C7"), bar("Fmaj7")] },
      { label: "A", bars: [bar("Fmaj7"), bar("D7"), bar("Gm7"), bar("C7"), bar("Am7"), bar("Abdim7"), bar("Gm7", "C7"), bar("F6")] },
      { label: "B", bars: [bar("Cm7"), bar("F7"), bar("Bbmaj7"), bar("Bbm6"), bar("Am7"), bar("D7"), bar("Gm7"), bar("C7")] },
      { label: "A", bars: [bar("Fmaj7"), bar("D7"), bar("Gm7"), bar("C7"), bar("Am7"), bar("Abdim7"), bar("Gm7", "C7"), bar("F6")] },
    ],
  });
}

/** "Copper Kettle": an invented minor tune in Cm with its own two-bar intro. */
export function kettleChart(): Chart {
  return ChartSchema.parse({
    title: "Copper Kettle",
    key: "Cm",
    meter: { beats: 4, unit: 4 },
    intro: { label: "Intro", bars: [bar("Dm7b5"), bar("G7b9")] },
    sections: [
      { label: "A", bars: [bar("Cm7"), bar("Fm7"), bar("Dm7b5"), bar("G7")] },
      { label: "B", bars: [bar("Ebmaj7"), bar("Abmaj7"), bar("Dm7b5"), bar("G7")] },
    ],
  });
}

export interface World {
  db: Kysely<Database>;
  bandId: string;
  otherBandId: string;
  people: Record<"leader" | "arranger" | "player" | "sub" | "outsider" | "newcomer", Actor>;
  charts: { harbour: string; kettle: string; spare: string };
}

function actor(id: string, name: string): Actor {
  return { userId: id, email: `${id}@example.test`, name };
}

export async function insertChart(db: Kysely<Database>, bandId: string, id: string, chart: Chart, by: string): Promise<void> {
  await db
    .insertInto("charts")
    .values({
      id,
      band_id: bandId,
      title: chart.title,
      composer: "",
      concert_key: chart.key,
      meter: "4/4",
      tempo: null,
      feel: "",
      body_json: JSON.stringify(chart),
      source_text: "",
      revision: 1,
      updated_by: by,
      updated_at: NOW.toISOString(),
      deleted_at: null,
    })
    .execute();
}

export async function makeWorld(): Promise<World> {
  const db = await openTestDatabase(":memory:");
  const people = {
    leader: actor("u-mira", "Mira Okafor"),
    arranger: actor("u-tomas", "Tomas Vell"),
    player: actor("u-juno", "Juno Park"),
    sub: actor("u-ada", "Ada Brightwater"),
    outsider: actor("u-rex", "Rex Holloway"),
    newcomer: actor("u-lena", "Lena Marsh"),
  };
  for (const p of Object.values(people)) {
    await db.insertInto("users").values({ id: p.userId, email: p.email, name: p.name, password_hash: null, default_instrument: "eb", created_at: NOW.toISOString() }).execute();
  }
  const bandId = "band-quayside";
  const otherBandId = "band-elsewhere";
  for (const [id, name] of [[bandId, "The Quayside Five"], [otherBandId, "Night Tram Trio"]] as const) {
    await db.insertInto("bands").values({ id, name, city: null, created_by: people.leader.userId, created_at: NOW.toISOString() }).execute();
  }
  const roles: [Actor, Role, string | null][] = [
    [people.leader, "leader", null],
    [people.arranger, "arranger", null],
    [people.player, "player", null],
    [people.sub, "sub", "2026-12-20T00:00:00.000Z"],
  ];
  for (const [p, role, expires] of roles) {
    await db.insertInto("memberships").values({ band_id: bandId, user_id: p.userId, role, instrument: "concert", expires_at: expires, created_at: NOW.toISOString() }).execute();
  }
  await db.insertInto("memberships").values({ band_id: otherBandId, user_id: people.outsider.userId, role: "leader", instrument: "concert", expires_at: null, created_at: NOW.toISOString() }).execute();
  const charts = { harbour: "c-harbour", kettle: "c-kettle", spare: "c-spare" };
  await insertChart(db, bandId, charts.harbour, harbourChart(), people.leader.userId);
  await insertChart(db, bandId, charts.kettle, kettleChart(), people.leader.userId);
  await insertChart(db, bandId, charts.spare, { ...harbourChart(), title: "Spare Room Waltz" }, people.leader.userId);
  return { db, bandId, otherBandId, people, charts };
}

export function entry(chartId: string, setNumber: number, position: number, extra: Record<string, unknown> = {}) {
  return { id: crypto.randomUUID(), chartId, setNumber, position, ...extra };
}
