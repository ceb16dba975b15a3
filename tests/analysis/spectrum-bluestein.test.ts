import { describe, expect, it } from 'vitest';
import { createBluesteinDft } from '../../analysis/spectrum/bluestein';
import { createPowerSpectrumPlan } from '../../analysis/spectrum/power-spectrum-plan';

function naiveDft(re: number[], im: number[]): { re: number[]; im: number[] } {
  const L = re.length;
  const outRe: number[] = [];
  const outIm: number[] = [];
  for (let m = 0; m < L; m++) {
    let sr = 0;
    let si = 0;
    for (let n = 0; n < L; n++) {
      const a = (-2 * Math.PI * ((m * n) % L)) / L;
      sr += re[n] * Math.cos(a) - im[n] * Math.sin(a);
      si += re[n] * Math.sin(a) + im[n] * Math.cos(a);
    }
    outRe.push(sr);
    outIm.push(si);
  }
  return { re: outRe, im: outIm };
}

function testSignal(L: number, seed: number): { re: number[]; im: number[] } {
  // a fixed, irregular sequence (no PRNG needed)
  const re: number[] = [];
  const im: number[] = [];
  for (let n = 0; n < L; n++) {
    re.push(Math.sin(1.7 * n + seed) + 0.3 * Math.cos(0.11 * n * n));
    im.push(Math.cos(2.3 * n - seed) * 0.5);
  }
  return { re, im };
}

describe('createBluesteinDft (chirp-z) against a naive DFT', () => {
  it('createBluesteinDft(3) maps [1, 0, 0] to [1, 1, 1]', () => {
    const d = createBluesteinDft(3);
    const re = new Float64Array(3);
    const im = new Float64Array(3);
    d.transform([1, 0, 0], null, re, im);
    for (let m = 0; m < 3; m++) {
      expect(re[m]).toBeCloseTo(1, 14);
      expect(im[m]).toBeCloseTo(0, 14);
    }
  });

  it.each([1, 2, 3, 5, 7, 12, 100, 243, 1000, 1023])('length %i: complex transform agrees to 1e-11 of the peak', (L) => {
    const { re, im } = testSignal(L, L);
    const want = naiveDft(re, im);
    const d = createBluesteinDft(L);
    const outRe = new Float64Array(L);
    const outIm = new Float64Array(L);
    d.transform(re, im, outRe, outIm);
    let peak = 0;
    for (let m = 0; m < L; m++) peak = Math.max(peak, Math.hypot(want.re[m], want.im[m]));
    for (let m = 0; m < L; m++) {
      expect(Math.abs(outRe[m] - want.re[m])).toBeLessThan(1e-11 * peak);
      expect(Math.abs(outIm[m] - want.im[m])).toBeLessThan(1e-11 * peak);
    }
  });
});

describe('createPowerSpectrumPlan', () => {
  it('createPowerSpectrumPlan(4) on [1, 1, 1, 1] gives |X|² = [16, 0, 0]', () => {
    const out = new Float64Array(3);
    createPowerSpectrumPlan(4).compute(Float64Array.of(1, 1, 1, 1), out);
    expect(Array.from(out)).toEqual([16, 0, 0]);
  });

  it.each([2, 8, 64, 1024, 3, 10, 999])('length %i: |X[m]|², m ≤ L/2, agrees with a naive DFT', (L) => {
    const { re } = testSignal(L, 3);
    const want = naiveDft(re, new Array(L).fill(0));
    const plan = createPowerSpectrumPlan(L);
    expect(plan.bins).toBe(Math.floor(L / 2) + 1);
    expect(plan.method).toBe((L & (L - 1)) === 0 ? 'radix-4' : 'bluestein');
    const out = new Float64Array(plan.bins);
    plan.compute(Float64Array.from(re), out);
    let peak = 0;
    for (let m = 0; m < plan.bins; m++) peak = Math.max(peak, want.re[m] ** 2 + want.im[m] ** 2);
    for (let m = 0; m < plan.bins; m++) {
      expect(Math.abs(out[m] - (want.re[m] ** 2 + want.im[m] ** 2))).toBeLessThan(1e-11 * peak);
    }
  });

  it('accumulate adds into the running sum', () => {
    const plan = createPowerSpectrumPlan(6);
    const x = Float64Array.of(1, 2, 3, 4, 5, 6);
    const once = new Float64Array(4);
    plan.compute(x, once);
    const acc = new Float64Array(4);
    plan.accumulate(x, acc);
    plan.accumulate(x, acc);
    for (let m = 0; m < 4; m++) expect(acc[m]).toBeCloseTo(2 * once[m], 10);
  });

  it('rejects a length below 2', () => {
    expect(() => createPowerSpectrumPlan(1)).toThrow(/segment length/);
  });
});
