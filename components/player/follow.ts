// Follows a playback once per animation frame: finds the bar sounding now and, only when it changes,
// marks it on the drawn chart and reports it. The whole cost of playback on the main thread besides
// Tone's own scheduling, so it stays a binary search and a comparison on most frames.
import type { TimedBar } from "@/lib/accompaniment/types";
import type { Playback } from "./engine";
import type { BarMarker } from "./marker";

/** The bar sounding `t` seconds in, or null during the count-in. */
export function barAt(bars: TimedBar[], t: number): TimedBar | null {
  let lo = 0;
  let hi = bars.length - 1;
  if (hi < 0 || t < bars[0]!.start) return null;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (bars[mid]!.start <= t + 1e-6) lo = mid;
    else hi = mid - 1;
  }
  return bars[lo]!;
}

export interface FollowHooks {
  host: () => HTMLElement | null;
  marker: BarMarker;
  loop: boolean;
  /** A new bar (null: counting in); `page` is the drawn page that holds it. */
  onBar: (bar: TimedBar | null, page: number | null) => void;
  onEnd: () => void;
}

/** Starts following; returns the function that stops. */
export function follow(p: Playback, hooks: FollowHooks): () => void {
  let shown: TimedBar | null | undefined;
  let frame = 0;
  const tick = () => {
    const t = p.position();
    if (!hooks.loop && t > p.accompaniment.duration) return hooks.onEnd();
    const now = t < 0 ? null : barAt(p.accompaniment.bars, t);
    if (now !== shown) {
      shown = now;
      const { page } = hooks.marker.show(hooks.host(), now?.index ?? null, now?.number ?? null);
      hooks.onBar(now, page);
    }
    frame = requestAnimationFrame(tick);
  };
  frame = requestAnimationFrame(tick);
  return () => cancelAnimationFrame(frame);
}
