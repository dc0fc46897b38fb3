"use client";
// The player's controls for one tune: play / stop, tempo, loop, intro only, mutes, count-in, volume
// (with a hearing caution beside it) and saving the sound as a WAV file. On the chart page it sits
// in the side column; on the bandstand view the Play button sits in the bar and the rest opens above it.
import { useId, useMemo, useState } from "react";
import { cx } from "@/components/ui/cx";
import { BarLabel } from "@/components/bandstand/BarLabel";
import { MUTABLE_PARTS, type MutablePart } from "@/lib/accompaniment/types";
import { planTune, sectionLabel, tempoAt, TEMPO_MAX_PERCENT, TEMPO_MIN_PERCENT, type Controls, type LoopChoice, type Tune } from "./request";
import { usePlayer, type PlayerHandle } from "./usePlayer";
import "./player.css";

export interface PlayerPanelProps {
  chart: Tune["chart"];
  /** Tonight's concert key (a singer's key); null: the chart's. */
  concertKey?: string | null;
  /** undefined: the chart's own intro, if any; null: none. */
  intro?: Tune["intro"];
  ending?: Tune["ending"];
  /** Tonight's tempo from the set list; null: the chart's. */
  tempo?: number | null;
  /** The drawn chart's element (data-testid="chart-page"), where the bar being played is marked. */
  host: () => HTMLElement | null;
  /** Given on the bandstand view: turn to this page when playback reaches it. */
  turnTo?: (page: number) => void;
  variant?: "page" | "stage";
}

const PART_NAMES: Record<MutablePart, string> = { piano: "Piano", bass: "Bass", drums: "Drums" };

export function PlayerPanel({ chart, concertKey, intro, ending, tempo, host, turnTo, variant = "page" }: PlayerPanelProps) {
  const tune = useMemo<Tune>(() => ({ chart, key: concertKey, intro, ending, tempo }), [chart, concertKey, intro, ending, tempo]);
  const plan = useMemo(() => {
    try {
      return planTune(tune);
    } catch {
      return null;
    }
  }, [tune]);
  const [controls, setControls] = useState<Controls>({ percent: 100, loop: { kind: "none" }, introOnly: false, countIn: true });
  const player = usePlayer(tune, plan, controls, host, turnTo);
  const [open, setOpen] = useState(false);
  const panelId = useId();
  if (!plan) return null;
  const playing = player.status === "playing" || player.status === "loading";
  const playButton = (
    <button
      type="button"
      className={cx(variant === "stage" ? "pp-bar-button" : "pp-play-button", playing && "pp-play-on")}
      onClick={player.toggle}
      disabled={player.status === "saving"}
      aria-label={variant === "stage" ? (playing ? "Stop" : "Play") : undefined}
      data-testid="play-button"
    >
      {variant === "stage" ? (
        <BarLabel long={playing ? "■ Stop" : "▶ Play"} short={playing ? "■" : "▶"} />
      ) : (
        <>
          <span aria-hidden="true">{playing ? "■ " : "▶ "}</span>
          {playing ? "Stop" : "Play"}
        </>
      )}
    </button>
  );
  const status = (
    <span className="pp-play-status" role="status" data-testid="play-status">
      {player.status === "loading" ? "Starting…" : player.status === "saving" ? "Rendering the sound…" : playing ? (player.bar ? `Bar ${player.bar} of ${plan.total}` : "Count-in") : ""}
    </span>
  );
  const body = <Settings player={player} controls={controls} setControls={setControls} plan={plan} stage={variant === "stage"} />;
  if (variant === "stage") {
    return (
      <>
        {playButton}
        <button type="button" className="pp-bar-button" aria-expanded={open} aria-controls={panelId} onClick={() => setOpen(!open)} aria-label="Sound" data-testid="sound-settings">
          <BarLabel long="Sound" short="♪" />
        </button>
        <section id={panelId} hidden={!open} className="pp-player pp-player-stage" aria-label="Sound">
          {status}
          {body}
        </section>
      </>
    );
  }
  return (
    <section className="pp-player" aria-label="Hear the arrangement" data-testid="player">
      <h2 className="text-base font-bold">Hear the arrangement</h2>
      <div className="flex flex-wrap items-center gap-3">
        {playButton}
        {status}
      </div>
      {body}
    </section>
  );
}

interface SettingsProps {
  player: PlayerHandle;
  controls: Controls;
  setControls: (c: Controls) => void;
  plan: NonNullable<ReturnType<typeof planTune>>;
  stage: boolean;
}

function Settings({ player, controls, setControls, plan, stage }: SettingsProps) {
  const id = useId();
  const { settings, update } = player;
  const loopValue = controls.loop.kind === "section" ? `s${controls.loop.index}` : controls.loop.kind;
  const setLoop = (v: string) => {
    const loop: LoopChoice = v === "none" ? { kind: "none" } : v === "bars" ? { kind: "bars", from: 1, to: Math.min(4, plan.total) } : { kind: "section", index: Number(v.slice(1)) };
    setControls({ ...controls, loop, introOnly: false });
  };
  return (
    <div className="pp-player-settings">
      <label htmlFor={`${id}-tempo`}>
        Tempo ♩ = {tempoAt(plan, controls.percent)} <span className="pp-dim">({controls.percent}% of {plan.baseTempo})</span>
      </label>
      <input id={`${id}-tempo`} type="range" min={TEMPO_MIN_PERCENT} max={TEMPO_MAX_PERCENT} step={5} value={controls.percent} onChange={(e) => setControls({ ...controls, percent: Number(e.target.value) })} data-testid="tempo-slider" />
      <label htmlFor={`${id}-loop`}>Loop</label>
      <select id={`${id}-loop`} value={loopValue} onChange={(e) => setLoop(e.target.value)} data-testid="loop-picker">
        <option value="none">No loop: the whole tune</option>
        {plan.sections.map((s, i) => (
          <option key={`${s.label}-${s.from}`} value={`s${i}`}>{sectionLabel(s)}</option>
        ))}
        <option value="bars">Bars…</option>
      </select>
      {controls.loop.kind === "bars" ? <BarRange loop={controls.loop} total={plan.total} onChange={(loop) => setControls({ ...controls, loop })} /> : null}
      <label className="pp-check">
        <input type="checkbox" checked={controls.introOnly} disabled={plan.introBars === 0} onChange={(e) => setControls({ ...controls, introOnly: e.target.checked, loop: { kind: "none" } })} data-testid="intro-only" />
        Play the intro only{plan.introBars === 0 ? " (this arrangement has none)" : ` (${plan.introBars} bars)`}
      </label>
      <fieldset className="pp-mutes">
        <legend>Mute</legend>
        {MUTABLE_PARTS.map((part) => (
          <button key={part} type="button" aria-pressed={settings.mutes[part]} onClick={() => update({ mutes: { ...settings.mutes, [part]: !settings.mutes[part] } })} data-testid={`mute-${part}`}>
            {PART_NAMES[part]}
          </button>
        ))}
      </fieldset>
      <label className="pp-check">
        <input type="checkbox" checked={settings.countIn} onChange={(e) => update({ countIn: e.target.checked })} data-testid="count-in" />
        Count in two bars
      </label>
      {stage ? (
        <label className="pp-check">
          <input type="checkbox" checked={settings.autoTurn} onChange={(e) => update({ autoTurn: e.target.checked })} data-testid="auto-turn" />
          Turn pages while playing
        </label>
      ) : null}
      <label htmlFor={`${id}-volume`}>Volume {Math.round(settings.volume * 100)}%</label>
      <input id={`${id}-volume`} type="range" min={0} max={100} step={5} value={Math.round(settings.volume * 100)} onChange={(e) => update({ volume: Number(e.target.value) / 100 })} aria-describedby={`${id}-caution`} data-testid="volume" />
      <p id={`${id}-caution`} className="pp-dim text-sm">
        Protect your hearing: keep the volume moderate, above all on headphones, and take breaks.
      </p>
      <p className="pp-dim text-sm">The sound is at concert pitch, whatever part you read.</p>
      <button type="button" className="pp-save" onClick={() => void player.save()} disabled={player.status !== "idle"} data-testid="save-audio">
        Save the sound as WAV
      </button>
      {player.error ? <p role="alert" className="text-sm font-semibold">The player could not start: {player.error}</p> : null}
    </div>
  );
}

function BarRange({ loop, total, onChange }: { loop: { from: number; to: number }; total: number; onChange: (l: LoopChoice) => void }) {
  const id = useId();
  const set = (from: number, to: number) => onChange({ kind: "bars", from, to });
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label htmlFor={`${id}-from`}>From bar</label>
      <input id={`${id}-from`} type="number" min={1} max={total} value={loop.from} onChange={(e) => set(Number(e.target.value) || 1, Math.max(loop.to, Number(e.target.value) || 1))} data-testid="loop-from" className="w-20" />
      <label htmlFor={`${id}-to`}>to</label>
      <input id={`${id}-to`} type="number" min={loop.from} max={total} value={loop.to} onChange={(e) => set(loop.from, Number(e.target.value) || loop.from)} data-testid="loop-to" className="w-20" />
    </div>
  );
}
