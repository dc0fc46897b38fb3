// Who is ready for a gig, worked out from what each device last said it holds. Pure: the use case
// (readiness.ts) loads the rows; this decides. A device is ready when it holds the current revision
// of the set list, of every chart on it and every part (PDF/image) of those charts.

export interface Holdings {
  charts: Record<string, number>;
  setlists: Record<string, number>;
  /** Part (attachment) id → sha256 of the file the device stores. */
  parts: Record<string, string>;
}

export interface DeviceReport {
  deviceId: string;
  label: string;
  reportedAt: string;
  cursor: number;
  holdings: Holdings;
}

export interface Needed {
  setlist: { id: string; name: string; revision: number };
  charts: { id: string; title: string; revision: number }[];
  parts: { id: string; chartTitle: string; filename: string; sha256: string }[];
}

export interface Reader {
  userId: string;
  name: string;
  role: string;
  devices: DeviceReport[];
}

export interface DeviceReadiness {
  /** Null for a member with no device that has synced yet. */
  deviceId: string | null;
  label: string;
  lastSyncAt: string | null;
  ready: boolean;
  missing: string[];
}

export interface MemberReadiness {
  userId: string;
  name: string;
  role: string;
  ready: boolean;
  devices: DeviceReadiness[];
}

export interface Readiness {
  setlistId: string;
  ready: number;
  total: number;
  members: MemberReadiness[];
}

export function missingOn(h: Holdings, need: Needed): string[] {
  const out: string[] = [];
  const list = h.setlists[need.setlist.id];
  if (list === undefined) out.push(`the set list “${need.setlist.name}”`);
  else if (list < need.setlist.revision) out.push(`the latest set list (has revision ${list} of ${need.setlist.revision})`);
  for (const c of need.charts) {
    const held = h.charts[c.id];
    if (held === undefined) out.push(c.title);
    else if (held < c.revision) out.push(`${c.title} (has revision ${held} of ${c.revision})`);
  }
  for (const p of need.parts) {
    const held = h.parts[p.id];
    if (held === undefined) out.push(`${p.chartTitle}: part ${p.filename}`);
    else if (held !== p.sha256) out.push(`${p.chartTitle}: part ${p.filename} (an older copy)`);
  }
  return out;
}

/** Everyone who will read the set list, each device, and the count "6 of 7 devices ready". */
export function computeReadiness(need: Needed, readers: readonly Reader[]): Readiness {
  let ready = 0;
  let total = 0;
  const members = readers.map((r): MemberReadiness => {
    const devices: DeviceReadiness[] =
      r.devices.length === 0
        ? [{ deviceId: null, label: "No device has synced yet", lastSyncAt: null, ready: false, missing: ["everything: no device has synced"] }]
        : [...r.devices]
            .sort((a, b) => b.reportedAt.localeCompare(a.reportedAt))
            .map((d) => {
              const missing = missingOn(d.holdings, need);
              return { deviceId: d.deviceId, label: d.label, lastSyncAt: d.reportedAt, ready: missing.length === 0, missing };
            });
    total += devices.length;
    ready += devices.filter((d) => d.ready).length;
    return { userId: r.userId, name: r.name, role: r.role, ready: devices.every((d) => d.ready), devices };
  });
  members.sort((a, b) => Number(a.ready) - Number(b.ready) || a.name.localeCompare(b.name));
  return { setlistId: need.setlist.id, ready, total, members };
}
