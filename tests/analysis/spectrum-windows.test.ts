import { describe, expect, it } from 'vitest';
import { equivalentAverages } from '../../analysis/spectrum/equivalent-averages';
import { makeWindow, windowSums } from '../../analysis/spectrum/windows';
import { AnalysisInputError } from '../../analysis/errors';

describe('makeWindow (periodic windows)', () => {
  // NENBW = L·Σw²/(Σw)² for periodic windows, L = 4096 — METHODS 1.2 / 9 #2 (numpy check), and the
  // Hann / Blackman-Harris values of G. Heinzel, A. Rüdiger, R. Schilling, AEI Hannover report (2002).
  it.each([
    ['hann', 1.5],
    ['blackman-harris', 2.0044],
    ['flat-top', 3.7702],
  ] as const)('windowSums(makeWindow(%s, 4096)).nenbw = %f bins', (name, nenbw) => {
    // tolerance 1e-4 as METHODS 9 #2 (exact BH4 value 2.004353…, quoted there rounded to 2.0044)
    expect(Math.abs(windowSums(makeWindow(name, 4096)).nenbw - nenbw)).toBeLessThanOrEqual(1e-4);
  });

  it.each([
    ['hann', 0.5],
    ['blackman-harris', 0.35875],
    ['flat-top', 0.21557895],
  ] as const)('makeWindow(%s, 4096) has coherent gain S1/L = %f (the a0 coefficient)', (name, gain) => {
    expect(windowSums(makeWindow(name, 4096)).s1 / 4096).toBeCloseTo(gain, 8);
  });

  // fs = 1 MHz, L = 2^16: ENBW = fs·S2/S1² — METHODS 1.2 example (its BH4 figure 30.585 was made
  // from the rounded NENBW 2.0044; the exact 2.004353 gives 30.584, hence the 2e-3 Hz tolerance)
  it.each([
    ['hann', 22.888, 1e-3],
    ['blackman-harris', 30.585, 2e-3],
    ['flat-top', 57.53, 1e-2],
  ] as const)('ENBW of %s at fs = 1 MHz, L = 2^16 is %f Hz', (name, enbw, tol) => {
    const { s1, s2 } = windowSums(makeWindow(name, 65536));
    expect(Math.abs((1e6 * s2) / (s1 * s1) - enbw)).toBeLessThanOrEqual(tol);
  });

  it('a periodic cosine-sum window has NENBW (a0² + Σa_k²/2)/a0² at any L > 8 (Heinzel 2002, analytic)', () => {
    const a = [0.35875, 0.48829, 0.14128, 0.01168];
    const exact = (a[0] ** 2 + (a[1] ** 2 + a[2] ** 2 + a[3] ** 2) / 2) / a[0] ** 2;
    for (const L of [16, 1000, 4096, 65536]) expect(windowSums(makeWindow('blackman-harris', L)).nenbw).toBeCloseTo(exact, 12);
  });

  it('makeWindow("hann", 8) is periodic: 0, 0.1464…, 0.5, 0.8536…, 1, … (not symmetric)', () => {
    const w = makeWindow('hann', 8);
    const expected = [0, 0.5 - Math.SQRT1_2 / 2, 0.5, 0.5 + Math.SQRT1_2 / 2, 1, 0.5 + Math.SQRT1_2 / 2, 0.5, 0.5 - Math.SQRT1_2 / 2];
    expected.forEach((v, i) => expect(w[i]).toBeCloseTo(v, 14));
  });

  it('makeWindow rejects an unknown name and a bad length', () => {
    expect(() => makeWindow('hamming' as never, 16)).toThrow(AnalysisInputError);
    expect(() => makeWindow('hann', 0)).toThrow(/window length/);
    expect(() => makeWindow('hann', 2.5)).toThrow(/window length/);
  });
});

describe('equivalentAverages (Welch 1967; METHODS 1.3)', () => {
  it('Hann, L = 256, 50 % overlap, K = 40 gives K_eff = 37.94', () => {
    expect(equivalentAverages(makeWindow('hann', 256), 128, 40)).toBeCloseTo(37.94, 2);
    // analytic: ρ(1)² = 1/36 for Hann at 50 % → K/(1 + 2·(1 − 1/K)/36)
    expect(equivalentAverages(makeWindow('hann', 256), 128, 40)).toBeCloseTo(40 / (1 + (2 * (39 / 40)) / 36), 10);
  });

  it('Hann, L = 256, 75 % overlap, K = 40 gives K_eff = 21.05', () => {
    expect(equivalentAverages(makeWindow('hann', 256), 64, 40)).toBeCloseTo(21.05, 2);
  });

  it('no overlap gives K_eff = K; one segment gives 1; none gives 0', () => {
    expect(equivalentAverages(makeWindow('blackman-harris', 100), 100, 17)).toBe(17);
    expect(equivalentAverages(makeWindow('hann', 100), 50, 1)).toBe(1);
    expect(equivalentAverages(makeWindow('hann', 100), 50, 0)).toBe(0);
  });

  it('rejects a hop < 1 and a negative segment count', () => {
    expect(() => equivalentAverages(makeWindow('hann', 8), 0, 3)).toThrow(/hop/);
    expect(() => equivalentAverages(makeWindow('hann', 8), 4, -1)).toThrow(/segments/);
  });
});
