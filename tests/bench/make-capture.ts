/**
 * Writes a synthetic IQ capture for the benchmark: float32 little-endian, interleaved I,Q, made by
 * the project's generator (analysis/synth/generator.ts) block by block, so memory stays small.
 * Noise model: the Kestrel ECL-1550 of the demo scenario — white FM 1e4 Hz²/Hz (π·h0 ≈ 31.4 kHz)
 * with flicker FM 1e8 Hz² and a 2 kHz carrier offset.
 *   node --import tsx tests/bench/make-capture.ts OUT.f32 SAMPLES SAMPLE_RATE_HZ [SEED]
 */
import { closeSync, openSync, writeSync } from 'node:fs';
import process from 'node:process';
import { createSynthGenerator } from '../../analysis/synth/generator';

const [out, samplesText, rateText, seedText] = process.argv.slice(2);
if (!out || !samplesText || !rateText) {
  process.stderr.write('usage: make-capture.ts OUT.f32 SAMPLES SAMPLE_RATE_HZ [SEED]\n');
  process.exit(2);
}
const samples = Number(samplesText);
const fs = Number(rateText);
const gen = createSynthGenerator({
  sampleRateHz: fs,
  output: 'iq',
  whiteHz2PerHz: 1e4,
  flickerHz2: 1e8,
  carrierOffsetHz: 2e3,
  seed: Number(seedText ?? 1550),
});
const BLOCK = 1 << 20;
const frame = new Float32Array(2 * BLOCK);
const bytes = new Uint8Array(frame.buffer);
const fd = openSync(out, 'w');
try {
  for (let done = 0; done < samples; ) {
    const n = Math.min(BLOCK, samples - done);
    const [i, q] = gen.next(n).channels;
    for (let k = 0; k < n; k++) {
      frame[2 * k] = i[k];
      frame[2 * k + 1] = q[k];
    }
    // the host is little endian (x86-64, arm64): the Float32Array bytes are '<f4'
    writeSync(fd, bytes, 0, 8 * n);
    done += n;
  }
} finally {
  closeSync(fd);
}
