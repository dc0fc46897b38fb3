// This device's own id (one per browser profile), kept in its own small IndexedDB database so the
// service worker and the pages read the same one, and signing out of the book does not change it.
import Dexie, { type EntityTable } from "dexie";

interface DeviceRow {
  key: string;
  value: string;
}

class DeviceStore extends Dexie {
  kv!: EntityTable<DeviceRow, "key">;
  constructor() {
    super("pedalpoint-device");
    this.version(1).stores({ kv: "key" });
  }
}

let store: DeviceStore | null = null;

function kv(): DeviceStore["kv"] {
  store ??= new DeviceStore();
  return store.kv;
}

export async function deviceId(): Promise<string> {
  const t = kv();
  const found = await t.get("id");
  if (found) return found.value;
  const id = crypto.randomUUID();
  await t.put({ key: "id", value: id });
  return id;
}

export async function deviceSetting(key: string): Promise<string | null> {
  return (await kv().get(key))?.value ?? null;
}

export async function setDeviceSetting(key: string, value: string): Promise<void> {
  await kv().put({ key, value });
}

/** "Chromium on Linux": enough for a leader to tell a member's phone from their tablet. */
export function deviceLabel(ua: string): string {
  const browser = /Edg\//.test(ua) ? "Edge" : /Firefox\//.test(ua) ? "Firefox" : /Chrome\/|Chromium\//.test(ua) ? (/Chromium\//.test(ua) || /HeadlessChrome/.test(ua) ? "Chromium" : "Chrome") : /Safari\//.test(ua) ? "Safari" : "Browser";
  const os = /iPhone/.test(ua) ? "iPhone" : /iPad/.test(ua) ? "iPad" : /Android/.test(ua) ? "Android" : /Mac OS X/.test(ua) ? "Mac" : /Windows/.test(ua) ? "Windows" : /Linux/.test(ua) ? "Linux" : "a device";
  return `${browser} on ${os}`;
}
