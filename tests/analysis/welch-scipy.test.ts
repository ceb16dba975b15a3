// Cross-check of analysis/spectrum/welch.ts against scipy.signal.welch on a committed fixture
// (tests/fixtures/welch/make_welch_fixture.py writes input.f64 and welch-reference.json).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createWelchAccumulator, welch } from '../../analysis/spectrum/welch';
import type { WindowName, DetrendName, SpectrumScaling } from '../../analysis/types';

interface FixtureCase {
  name: string;
  sampleRateHz: number;
  window: WindowName;
  segmentLength: number;
  overlapSamples: number;
  detrend: DetrendName;
  scaling: SpectrumScaling;
  frequencyHz: number[];
  psd: number[];
}

const dir = new URL('../fixtures/welch/', import.meta.url);
const fixture = JSON.parse(readFileSync(new URL('welch-reference.json', dir), 'utf8')) as {
  samples: number;
  cases: FixtureCase[];
};
const raw = readFileSync(new URL('input.f64', dir));
const x = new Float64Array(raw.buffer.slice(raw.byteOffset, raw.byteOffset + raw.byteLength));

function maxRelativeError(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let peak = 0;
  for (let i = 0; i < b.length; i++) peak = Math.max(peak, Math.abs(b[i]));
  let worst = 0;
  // relative to each value, floored at 1e-12 of the largest (bins near exact zeros)
  for (let i = 0; i < b.length; i++) worst = Math.max(worst, Math.abs(a[i] - b[i]) / Math.max(Math.abs(b[i]), 1e-12 * peak));
  return worst;
}

describe('welch agrees with scipy.signal.welch (committed fixture)', () => {
  it('reads the fixture input', () => {
    expect(x.length).toBe(fixture.samples);
    expect(fixture.cases.length).toBeGreaterThanOrEqual(6);
  });

  for (const c of fixture.cases) {
    it(`welch(x, ${c.window}, L=${c.segmentLength}, overlap ${c.overlapSamples}, ${c.detrend}, ${c.scaling}) matches scipy to 1e-9`, () => {
      const s = welch(x, {
        sampleRateHz: c.sampleRateHz,
        segmentLength: c.segmentLength,
        overlap: c.overlapSamples / c.segmentLength,
        window: c.window,
        detrend: c.detrend,
        scaling: c.scaling,
      });
      expect(s.hop).toBe(c.segmentLength - c.overlapSamples);
      expect(s.psd.length).toBe(c.psd.length);
      expect(maxRelativeError(s.frequencyHz, c.frequencyHz)).toBeLessThan(1e-12);
      expect(maxRelativeError(s.psd, c.psd)).toBeLessThan(1e-9);
    });
  }

  it('the streaming accumulator fed in uneven blocks matches scipy too', () => {
    const c = fixture.cases.find((k) => k.segmentLength === 1000)!;
    const acc = createWelchAccumulator({
      sampleRateHz: c.sampleRateHz,
      segmentLength: c.segmentLength,
      overlap: c.overlapSamples / c.segmentLength,
      window: c.window,
      detrend: c.detrend,
    });
    const cuts = [0, 1, 999, 1000, 1001, 5003, 12345, 19999, x.length];
    for (let i = 0; i + 1 < cuts.length; i++) acc.push(x.subarray(cuts[i], cuts[i + 1]));
    expect(maxRelativeError(acc.result().psd, c.psd)).toBeLessThan(1e-9);
  });
});
