// Which stored page shell the service worker serves for an address under /bands/.
import { describe, expect, it } from "vitest";
import { matchShell } from "@/worker/shells";
import { parseBandPath } from "@/lib/offline/route";
import { serviceWorkerUrl } from "@/lib/offline/sw-url";

const SHELLS = ["/bands", "/bands/_", "/bands/_/charts/_", "/bands/_/charts/_/bandstand", "/bands/_/charts/_/edit", "/bands/_/charts/new", "/bands/_/setlists", "/bands/_/setlists/_", "/bands/_/setlists/_/play"];

describe("matching an address to a page shell", () => {
  it.each([
    ["/bands", "/bands"],
    ["/bands/", "/bands"],
    ["/bands/b1", "/bands/_"],
    ["/bands/b1/charts/c9", "/bands/_/charts/_"],
    ["/bands/b1/charts/c9/bandstand", "/bands/_/charts/_/bandstand"],
    ["/bands/b1/charts/new", "/bands/_/charts/new"],
    ["/bands/b1/charts/c9/edit", "/bands/_/charts/_/edit"],
    ["/bands/b1/setlists/s2/play", "/bands/_/setlists/_/play"],
  ])("%s → %s", (path, shell) => {
    expect(matchShell(path, SHELLS)).toBe(shell);
  });

  it("has no shell for an address no page has", () => {
    expect(matchShell("/bands/b1/charts/c9/bandstand/extra", SHELLS)).toBeNull();
    expect(matchShell("/bands/b1/unknown", SHELLS)).toBeNull();
  });

  it("a shell's placeholder ids read as no id, and a real address gives its ids", () => {
    expect(parseBandPath("/bands/_/charts/_")).toEqual({ bandId: null, chartId: null, setlistId: null });
    expect(parseBandPath("/bands/b1/charts/c9/bandstand")).toEqual({ bandId: "b1", chartId: "c9", setlistId: null });
  });
});

describe("the worker script's address", () => {
  it("is /sw.js for the default build and its own name for a build in another folder", () => {
    expect(serviceWorkerUrl(undefined)).toBe("/sw.js");
    expect(serviceWorkerUrl(".next")).toBe("/sw.js");
    expect(serviceWorkerUrl(".next-offline")).toBe("/sw-next-offline.js");
    expect(serviceWorkerUrl("./.next-ui/")).toBe("/sw-next-ui.js");
  });
});
