import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { encodeFrames, encodeNpy, encodeWav, seeded, textBytes } from './io-encoders';

const ROOT = resolve(__dirname, '..', '..');
let dir = '';

interface Run {
  status: number;
  stdout: string;
  stderr: string;
}

/** Runs the CLI as `npm run analyze` does (node --import tsx analysis/cli.ts …). */
function cli(...args: string[]): Promise<Run> {
  return new Promise((done) => {
    execFile(
      process.execPath,
      ['--import', 'tsx', 'analysis/cli.ts', ...args],
      { cwd: ROOT, maxBuffer: 64 << 20, env: { ...process.env, NO_COLOR: '1' } },
      (error, stdout, stderr) => {
        const status = error ? (typeof error.code === 'number' ? error.code : -1) : 0;
        done({ status, stdout, stderr });
      },
    );
  });
}

function file(name: string, bytes: Uint8Array | string): string {
  const path = join(dir, name);
  writeFileSync(path, typeof bytes === 'string' ? textBytes(bytes) : bytes);
  return path;
}

/** White FM of level h0: Gaussian phase steps of variance 2π²h0/fs (METHODS 2.4). */
function whiteFmIq(n: number, fs: number, h0: number, seed: number): number[][] {
  const rnd = seeded(seed);
  const sigma = Math.sqrt((2 * Math.PI * Math.PI * h0) / fs);
  let p = 0;
  const frames: number[][] = [];
  for (let i = 0; i < n; i++) {
    p += sigma * Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
    frames.push([Math.cos(p), Math.sin(p)]);
  }
  return frames;
}

/** One line "error: …" on stderr, nothing on stdout, exit status 2. */
function expectBadInput(run: Run, message: RegExp): void {
  expect(run.stdout).toBe('');
  expect(run.status).toBe(2);
  const lines = run.stderr.split('\n').filter((l) => l !== '');
  expect(lines).toHaveLength(1);
  expect(lines[0]).toMatch(/^error: /);
  expect(lines[0]).toMatch(message);
}

const FS = 1e6;
const H0 = 1e4;
let iqPath = '';

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'phaseloom-cli-'));
  const frames = whiteFmIq(1 << 18, FS, H0, 77);
  iqPath = file('kestrel-iq.npy', encodeNpy('<f4', [frames.length, 2], encodeFrames(frames, 'f4', true)));
});

afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});

describe('analyze CLI: the JSON contract', () => {
  it('analyze FILE --sample-rate prints one JSON object with every field of the contract and exits 0', async () => {
    const run = await cli(iqPath, '--sample-rate', String(FS));
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const out = JSON.parse(run.stdout);
    expect(out.input).toMatchObject({ kind: 'iq', format: 'npy', samples: 1 << 18, sampleRateHz: FS });
    expect(out.input.durationS).toBeCloseTo((1 << 18) / FS, 12);
    expect(out.settings).toMatchObject({ window: 'hann', segment: 32768, overlap: 0.5 });
    expect(out.settings.averages).toBe(Math.floor(((1 << 18) - 1 - 32768) / 16384) + 1);
    expect(out.whiteFloor.bandHz).toHaveLength(2);
    expect(typeof out.whiteFloor.valueHz2PerHz).toBe('number');
    // white FM h0: intrinsic linewidth π·h0 (METHODS 3.2)
    expect(Math.abs(out.intrinsicLinewidthHz / (Math.PI * H0) - 1)).toBeLessThan(0.1);
    for (const key of ['observationTimeS', 'crossingHz', 'areaHz2', 'linewidthHz']) expect(out.betaLine).toHaveProperty(key);
    expect(out.lineshape).toHaveProperty('fwhmHz');
    for (const key of ['whiteHz2PerHz', 'flickerHz2', 'randomWalkHz3', 'cornerHz']) expect(out.noiseModel).toHaveProperty(key);
    expect(Array.isArray(out.spurs)).toBe(true);
    expect(out.spectrum).toBeUndefined();
  });

  it('analyze --series adds spectrum.frequencyHz and spectrum.frequencyNoiseHz2PerHz of equal length', async () => {
    const run = await cli(iqPath, '--sample-rate=1e6', '--series', '--segment', '4096', '--window', 'blackman-harris', '--overlap', '0.661');
    expect(run.status).toBe(0);
    const out = JSON.parse(run.stdout);
    expect(out.settings).toMatchObject({ window: 'blackman-harris', segment: 4096, overlap: 0.661 });
    expect(out.spectrum.frequencyHz.length).toBe(out.spectrum.frequencyNoiseHz2PerHz.length);
    expect(out.spectrum.frequencyHz.length).toBeGreaterThan(2000);
  });

  it('analyze reads raw big-endian int16 IQ with --format raw --dtype int16 --channels 2 --byte-order big', async () => {
    const frames = whiteFmIq(1 << 15, FS, H0, 5).map((f) => f.map((v) => Math.round(v * 30000)));
    const path = file('wren.iq', encodeFrames(frames, 'i2', false));
    const run = await cli(path, '--format', 'raw', '--dtype', 'int16', '--channels', '2', '--byte-order', 'big', '--sample-rate', '1e6', '--observation-time', '0.01', '--floor-band', '1000:100000');
    expect(run.stderr).toBe('');
    const out = JSON.parse(run.stdout);
    expect(out.input).toMatchObject({ kind: 'iq', format: 'raw', samples: 1 << 15 });
    // the floor is the mean over the grid points inside the band given
    expect(out.whiteFloor.bandHz[0]).toBeGreaterThanOrEqual(1000);
    expect(out.whiteFloor.bandHz[1]).toBeLessThanOrEqual(100000);
    expect(out.betaLine.observationTimeS).toBe(0.01);
  });

  it('analyze --help prints the usage and exits 0', async () => {
    const run = await cli('--help');
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/Usage: npm run --silent analyze -- FILE \[options\]/);
    expect(run.stdout).toMatch(/--floor-band LO:HI/);
  });
});

describe('analyze CLI: bad input exits 2 with one error line and nothing on stdout', () => {
  it('an empty file', async () => {
    expectBadInput(await cli(file('empty.csv', ''), '--kind', 'phase', '--sample-rate', '1000'), /the file is empty/);
  });
  it('a non-numeric cell, naming row and column', async () => {
    expectBadInput(await cli(file('cells.csv', 't,phase\n0,0.1\n0.001,oops\n'), '--segment', '64'), /non-numeric cell 'oops' \(row 3, column 2\)/);
  });
  it('a NaN, naming the row', async () => {
    expectBadInput(await cli(file('nan.csv', '0.1\n0.2\nnan\n'), '--kind', 'phase', '--sample-rate', '1000'), /NaN or Inf value 'nan' \(row 3/);
  });
  it('an Inf, naming the row', async () => {
    expectBadInput(await cli(file('inf.csv', '0.1,0.2\nInf,0.3\n'), '--sample-rate', '1000'), /NaN or Inf value 'Inf' \(row 2/);
  });
  it('an npy header claiming more samples than the file holds, naming the header field', async () => {
    const path = file('short.npy', encodeNpy('<f8', [1000], new Uint8Array(800)));
    expectBadInput(await cli(path, '--kind', 'phase', '--sample-rate', '1000'), /claims 1000 samples.*holds 100 samples.*header field 'shape'/);
  });
  it('a WAV chunk larger than the file, naming the chunk and its byte offset', async () => {
    const path = file('long.wav', encodeWav(new Uint8Array(400), { formatTag: 1, bits: 16, channels: 2, rate: 48000, dataSizeField: 1 << 20 }));
    expectBadInput(await cli(path), /chunk 'data' claims 1048576 bytes.*chunk 'data' at byte offset 36/);
  });
  it('a missing sample rate', async () => {
    expectBadInput(await cli(iqPath), /sample rate is missing.*option --sample-rate/);
  });
  it('a sample rate that is not positive', async () => {
    expectBadInput(await cli(iqPath, '--sample-rate', '0'), /sample rate must be a positive number.*option --sample-rate/);
    expectBadInput(await cli(iqPath, '--sample-rate', '-5'), /positive/);
  });
  it('a sample rate that is not a number', async () => {
    expectBadInput(await cli(iqPath, '--sample-rate', '10MHz'), /--sample-rate expects a number, got '10MHz'/);
  });
  it('a record too short for two segments', async () => {
    expectBadInput(await cli(iqPath, '--sample-rate', '1e6', '--segment', '262144'), /too short for two segments/);
  });
  it('an unknown option', async () => {
    expectBadInput(await cli(iqPath, '--frobnicate', '3'), /unknown option --frobnicate/);
  });
  it('a missing file', async () => {
    expectBadInput(await cli(join(dir, 'absent.npy')), /no such file/);
  });
  it('no file at all', async () => {
    expectBadInput(await cli('--sample-rate', '1'), /no capture file given/);
  });
  it('one channel without a kind', async () => {
    expectBadInput(await cli(file('one.csv', '0.1\n0.2\n0.3\n'), '--sample-rate', '1000'), /kind of capture is missing.*option --kind/);
  });
});
