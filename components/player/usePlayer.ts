"use client";
// Play / stop for one tune: loads the audio engine on the first press, follows the transport with
// one animation-frame loop that marks the bar being played (and turns the page when asked), and
// stops when the tune ends, the tune changes or the view closes. One tune plays at a time.
import { useCallback, useEffect, useRef, useState } from "react";
import { BarMarker } from "./marker";
import { follow as followPlayback } from "./follow";
import type { Playback } from "./engine";
import { savePlayerSettings, usePlayerSettings, type PlayerSettings } from "./settings";
import { requestFor, tempoAt, type Controls, type Tune, type TunePlan } from "./request";

export type PlayerStatus = "idle" | "loading" | "playing" | "saving";

let current: { stop: () => void } | null = null;

export interface PlayerHandle {
  status: PlayerStatus;
  /** The bar being played (1-based, as played), null when stopped or counting in. */
  bar: number | null;
  error: string | null;
  settings: PlayerSettings;
  update: (next: Partial<PlayerSettings>) => void;
  toggle: () => void;
  stop: () => void;
  save: () => Promise<void>;
}

export function usePlayer(tune: Tune, plan: TunePlan | null, controls: Controls, host: () => HTMLElement | null, turnTo?: (page: number) => void): PlayerHandle {
  const settings = usePlayerSettings();
  const [status, setStatus] = useState<PlayerStatus>("idle");
  const [bar, setBar] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const playback = useRef<Playback | null>(null);
  const unfollow = useRef<(() => void) | null>(null);
  const latest = useRef({ settings, turnTo, host });
  useEffect(() => {
    latest.current = { settings, turnTo, host };
  });
  const marker = useRef<BarMarker | null>(null);

  const stop = useCallback(() => {
    unfollow.current?.();
    unfollow.current = null;
    playback.current?.stop();
    playback.current = null;
    marker.current?.done(latest.current.host());
    setBar(null);
    setStatus((s) => (s === "playing" || s === "loading" ? "idle" : s));
  }, []);

  const follow = useCallback((p: Playback, loop: boolean) => {
    marker.current ??= new BarMarker();
    unfollow.current = followPlayback(p, {
      host: () => latest.current.host(),
      marker: marker.current,
      loop,
      onEnd: stop,
      onBar: (now, page) => {
        const { settings: s, turnTo: turn, host: h } = latest.current;
        if (turn && s.autoTurn && page !== null && String(page) !== h()?.dataset.page) turn(page);
        setBar(now?.number ?? null);
      },
    });
  }, [stop]);

  const start = useCallback(async () => {
    if (!plan) return;
    current?.stop();
    current = { stop };
    setError(null);
    setStatus("loading");
    try {
      const engine = await import("./engine");
      const request = requestFor(tune, plan, { ...controls, countIn: settings.countIn });
      const p = await engine.play({ request, mutes: settings.mutes, volume: settings.volume });
      playback.current = p;
      setStatus("playing");
      follow(p, request.loop === true);
    } catch (e) {
      setStatus("idle");
      setError(e instanceof Error ? e.message : String(e));
    }
  }, [plan, tune, controls, settings.countIn, settings.mutes, settings.volume, follow, stop]);

  const toggle = useCallback(() => {
    if (status === "playing" || status === "loading") stop();
    else void start();
  }, [status, start, stop]);

  // Live changes while playing: mutes, level and tempo; a new loop or intro choice starts again.
  useEffect(() => playback.current?.setMutes(settings.mutes), [settings.mutes]);
  useEffect(() => playback.current?.setVolume(settings.volume), [settings.volume]);
  useEffect(() => {
    if (plan) playback.current?.setTempo(tempoAt(plan, controls.percent));
  }, [plan, controls.percent]);
  const shape = JSON.stringify([controls.loop, controls.introOnly, tune.key, tune.intro, plan?.total]);
  const lastShape = useRef(shape);
  useEffect(() => {
    if (lastShape.current === shape) return;
    lastShape.current = shape;
    if (playback.current) void start();
  }, [shape, start]);
  useEffect(() => stop, [stop]);

  const save = useCallback(async () => {
    if (!plan) return;
    setStatus("saving");
    setError(null);
    try {
      const engine = await import("./engine");
      const request = requestFor(tune, plan, { ...controls, countIn: settings.countIn });
      const { wav } = await engine.renderWav({ request, mutes: settings.mutes });
      const url = URL.createObjectURL(wav);
      const a = document.createElement("a");
      a.href = url;
      a.download = `${tune.chart.title.replace(/[^\p{L}\p{N} -]+/gu, "").trim() || "tune"}.wav`;
      document.body.appendChild(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setStatus("idle");
    }
  }, [plan, tune, controls, settings.countIn, settings.mutes]);

  const update = useCallback((next: Partial<PlayerSettings>) => savePlayerSettings({ ...latest.current.settings, ...next }), []);
  return { status, bar, error, settings, update, toggle, stop, save };
}
