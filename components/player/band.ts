// The rhythm section's instruments, synthesized with Tone.js (no samples: nothing to fetch, so it
// plays offline). Each part has its own channel so a mute silences it completely. Loaded only when
// the player first plays (see engine.ts), never with the page.
import type * as ToneNS from "tone";
import type { DrumVoice, MutablePart, Part, PlayEvent } from "@/lib/accompaniment";

type Tone = typeof ToneNS;
type Instrument = { trigger: (e: PlayEvent, time: number) => void };

export interface Band {
  channels: Record<Part, ToneNS.Channel>;
  play: (e: PlayEvent, time: number) => void;
  dispose: () => void;
}

const mtof = (midi: number) => 440 * 2 ** ((midi - 69) / 12);

function piano(T: Tone, out: ToneNS.InputNode): Instrument & { node: ToneNS.PolySynth } {
  // An electric-piano colour: a soft FM bell that decays like a struck string.
  const node = new T.PolySynth(T.FMSynth, {
    harmonicity: 2,
    modulationIndex: 3.5,
    oscillator: { type: "sine" },
    modulation: { type: "sine" },
    envelope: { attack: 0.005, decay: 1.6, sustain: 0.25, release: 0.6 },
    modulationEnvelope: { attack: 0.005, decay: 0.4, sustain: 0.1, release: 0.4 },
    volume: -16,
  }).connect(out);
  node.maxPolyphony = 32;
  return { node, trigger: (e, time) => e.kind === "note" && node.triggerAttackRelease(mtof(e.midi), e.duration, time, e.velocity) };
}

function bass(T: Tone, out: ToneNS.InputNode): Instrument & { node: ToneNS.MonoSynth } {
  // A plucked, round low end: a triangle through a closing low-pass.
  const node = new T.MonoSynth({
    oscillator: { type: "triangle" },
    envelope: { attack: 0.004, decay: 0.45, sustain: 0.35, release: 0.08 },
    filter: { Q: 1, type: "lowpass", rolloff: -24 },
    filterEnvelope: { attack: 0.002, decay: 0.25, sustain: 0.3, release: 0.1, baseFrequency: 160, octaves: 2.6 },
    volume: -6,
  }).connect(out);
  return { node, trigger: (e, time) => e.kind === "note" && node.triggerAttackRelease(mtof(e.midi), e.duration, time, e.velocity) };
}

interface Kit {
  nodes: ToneNS.ToneAudioNode[];
  hit: (drum: DrumVoice, duration: number, time: number, velocity: number) => void;
}

function kit(T: Tone, out: ToneNS.InputNode): Kit {
  const ride = new T.MetalSynth({ envelope: { attack: 0.001, decay: 0.9, release: 0.3 }, harmonicity: 5.1, modulationIndex: 24, resonance: 5200, octaves: 1.2, volume: -30 }).connect(out);
  ride.frequency.value = 320;
  const crash = new T.MetalSynth({ envelope: { attack: 0.001, decay: 2.2, release: 1 }, harmonicity: 4.7, modulationIndex: 40, resonance: 3800, octaves: 1.8, volume: -28 }).connect(out);
  crash.frequency.value = 260;
  const hat = new T.MetalSynth({ envelope: { attack: 0.001, decay: 0.06, release: 0.02 }, harmonicity: 5.1, modulationIndex: 32, resonance: 7000, octaves: 1, volume: -32 }).connect(out);
  hat.frequency.value = 420;
  const kick = new T.MembraneSynth({ pitchDecay: 0.04, octaves: 4, envelope: { attack: 0.001, decay: 0.3, sustain: 0, release: 0.1 }, volume: -8 }).connect(out);
  const stick = new T.MembraneSynth({ pitchDecay: 0.005, octaves: 1.5, envelope: { attack: 0.001, decay: 0.04, sustain: 0, release: 0.02 }, volume: -10 }).connect(out);
  const brushFilter = new T.Filter(2600, "bandpass").connect(out);
  const brush = new T.NoiseSynth({ noise: { type: "pink" }, envelope: { attack: 0.06, decay: 0.25, sustain: 0.15, release: 0.15 }, volume: -20 }).connect(brushFilter);
  const snare = new T.NoiseSynth({ noise: { type: "white" }, envelope: { attack: 0.001, decay: 0.14, sustain: 0, release: 0.05 }, volume: -16 }).connect(out);
  const hit: Kit["hit"] = (drum, duration, time, v) => {
    if (drum === "ride") ride.triggerAttackRelease(320, 0.3, time, v);
    else if (drum === "crash") crash.triggerAttackRelease(260, Math.min(duration, 2), time, v);
    else if (drum === "hat") hat.triggerAttackRelease(420, 0.05, time, v);
    else if (drum === "kick") kick.triggerAttackRelease(52, 0.2, time, v);
    else if (drum === "stick") stick.triggerAttackRelease(880, 0.03, time, v);
    else if (drum === "brush") brush.triggerAttackRelease(Math.max(0.08, duration * 0.8), time, v);
    else snare.triggerAttackRelease(0.12, time, v);
  };
  return { nodes: [ride, crash, hat, kick, stick, brush, brushFilter, snare], hit };
}

/** Builds the band in the current Tone context, feeding `output`. */
export function createBand(T: Tone, output: ToneNS.InputNode): Band {
  const channel = () => new T.Channel().connect(output);
  const channels: Record<Part, ToneNS.Channel> = { piano: channel(), bass: channel(), drums: channel(), count: channel() };
  const keys = piano(T, channels.piano);
  const low = bass(T, channels.bass);
  const drums = kit(T, channels.drums);
  // The leader's count: sticks clicked together, a short high knock.
  const sticks = new T.MembraneSynth({ pitchDecay: 0.005, octaves: 1.5, envelope: { attack: 0.001, decay: 0.04, sustain: 0, release: 0.02 }, volume: -10 }).connect(channels.count);
  return {
    channels,
    play: (e, time) => {
      if (channels[e.part].mute) return; // nothing reaches a muted channel, not even a voice's tail
      if (e.kind === "note") (e.part === "piano" ? keys : low).trigger(e, time);
      else if (e.part === "count") sticks.triggerAttackRelease(1200, 0.03, time, e.velocity);
      else drums.hit(e.drum, e.duration, time, e.velocity);
    },
    dispose: () => {
      for (const n of [keys.node, low.node, ...drums.nodes, sticks, ...Object.values(channels)]) n.dispose();
    },
  };
}

export function applyMutes(band: Band, mutes: Readonly<Record<MutablePart, boolean>>): void {
  for (const part of ["piano", "bass", "drums"] as const) band.channels[part].mute = mutes[part];
}
