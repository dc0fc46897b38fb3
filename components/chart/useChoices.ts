"use client";
// The reader's choices for one chart: from the address first, then this device's memory of the
// last part chosen in the band, then the membership's instrument, then concert.
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useCallback, useMemo, useRef, useSyncExternalStore } from "react";
import type { IntroChoice, TagEnding } from "@/lib/chart/model";
import { isInstrumentId, type InstrumentId } from "@/lib/music/instruments";
import { rememberInstrument, rememberedInstrument } from "@/components/bandstand/settings";
import { chartQuery, parseReadingChoices } from "./params";

export interface Choices {
  instrument: InstrumentId;
  key: string | null;
  tempo: number | null;
  intro: IntroChoice | null | undefined;
  tag: TagEnding | null;
  list: string | null;
  setInstrument: (id: string) => void;
  setKey: (key: string | null) => void;
  setIntro: (intro: IntroChoice | null) => void;
  query: string;
}

const noop = () => () => {};

export function useChoices(bandId: string | null, membershipInstrument: string | null | undefined): Choices {
  const params = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const parsed = useMemo(() => parseReadingChoices(params), [params]);
  const list = params.get("list");
  const remembered = useSyncExternalStore(noop, () => (bandId ? rememberedInstrument(bandId) : null), () => null);
  const fallback = [remembered, membershipInstrument].find(isInstrumentId) ?? "concert";
  const instrument = parsed.instrument ?? fallback;

  // The address the last change asked for. The router applies a replace later, so two quick
  // changes (a key, then a part) must build on what was asked, not on the address not yet updated.
  const asked = useRef<{ from: string; query: string } | null>(null);
  const current = params.toString();

  const replace = useCallback(
    (next: { instrument?: string | null; key?: string | null; intro?: IntroChoice | null }) => {
      const pending = asked.current && asked.current.from === current ? new URLSearchParams(asked.current.query) : null;
      const base = pending ? parseReadingChoices(pending) : parsed;
      const q = chartQuery({
        instrument: base.instrument ?? instrument,
        key: base.key,
        tempo: base.tempo,
        intro: base.intro,
        tag: base.tag,
        list: pending ? pending.get("list") : list,
        ...next,
      });
      asked.current = { from: current, query: q };
      router.replace(`${window.location.pathname || pathname}${q}`, { scroll: false });
    },
    [current, instrument, parsed, list, router, pathname],
  );

  return {
    instrument,
    key: parsed.key,
    tempo: parsed.tempo,
    intro: parsed.intro,
    tag: parsed.tag,
    list,
    query: chartQuery({ instrument, key: parsed.key, tempo: parsed.tempo, intro: parsed.intro, tag: parsed.tag, list }),
    setInstrument: (id) => {
      if (bandId) rememberInstrument(bandId, id);
      replace({ instrument: id });
    },
    setKey: (key) => replace({ key }),
    setIntro: (intro) => replace({ intro }),
  };
}
