// Subscribing this device to Web Push for the bands it holds. Only ever after the player said yes.
import { deviceId } from "@/lib/offline/device";
import { getLocalBook } from "@/lib/offline/db";

export function pushSupported(): boolean {
  return typeof window !== "undefined" && "Notification" in window && "serviceWorker" in navigator && "PushManager" in window;
}

function keyBytes(base64url: string): Uint8Array<ArrayBuffer> {
  const b64 = base64url.replace(/-/g, "+").replace(/_/g, "/");
  const raw = atob(b64 + "=".repeat((4 - (b64.length % 4)) % 4));
  const out = new Uint8Array(new ArrayBuffer(raw.length));
  for (let i = 0; i < raw.length; i++) out[i] = raw.charCodeAt(i);
  return out;
}

/** Subscribes (or refreshes the subscription) and tells the server which bands it is for. */
export async function subscribeThisDevice(): Promise<"subscribed" | "denied" | "unsupported" | "failed"> {
  if (!pushSupported()) return "unsupported";
  const permission = Notification.permission === "default" ? await Notification.requestPermission() : Notification.permission;
  if (permission !== "granted") return "denied";
  try {
    const reg = await navigator.serviceWorker.ready;
    let sub = await reg.pushManager.getSubscription();
    if (!sub) {
      const { publicKey } = (await (await fetch("/api/push/key", { credentials: "same-origin" })).json()) as { publicKey: string };
      sub = await reg.pushManager.subscribe({ userVisibleOnly: true, applicationServerKey: keyBytes(publicKey) });
    }
    const json = sub.toJSON() as { endpoint: string; keys: { p256dh: string; auth: string } };
    const bandIds = (await getLocalBook().bands.toArray()).map((b) => b.id);
    if (bandIds.length === 0) return "subscribed";
    const res = await fetch("/api/push/subscriptions", {
      method: "POST",
      credentials: "same-origin",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ deviceId: await deviceId(), bandIds, subscription: { endpoint: json.endpoint, keys: json.keys } }),
    });
    return res.ok ? "subscribed" : "failed";
  } catch {
    // No push service reachable (or none in this browser): everything works without notices.
    return "failed";
  }
}
