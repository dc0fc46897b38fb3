// The server-action wrapper answers like a route: a bad id is a 400 naming the field (never an
// internal error), no session is a 401, and only unexpected errors are logged.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { Actor } from "@/lib/server/access";

let actor: Actor | null = null;
vi.mock("@/lib/server/session", () => ({ getActor: async () => actor }));

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "pedalpoint-action-"));
process.env.DATABASE_PATH = path.join(dir, "action.db");

const { action } = await import("@/lib/server/action");
const { AppError } = await import("@/lib/server/errors");
const { MemberParams } = await import("@/lib/validation/params");

const someone: Actor = { userId: "u1", email: "someone@example.test", name: "Someone" };

afterEach(() => {
  actor = null;
  vi.restoreAllMocks();
});

describe("action()", () => {
  it("refuses an id outside the id character rule with a 400 naming the field, and does not log it", async () => {
    actor = someone;
    const logged = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const ran = vi.fn(async () => "ran");
    const out = await action({ params: MemberParams }, { bandId: "band one", userId: "u2" }, ran);
    expect(out).toEqual({ ok: false, failure: { code: "bad_request", message: "Not a valid id", fields: [{ field: "bandId", message: "Not a valid id" }] } });
    expect(new AppError("bad_request", "x").status).toBe(400);
    expect(ran).not.toHaveBeenCalled();
    expect(logged).not.toHaveBeenCalled();
  });

  it("asks for sign-in before running, and hands the handler a non-null actor and the database", async () => {
    expect(await action({ params: MemberParams }, { bandId: "b1", userId: "u2" }, async () => "ran")).toMatchObject({ ok: false, failure: { code: "unauthenticated" } });
    actor = someone;
    const out = await action({ params: MemberParams }, { bandId: "b1", userId: "u2" }, async ({ db, actor: who, params }) => {
      expect(typeof db.selectFrom).toBe("function");
      return `${who.userId}:${params.bandId}:${params.userId}`;
    });
    expect(out).toEqual({ ok: true, value: "u1:b1:u2" });
  });

  it("passes an AppError's code and fields through, and logs only an unexpected error", async () => {
    actor = someone;
    const logged = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const refused = await action({ params: MemberParams }, { bandId: "b1", userId: "u2" }, async () => {
      throw new AppError("forbidden", "Leaders only.");
    });
    expect(refused).toEqual({ ok: false, failure: { code: "forbidden", message: "Leaders only.", fields: [] } });
    expect(logged).not.toHaveBeenCalled();
    const broke = await action({ params: MemberParams }, { bandId: "b1", userId: "u2" }, async () => {
      throw new Error("disk on fire");
    });
    expect(broke).toMatchObject({ ok: false, failure: { code: "internal" } });
    expect(logged).toHaveBeenCalledTimes(1);
  });
});
