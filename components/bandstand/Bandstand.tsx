"use client";
// The bandstand view: one tune at a time, full screen, in a low-light theme, turned by tap or pedal.
// Reusable for a whole set: pass several tunes, each with its own key and intro.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from "react";
import type { Chart, IntroChoice, TagEnding } from "@/lib/chart/model";
import type { BarMark } from "@/lib/setlist/marks";
import { useOnline } from "@/lib/offline/hooks";
import { keyInWords } from "@/lib/music/part-key";
import { PagedChart, type PagedChartControls } from "@/components/chart/PagedChart";
import { buildPerformance } from "@/components/chart/performance";
import { introInWords, type EndingChoice } from "@/lib/setlist";
import { PlayerPanel } from "@/components/player";
import { cx } from "@/components/ui/cx";
import { saveReadingSettings, useReadingSettings, type Theme } from "./settings";
import { usePedalKeys } from "./usePedalKeys";
import { useWakeLock } from "./useWakeLock";
import { BarLabel } from "./BarLabel";
import "./bandstand.css";

export interface BandstandTune {
  chart: Chart;
  /** Concert key for this performance (a singer's key); null or absent: the chart's key. */
  key?: string | null;
  /** undefined: the chart's own intro if it has one; null: none. */
  intro?: IntroChoice | null;
  /** Tonight's tag ending, drawn after the form. */
  tag?: TagEnding | null;
  /** Shown in the tune bar, e.g. "3. Lantern Street". */
  label?: string;
  /** What comes after this tune ("Next: Copper Kettle"), shown in the bar. */
  next?: string;
  /** Title of the tune that follows, for the slim header at the top ("next: Copper Kettle"). */
  nextTitle?: string;
  /** Tonight's intro in a few words; absent: worked out from the intro choice. */
  introText?: string;
  /** The reader's personal marks on this chart, keyed by `${section}:${bar}`. */
  marks?: ReadonlyMap<string, BarMark>;
  /** Tonight's ending from the set list, for playback. */
  ending?: EndingChoice | null;
}

export interface BandstandProps {
  tunes: BandstandTune[];
  instrument: string;
  start?: number;
  /** Page of the start tune to open at: its first, or its last (coming back from the tune after it). */
  startAt?: "first" | "last";
  /** Where "Close" goes. */
  exitHref: string;
  /** `at`: which page of the new tune opens (a parent that remounts this view passes it back as startAt). */
  onTuneChange?: (index: number, at: "first" | "last") => void;
  /** Following the leader's calls on a gig (components/gig), and the gig's controls for the bar. */
  following?: boolean;
  gigControls?: ReactNode;
}

const BAR_HEIGHT = 44;

/** The header's intro words: tonight's choice, the chart's own intro, or none. A turnaround is named by the numerals of its key. */
function introWords(tune: BandstandTune, ownIntroBars: number | null, numerals?: string): string {
  const named = (w: string) => (numerals ? w.replace(/I-vi-ii-V|iii-VI-ii-V/, numerals) : w);
  if (tune.introText) return named(tune.introText);
  if (tune.intro) return named(introInWords(tune.intro));
  return tune.intro === undefined && ownIntroBars ? `the tune's own, ${ownIntroBars} bars` : "none";
}
/** Escape leaves the view the way Close does (unless Escape is mapped to a pedal). */
function useEscapeTo(href: string) {
  const router = useRouter();
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== "Escape" || e.defaultPrevented || e.altKey || e.ctrlKey || e.metaKey) return;
      e.preventDefault();
      router.push(href);
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [href, router]);
}

/** A bar label: whole on a laptop, short on a phone (CSS shows one); the whole one names the button. */

const stagePage = () => document.querySelector<HTMLElement>('.pp-bandstand-stage [data-testid="chart-page"]');
const THEME_CLASS: Record<Theme, string> = { stage: "pp-theme-stage", ember: "pp-theme-ember" };

export function Bandstand({ tunes, instrument, start = 0, startAt = "first", exitHref, onTuneChange, following, gigControls }: BandstandProps) {
  const settings = useReadingSettings();
  const online = useOnline();
  const [index, setIndex] = useState(() => Math.min(Math.max(0, start), Math.max(0, tunes.length - 1)));
  const [size, setSize] = useState({ width: 0, height: 0 });
  const [ends, setEnds] = useState({ atStart: true, atEnd: true });
  // Backing out of a tune's first page opens the previous tune at its last page, as the band reads it.
  const [entry, setEntry] = useState<"first" | "last">(startAt);
  const controls = useRef<PagedChartControls>(null);
  const head = useRef<HTMLElement>(null);
  const counter = useRef<HTMLSpanElement>(null);
  useWakeLock();

  useEffect(() => {
    // The header wraps onto a second line on a phone; the page gets whatever room is left.
    const measure = () => {
      const top = head.current?.offsetHeight ?? 0;
      setSize((s) => {
        const next = { width: window.innerWidth, height: window.innerHeight - BAR_HEIGHT - top };
        return s.width === next.width && s.height === next.height ? s : next;
      });
    };
    measure();
    const ro = typeof ResizeObserver === "undefined" ? null : new ResizeObserver(measure);
    if (head.current) ro?.observe(head.current);
    window.addEventListener("resize", measure);
    return () => {
      ro?.disconnect();
      window.removeEventListener("resize", measure);
    };
  }, []);

  const tune = tunes[index];
  const performance = useMemo(() => {
    if (!tune) return null;
    try {
      return buildPerformance({ chart: tune.chart, instrument, key: tune.key, intro: tune.intro, tag: tune.tag });
    } catch {
      return null;
    }
  }, [tune, instrument]);

  const last = tunes.length - 1;
  const turn = useCallback(
    (delta: 1 | -1) => {
      const moved = delta > 0 ? controls.current?.next() : controls.current?.back();
      // In a set, the same pedal goes on from a tune's last page to the next tune's first.
      if (moved === false && index + delta >= 0 && index + delta <= last) {
        const at = delta > 0 ? "first" : "last";
        setEntry(at);
        setIndex(index + delta);
        onTuneChange?.(index + delta, at);
      }
      return moved;
    },
    [index, last, onTuneChange],
  );
  usePedalKeys(settings.nextKeys, settings.backKeys, turn);
  useEscapeTo(exitHref);

  const goTune = (i: number) => {
    if (i < 0 || i >= tunes.length || i === index) return;
    setEntry("first");
    setIndex(i);
    onTuneChange?.(i, "first");
  };
  const setTheme = (theme: Theme) => saveReadingSettings({ ...settings, theme });
  const toggleEarlyTurn = () => saveReadingSettings({ ...settings, earlyTurn: !settings.earlyTurn });

  const concertKey = performance?.arrangement.concertKey ?? tune?.key ?? tune?.chart.key ?? "";
  const writtenKey = performance?.arrangement.writtenKey ?? concertKey;
  const keyText = writtenKey === concertKey ? `Key ${keyInWords(concertKey)}` : `Key ${keyInWords(concertKey)} concert · ${keyInWords(writtenKey)} written`;
  const ownIntroBars = tune?.intro === undefined ? (performance?.arrangement.intro?.bars.length ?? null) : null;

  return (
    <div className={cx("pp-bandstand", THEME_CLASS[settings.theme])} data-testid="bandstand" data-theme={settings.theme}>
      <section ref={head} className="pp-bandstand-head" aria-label="Tune at a glance" data-testid="tune-head">
        <p className="pp-head-line">
          <span className="pp-head-title" data-testid="head-title">
            {tune?.chart.title}
          </span>
          {tune?.nextTitle ? (
            <span className="pp-head-next" data-testid="head-next">
              next: {tune.nextTitle}
            </span>
          ) : null}
        </p>
        {tune ? (
          <p className="pp-head-line pp-head-details">
            <span data-testid="head-key">{keyText}</span>
            {tune.chart.tempo ? <span data-testid="head-tempo">♩ = {tune.chart.tempo}</span> : null}
            <span className="pp-head-intro" data-testid="head-intro">Intro: {introWords(tune, ownIntroBars, performance?.arrangement.intro?.name)}</span>
          </p>
        ) : null}
      </section>
      {performance && tune ? (
        <div className="pp-bandstand-stage" style={{ height: size.height }}>
          <PagedChart
            key={index}
            arrangement={performance.arrangement}
            text={performance.text}
            width={size.width}
            height={size.height}
            earlyTurn={settings.earlyTurn}
            startPage={entry === "last" ? "last" : 1}
            marks={tune.marks}
            following={following}
            label={`${tune.chart.title}, ${performance.text.partLabel}`}
            controls={controls}
            onView={(_, page, pages, atStart, atEnd) => {
              // Written straight to the DOM: a turn must not wait for a React render.
              if (counter.current) counter.current.textContent = `${page} / ${pages}`;
              setEnds((e) => (e.atStart === atStart && e.atEnd === atEnd ? e : { atStart, atEnd }));
            }}
          />
          <button type="button" className="pp-tap pp-tap-back" aria-label="Previous page" data-testid="tap-back" onClick={() => turn(-1)} tabIndex={-1} />
          <button type="button" className="pp-tap pp-tap-next" aria-label="Next page" data-testid="tap-next" onClick={() => turn(1)} tabIndex={-1} />
        </div>
      ) : (
        <p role="alert" className="p-8 text-xl" style={{ height: size.height }}>
          This tune could not be drawn.
        </p>
      )}
      <nav className="pp-bandstand-bar" aria-label="Bandstand controls" style={{ height: BAR_HEIGHT }}>
        <Link href={exitHref} className="pp-bar-button" aria-label="Close" data-testid="bandstand-exit">
          <BarLabel long="Close" short="✕" />
        </Link>
        {tunes.length > 1 ? (
          <button
            type="button"
            className="pp-bar-button"
            onClick={() => goTune(index - 1)}
            disabled={index === 0}
            aria-label="Previous tune"
            data-testid="prev-tune"
          >
            <BarLabel long="← Tune" short="←" />
          </button>
        ) : null}
        <span className="pp-bar-title" data-testid="tune-label">
          {tune?.label ?? tune?.chart.title}
          {tunes.length > 1 ? ` (${index + 1} of ${tunes.length})` : ""}
        </span>
        {tune?.next ? (
          // Cut short with an ellipsis, never wrapped; a phone has it in the header instead.
          <span className="pp-bar-next" data-testid="next-up" title={tune.next}>
            {tune.next}
          </span>
        ) : null}
        {tune ? (
          <PlayerPanel key={index} variant="stage" chart={tune.chart} concertKey={tune.key} intro={tune.intro} ending={tune.ending} host={stagePage} turnTo={(p) => controls.current?.goToPage(p)} />
        ) : null}
        <span ref={counter} className="pp-bar-counter" data-testid="page-counter" aria-hidden="true">
          1 / 1
        </span>
        {tunes.length > 1 ? (
          <button
            type="button"
            className={cx("pp-bar-button", ends.atEnd && index < tunes.length - 1 && "pp-bar-next-ready")}
            onClick={() => goTune(index + 1)}
            disabled={index >= tunes.length - 1}
            aria-label="Next tune"
            data-testid="next-tune"
          >
            <BarLabel long="Tune →" short="→" />
          </button>
        ) : null}
        {gigControls}
        <button
          type="button"
          className="pp-bar-button"
          aria-pressed={settings.earlyTurn}
          aria-label="Early turn"
          onClick={toggleEarlyTurn}
          data-testid="early-turn"
        >
          <BarLabel long="Early turn" short="⇡" />
        </button>
        <button
          type="button"
          className="pp-bar-button"
          onClick={() => setTheme(settings.theme === "stage" ? "ember" : "stage")}
          aria-label={settings.theme === "stage" ? "Ember light" : "Stage light"}
          data-testid="theme-toggle"
        >
          <BarLabel long={settings.theme === "stage" ? "Ember light" : "Stage light"} short={settings.theme === "stage" ? "☾" : "☀"} />
        </button>
        {!online ? (
          <span className="pp-offline" data-testid="offline-badge" role="status">
            {/* Short on screen, where the bar is cramped on a phone; whole for a screen reader. */}
            Offline<span className="sr-only"> · reading from this device</span>
          </span>
        ) : null}
      </nav>
    </div>
  );
}
