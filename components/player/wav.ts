// 16-bit PCM WAV (RIFF) from float channels: the format every player and editor opens.
export function encodeWav(channels: Float32Array[], sampleRate: number): Blob {
  const frames = channels[0]?.length ?? 0;
  const count = channels.length;
  const data = frames * count * 2;
  const view = new DataView(new ArrayBuffer(44 + data));
  const text = (at: number, s: string) => [...s].forEach((c, i) => view.setUint8(at + i, c.charCodeAt(0)));
  text(0, "RIFF");
  view.setUint32(4, 36 + data, true);
  text(8, "WAVE");
  text(12, "fmt ");
  view.setUint32(16, 16, true); // fmt chunk size
  view.setUint16(20, 1, true); // PCM
  view.setUint16(22, count, true);
  view.setUint32(24, sampleRate, true);
  view.setUint32(28, sampleRate * count * 2, true);
  view.setUint16(32, count * 2, true);
  view.setUint16(34, 16, true);
  text(36, "data");
  view.setUint32(40, data, true);
  let at = 44;
  for (let i = 0; i < frames; i++) {
    for (const ch of channels) {
      const s = Math.max(-1, Math.min(1, ch[i]!));
      view.setInt16(at, Math.round(s < 0 ? s * 0x8000 : s * 0x7fff), true);
      at += 2;
    }
  }
  return new Blob([view.buffer], { type: "audio/wav" });
}
