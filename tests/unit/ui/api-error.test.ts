// The one reader of a failed route answer, as the screens use it.
import { describe, expect, it } from "vitest";
import { readApiError } from "@/lib/api-error";

describe("readApiError", () => {
  it("takes the server's message, code and first field", async () => {
    const res = Response.json({ error: { code: "unprocessable", message: "Enter an e-mail address", fields: [{ field: "email", message: "x" }] } }, { status: 422 });
    expect(await readApiError(res, "Not shared.")).toEqual({ message: "Enter an e-mail address", code: "unprocessable", field: "email" });
  });

  it("falls back to our words when the body is not our JSON", async () => {
    expect(await readApiError(new Response("<html>Bad gateway</html>", { status: 502 }), "Not withdrawn.")).toEqual({ message: "Not withdrawn.", code: undefined, field: undefined });
  });
});
