/**
 * Capture bytes made in API tests: interleaved float32 I,Q of a laser with white frequency noise h0
 * (Hz²/Hz), deterministic (xorshift32 uniforms, Box–Muller normals). One-sided h0 ⇔ a per-sample
 * frequency variance h0·fs/2 (METHODS 2.4).
 */
export function iqCapture(samples: number, sampleRateHz: number, h0: number, seed = 1): Buffer {
  let s = seed >>> 0 || 1;
  const uniform = () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return ((s >>> 0) + 0.5) / 4294967296;
  };
  const out = new Float32Array(2 * samples);
  const sigma = Math.sqrt((h0 * sampleRateHz) / 2); // one-sided h0 ⇔ variance h0·fs/2
  let phase = 0;
  for (let i = 0; i < samples; i++) {
    const nu = sigma * Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
    phase += (2 * Math.PI * nu) / sampleRateHz;
    out[2 * i] = Math.cos(phase);
    out[2 * i + 1] = Math.sin(phase);
  }
  return Buffer.from(out.buffer);
}
