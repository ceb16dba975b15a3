/**
 * npm run samples — writes the demo captures of the Larchmere Photonics Lab scenario into samples/
 * (about 3.5 MB in all), deterministic (fixed seeds), with the project's synthetic generator
 * (analysis/synth/generator.ts). They are demo data made from stated noise models, never measured
 * data, and never used as check values by the tests.
 *   Kestrel ECL-1550  external-cavity laser, quiet: IQ .npy (complex64) and a phase CSV with a time column
 *   Wren DFB-1549     DFB, strong 1/f noise and a 50 Hz mains spur: raw int16 interleaved IQ
 *   Heron FL-1560     fibre laser with a relaxation-oscillation bump: real beat note, 16-bit PCM WAV
 * samples/README.md lists the files and the command that analyses each one.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import process from 'node:process';
import { createSynthGenerator } from '../analysis/synth/generator';
import type { SynthOptions } from '../analysis/synth/synth-options';
import type { SampleBlock } from '../analysis/types';

// npm runs scripts from the repository root
const OUT = resolve(process.argv[2] ?? 'samples');

function generate(options: SynthOptions, samples: number): SampleBlock {
  const gen = createSynthGenerator(options);
  return gen.next(samples);
}

// ---- tiny writers (little endian throughout) ----

function npyComplex64(i: Float64Array, q: Float64Array): Uint8Array {
  const n = i.length;
  let header = `{'descr': '<c8', 'fortran_order': False, 'shape': (${n},), }`;
  const total = Math.ceil((10 + header.length + 1) / 64) * 64; // data starts on a 64-byte boundary
  header = header + ' '.repeat(total - 10 - header.length - 1) + '\n';
  const out = new Uint8Array(total + 8 * n);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0]); // "\x93NUMPY" v1.0
  new DataView(out.buffer).setUint16(8, header.length, true);
  for (let k = 0; k < header.length; k++) out[10 + k] = header.charCodeAt(k);
  const data = new Float32Array(out.buffer, total, 2 * n);
  for (let k = 0; k < n; k++) {
    data[2 * k] = i[k];
    data[2 * k + 1] = q[k];
  }
  return out;
}

function int16Interleaved(i: Float64Array, q: Float64Array, scale: number): Uint8Array {
  const out = new Uint8Array(4 * i.length);
  const dv = new DataView(out.buffer);
  for (let k = 0; k < i.length; k++) {
    dv.setInt16(4 * k, Math.round(i[k] * scale), true);
    dv.setInt16(4 * k + 2, Math.round(q[k] * scale), true);
  }
  return out;
}

function wavPcm16Mono(x: Float64Array, rate: number, scale: number): Uint8Array {
  const n = x.length;
  const out = new Uint8Array(44 + 2 * n);
  const dv = new DataView(out.buffer);
  const ascii = (at: number, s: string) => {
    for (let k = 0; k < s.length; k++) out[at + k] = s.charCodeAt(k);
  };
  ascii(0, 'RIFF');
  dv.setUint32(4, 36 + 2 * n, true);
  ascii(8, 'WAVE');
  ascii(12, 'fmt ');
  dv.setUint32(16, 16, true);
  dv.setUint16(20, 1, true); // PCM
  dv.setUint16(22, 1, true); // mono
  dv.setUint32(24, rate, true);
  dv.setUint32(28, 2 * rate, true); // byte rate
  dv.setUint16(32, 2, true); // block align
  dv.setUint16(34, 16, true);
  ascii(36, 'data');
  dv.setUint32(40, 2 * n, true);
  for (let k = 0; k < n; k++) dv.setInt16(44 + 2 * k, Math.round(x[k] * scale), true);
  return out;
}

function phaseCsv(phi: Float64Array, rate: number): string {
  const lines = ['# Larchmere Photonics Lab - Kestrel ECL-1550 (external cavity, 1550.12 nm) - demo capture', 'time (s),phase (rad)'];
  for (let k = 0; k < phi.length; k++) lines.push(`${(k / rate).toFixed(6)},${phi[k].toPrecision(12)}`);
  return lines.join('\n') + '\n';
}

// ---- the three lasers ----

interface SampleFile {
  name: string;
  bytes: Uint8Array;
}

const files: SampleFile[] = [];

{
  // Kestrel ECL-1550: quiet external-cavity laser, intrinsic linewidth π·30 ≈ 94 Hz, flicker corner 100 Hz,
  // heterodyned 10 kHz off the local oscillator
  const fs = 250_000;
  const kestrel: SynthOptions = {
    sampleRateHz: fs,
    output: 'iq',
    whiteHz2PerHz: 30,
    flickerHz2: 3e3,
    carrierOffsetHz: 10_000,
    additiveNoiseDensity: 1e-11,
    seed: 1550,
  };
  const [i, q] = generate(kestrel, 1 << 17).channels;
  files.push({ name: 'kestrel-ecl-1550-iq.npy', bytes: npyComplex64(i, q) });

  const fsPhase = 100_000;
  const [phi] = generate({ ...kestrel, sampleRateHz: fsPhase, output: 'phase', carrierOffsetHz: 0, additiveNoiseDensity: 0, seed: 1551 }, 1 << 15).channels;
  files.push({ name: 'kestrel-ecl-1550-phase.csv', bytes: new TextEncoder().encode(phaseCsv(phi, fsPhase)) });
}

{
  // Wren DFB-1549: DFB, intrinsic linewidth π·1000 ≈ 3.1 kHz, strong flicker FM (corner 10 kHz) and a
  // 50 Hz mains spur of 20 kHz peak deviation
  const fs = 500_000;
  const [i, q] = generate(
    {
      sampleRateHz: fs,
      output: 'iq',
      whiteHz2PerHz: 1000,
      flickerHz2: 1e7,
      spurs: [{ frequencyHz: 50, peakDeviationHz: 20_000 }],
      carrierOffsetHz: -5_000,
      amplitude: 0.6,
      additiveNoiseDensity: 1e-12,
      seed: 1549,
    },
    1 << 18,
  ).channels;
  files.push({ name: 'wren-dfb-1549-iq-int16.bin', bytes: int16Interleaved(i, q, 32767) });
}

{
  // Heron FL-1560: fibre laser, intrinsic linewidth π·10 ≈ 31 Hz, relaxation-oscillation bump at 8 kHz
  // (Q = 40: its pedestal peak/Q² ≈ 2 Hz²/Hz stays under the white floor), recorded as a real beat note
  // at an IF of 48 kHz with a 192 kHz sound card
  const fs = 192_000;
  const [v] = generate(
    {
      sampleRateHz: fs,
      output: 'beat',
      whiteHz2PerHz: 10,
      flickerHz2: 1e4,
      bumps: [{ centerHz: 8000, widthHz: 200, peakHz2PerHz: 3e3 }],
      amplitude: 0.5,
      additiveNoiseDensity: 1e-12,
      seed: 1560,
    },
    1 << 18,
  ).channels;
  files.push({ name: 'heron-fl-1560-beat.wav', bytes: wavPcm16Mono(v, fs, 32767 * 1.6) });
}

mkdirSync(OUT, { recursive: true });
let total = 0;
for (const f of files) {
  writeFileSync(join(OUT, f.name), f.bytes);
  total += f.bytes.length;
  process.stdout.write(`${f.name}  ${(f.bytes.length / 1024).toFixed(0)} KiB\n`);
}
process.stdout.write(`${files.length} files, ${(total / 1048576).toFixed(2)} MiB in ${OUT}\n`);
