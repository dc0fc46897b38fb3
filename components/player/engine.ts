// Playing an accompaniment through Tone.js's transport, and rendering one offline to a WAV file.
// This module (with Tone itself) is imported only on the first press of Play: nothing audio-related
// loads with the page, and no AudioContext exists before the user asks for sound.
import * as Tone from "tone";
import { generateAccompaniment, type Accompaniment, type AccompanimentRequest, type MutablePart } from "@/lib/accompaniment";
import { applyMutes, createBand, type Band } from "./band";
import { encodeWav } from "./wav";

export { generateAccompaniment };

export interface Playback {
  accompaniment: Accompaniment;
  /** Seconds into the accompaniment (at its own tempo) of what is sounding now; loops fold back. */
  position: () => number;
  setMutes: (m: Record<MutablePart, boolean>) => void;
  /** 0–1, the device's listening level. */
  setVolume: (v: number) => void;
  /** Play at `tempo` beats a minute from now on (the accompaniment was built at its own tempo). */
  setTempo: (tempo: number) => void;
  stop: () => void;
}

export interface PlayOptions {
  request: AccompanimentRequest;
  mutes: Record<MutablePart, boolean>;
  volume: number;
}

let live: { band: Band; level: Tone.Volume; limiter: Tone.Limiter } | null = null;

const levelDb = (v: number) => (v <= 0.001 ? -Infinity : Tone.gainToDb(v * 0.9));

/** Starts the audio context (inside the user's press) and the band. */
export async function play(opts: PlayOptions): Promise<Playback> {
  await Tone.start();
  const transport = Tone.getTransport();
  transport.stop();
  transport.cancel(0);
  if (!live) {
    // A limiter keeps sudden peaks from jumping out of the speaker.
    const limiter = new Tone.Limiter(-3).toDestination();
    const level = new Tone.Volume(levelDb(opts.volume)).connect(limiter);
    live = { band: createBand(Tone, level), level, limiter };
  }
  const { band, level } = live;
  level.volume.value = levelDb(opts.volume);
  applyMutes(band, opts.mutes);
  const acc = generateAccompaniment(opts.request);
  // Seconds are turned into transport ticks at this tempo, so a later tempo change scales them all.
  transport.bpm.value = acc.tempo;
  for (const e of acc.events) transport.schedule((time) => band.play(e, time), e.time);
  transport.loop = opts.request.loop === true;
  if (transport.loop) {
    transport.loopStart = acc.countInSeconds;
    transport.loopEnd = acc.barsEnd;
  }
  transport.start("+0.05", 0);
  const ppq = transport.PPQ;
  const secondsPerTick = 60 / acc.tempo / ppq;
  return {
    accompaniment: acc,
    position: () => (transport.state === "started" ? transport.getTicksAtTime(Tone.immediate()) * secondsPerTick : -1),
    setMutes: (m) => applyMutes(band, m),
    setVolume: (v) => (level.volume.value = levelDb(v)),
    setTempo: (tempo) => (transport.bpm.value = tempo),
    stop: () => {
      transport.stop();
      transport.cancel(0);
      transport.loop = false;
      releaseAll(band);
    },
  };
}

function releaseAll(band: Band): void {
  // Cut ringing notes at once: a stopped band stops.
  for (const ch of Object.values(band.channels)) {
    const was = ch.mute;
    ch.mute = true;
    setTimeout(() => (ch.mute = was), 120);
  }
}

/** Renders the accompaniment offline (no speaker needed) and returns it as a 16-bit WAV file. */
export async function renderWav(opts: Omit<PlayOptions, "volume">, tail = 1): Promise<{ wav: Blob; peak: number; seconds: number }> {
  // A loop is rendered once through, its last bar still leading back to its first.
  const acc = generateAccompaniment(opts.request);
  const seconds = (opts.request.loop ? acc.barsEnd : acc.duration) + tail;
  const buffer = await Tone.Offline(({ transport, destination }) => {
    const band = createBand(Tone, destination);
    applyMutes(band, opts.mutes);
    transport.bpm.value = acc.tempo;
    for (const e of acc.events) transport.schedule((time) => band.play(e, time), e.time);
    transport.start(0);
  }, seconds, 2, 44100);
  const channels = buffer.toArray() as Float32Array[];
  let peak = 0;
  for (const ch of channels) for (let i = 0; i < ch.length; i++) peak = Math.max(peak, Math.abs(ch[i]!));
  return { wav: encodeWav(channels, buffer.sampleRate), peak, seconds };
}
