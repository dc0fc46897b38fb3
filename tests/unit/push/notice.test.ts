// One notification in words for a burst of pushed changes.
import { describe, expect, it } from "vitest";
import { composeNotice, type NoticeData } from "@/lib/push/notice";

const gig = { id: "s1", name: "Friday at the Lanternfish Room" };
const keyMove = { chartId: "c1", title: "Tidewater Waltz", lines: [{ kind: "meta" as const, text: "key: B♭ → A♭" }] };
const barEdit = { chartId: "c2", title: "Copper Kettle", lines: [{ kind: "bar" as const, text: "bar 6: B♭7 → E7(♭9)" }] };

describe("push notices", () => {
  it("says the key move first and counts the charts", () => {
    const n = composeNotice({ bandId: "b", bandName: "The Regulars", setlist: gig, changed: [barEdit, keyMove], previous: null });
    expect(n.title).toBe("Friday at the Lanternfish Room");
    expect(n.body).toBe("Tidewater Waltz now in A♭, 2 charts updated");
    expect(n.data.url).toBe("/bands/b/setlists/s1");
  });

  it("one changed chart opens that chart and names its change", () => {
    const n = composeNotice({ bandId: "b", bandName: "The Regulars", setlist: null, changed: [barEdit], previous: null });
    expect(n).toMatchObject({ title: "The Regulars", body: "Copper Kettle: bar 6: B♭7 → E7(♭9)", data: { url: "/bands/b/charts/c2" } });
  });

  it("folds ten pushes in a row into one notification with one tag and a growing count", () => {
    let previous: NoticeData | null = null;
    const tags = new Set<string>();
    let last = "";
    for (let i = 0; i < 10; i++) {
      const changed = i === 0 ? [keyMove] : [{ chartId: `c${i + 1}`, title: `Tune ${i}`, lines: [] }];
      const n = composeNotice({ bandId: "b", bandName: "The Regulars", setlist: gig, changed, previous });
      tags.add(n.tag);
      previous = n.data;
      last = n.body;
    }
    expect(tags.size).toBe(1);
    expect(last).toBe("Tidewater Waltz now in A♭, 10 charts updated");
  });

  it("the same chart pushed twice counts once", () => {
    const first = composeNotice({ bandId: "b", bandName: "R", setlist: gig, changed: [keyMove], previous: null });
    const second = composeNotice({ bandId: "b", bandName: "R", setlist: gig, changed: [keyMove], previous: first.data });
    expect(second.data.chartIds).toEqual(["c1"]);
    expect(second.body).toBe("Tidewater Waltz now in A♭");
  });
});
