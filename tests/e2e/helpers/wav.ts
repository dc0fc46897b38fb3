// Reads the 16-bit PCM WAV files the player saves, for checks on the sound itself.
export interface Wav {
  sampleRate: number;
  channels: Float32Array[];
}

export function readWav(buf: Buffer): Wav {
  if (buf.toString("ascii", 0, 4) !== "RIFF" || buf.toString("ascii", 8, 12) !== "WAVE") throw new Error("not a WAV file");
  const count = buf.readUInt16LE(22);
  const sampleRate = buf.readUInt32LE(24);
  if (buf.readUInt16LE(34) !== 16) throw new Error("not 16-bit PCM");
  const dataAt = buf.indexOf("data", 36, "ascii");
  const bytes = buf.readUInt32LE(dataAt + 4);
  const frames = bytes / (2 * count);
  const channels = Array.from({ length: count }, () => new Float32Array(frames));
  for (let i = 0; i < frames; i++) for (let c = 0; c < count; c++) channels[c]![i] = buf.readInt16LE(dataAt + 8 + (i * count + c) * 2) / 32768;
  return { sampleRate, channels };
}

export function peakOf(channels: Float32Array[]): number {
  let peak = 0;
  for (const ch of channels) for (const x of ch) peak = Math.max(peak, Math.abs(x));
  return peak;
}
