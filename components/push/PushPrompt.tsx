"use client";
// Asks for notices only where they make sense (joining a band, opening a set list), with one sentence
// saying why, never on first load. Everything works without them. "Not now" is remembered on the device.
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/Button";
import { deviceSetting, setDeviceSetting } from "@/lib/offline/device";
import { pushSupported, subscribeThisDevice } from "./subscribe";

type State = "hidden" | "ask" | "working" | "done" | "denied" | "failed";

export function PushPrompt({ context }: { context: "setlist" | "joined" }) {
  const [state, setState] = useState<State>("hidden");

  useEffect(() => {
    let gone = false;
    void (async () => {
      if (!pushSupported()) return;
      // Already allowed on this device: keep the subscription current for the bands it holds, quietly.
      if (Notification.permission === "granted") return void subscribeThisDevice();
      if (Notification.permission === "denied" || (await deviceSetting("push-prompt")) === "not-now") return;
      if (!gone) setState("ask");
    })();
    return () => {
      gone = true;
    };
  }, []);

  if (state === "hidden") return null;
  const why =
    context === "joined"
      ? "Pedalpoint can tell this device when the leader changes a chart or a set list, and bring the change onto it in the background so it is here with no signal."
      : "Want a notice when the leader changes this set list or a chart on it? Pedalpoint brings the change onto this device in the background, so it is here on the gig with no signal.";
  return (
    <section aria-label="Notices on this device" className="mb-4 rounded-lg border border-ink-soft bg-paper-dim p-3" data-testid="push-prompt">
      {state === "ask" || state === "working" ? (
        <>
          <p className="mb-2">{why}</p>
          <div className="flex flex-wrap gap-2">
            <Button
              disabled={state === "working"}
              data-testid="push-allow"
              onClick={async () => {
                setState("working");
                const r = await subscribeThisDevice();
                setState(r === "subscribed" ? "done" : r === "denied" ? "denied" : "failed");
              }}
            >
              Turn on notices
            </Button>
            <Button
              tone="quiet"
              onClick={async () => {
                await setDeviceSetting("push-prompt", "not-now");
                setState("hidden");
              }}
            >
              Not now
            </Button>
          </div>
        </>
      ) : (
        <p role="status">
          {state === "done"
            ? "Notices are on for this device."
            : state === "denied"
              ? "Notices are off for this site in the browser's settings; Pedalpoint still syncs whenever it is open."
              : "This browser could not reach its push service; Pedalpoint still syncs whenever it is open."}
        </p>
      )}
    </section>
  );
}
