"use client";
// Right after joining a band (the invite lands on the library with ?joined=1): the one other moment
// Pedalpoint asks about notices.
import { useSyncExternalStore } from "react";
import { PushPrompt } from "./PushPrompt";

const never = () => () => undefined;

export function JoinedPrompt() {
  const joined = useSyncExternalStore(never, () => new URLSearchParams(window.location.search).get("joined") === "1", () => false);
  return joined ? <PushPrompt context="joined" /> : null;
}
