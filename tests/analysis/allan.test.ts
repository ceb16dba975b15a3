import { readFileSync } from 'node:fs';

import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import {
  allanDeviation,
  chiSquareQuantile,
  overlappingAllanEdf,
  powerLawAllanVariance,
  whiteFmAllanDeviation,
} from '../../analysis/noise/allan';
import { createSynthGenerator } from '../../analysis/synth/generator';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const fixture = JSON.parse(readFileSync(new URL('../fixtures/allan/allan-reference.json', import.meta.url), 'utf8')) as {
  tau0: number;
  fractionalFrequency: number[];
  averagingFactors: number[];
  overlapping: number[];
  nonOverlapping: number[];
  chiSquareQuantiles: { p: number; dof: number; x: number }[];
};

// The classic 9-point fractional-frequency set (NBS Monograph 140, reproduced in NIST SP 1065 — from memory)
const NINE = [892, 809, 823, 798, 671, 644, 883, 903, 677];

describe('allanDeviation on the 9-point set (METHODS 5.3)', () => {
  it('σ_y(1) = 91.22945 (NIST SP 1065 value, from memory), OADEV(2) = 85.95287, OADEV(3) = 71.13065, OADEV(4) = 27.63518 (computed values in METHODS)', () => {
    const r = allanDeviation({ fractionalFrequency: NINE }, { sampleIntervalS: 1, averagingFactors: [1, 2, 3, 4] });
    const dev = r.points.map((p) => p.deviation);
    expect(rel(dev[0], 91.22945)).toBeLessThan(1e-7);
    expect(rel(dev[1], 85.95287)).toBeLessThan(1e-7);
    expect(rel(dev[2], 71.13065)).toBeLessThan(1e-7);
    expect(rel(dev[3], 27.63518)).toBeLessThan(1e-7);
    expect(r.phasePoints).toBe(10);
    expect(r.points.map((p) => p.terms)).toEqual([8, 6, 4, 2]);
  });

  it("allanDeviation(y, { estimator: 'non-overlapping' }) gives σ_y(1) = 91.22945 and σ_y(2) = 115.80821 (METHODS 5.3, computed)", () => {
    const r = allanDeviation({ fractionalFrequency: NINE }, { sampleIntervalS: 1, averagingFactors: [1, 2], estimator: 'non-overlapping' });
    expect(rel(r.points[0].deviation, 91.22945)).toBeLessThan(1e-7);
    expect(rel(r.points[1].deviation, 115.80821)).toBeLessThan(1e-7);
    expect(r.points[1].terms).toBe(3);
  });

  it('the same set as phase-time x or as phase φ = 2πν0·x gives the same σ_y (x_i = τ0·Σy)', () => {
    const x = [0];
    for (const v of NINE) x.push(x[x.length - 1] + v);
    const nu0 = 1e3;
    const phi = x.map((v) => 2 * Math.PI * nu0 * v);
    const a = allanDeviation({ phaseTimeS: x }, { sampleIntervalS: 1, averagingFactors: [1, 2] });
    const b = allanDeviation({ phaseRad: phi }, { sampleIntervalS: 1, carrierFrequencyHz: nu0, averagingFactors: [1, 2] });
    expect(rel(a.points[1].deviation, 85.95287)).toBeLessThan(1e-7);
    expect(rel(b.points[1].deviation, 85.95287)).toBeLessThan(1e-7);
  });

  it('default τ are octave-spaced while N − 2m ≥ 1: m = 1, 2, 4 for 10 phase points', () => {
    const r = allanDeviation({ fractionalFrequency: NINE }, { sampleIntervalS: 0.5 });
    expect(r.points.map((p) => p.averagingFactor)).toEqual([1, 2, 4]);
    expect(r.points.map((p) => p.tauS)).toEqual([0.5, 1, 2]);
  });
});

describe('allanDeviation against a numpy fixture (tests/fixtures/allan/make-allan-fixture.py)', () => {
  it('overlapping σ_y at octave τ agrees with numpy to 1e-9', () => {
    const r = allanDeviation(
      { fractionalFrequency: fixture.fractionalFrequency },
      { sampleIntervalS: fixture.tau0, averagingFactors: fixture.averagingFactors },
    );
    r.points.forEach((p, i) => expect(rel(p.deviation, fixture.overlapping[i])).toBeLessThan(1e-9));
  });

  it('non-overlapping σ_y (numpy via block means of y, an independent route) agrees to 1e-9', () => {
    const r = allanDeviation(
      { fractionalFrequency: fixture.fractionalFrequency },
      { sampleIntervalS: fixture.tau0, averagingFactors: fixture.averagingFactors, estimator: 'non-overlapping' },
    );
    r.points.forEach((p, i) => expect(rel(p.deviation, fixture.nonOverlapping[i])).toBeLessThan(1e-9));
  });

  it('chiSquareQuantile(p, ν) matches scipy.stats.chi2.ppf to 1e-9', () => {
    for (const q of fixture.chiSquareQuantiles) {
      expect(rel(chiSquareQuantile(q.p, q.dof), q.x)).toBeLessThan(1e-9);
    }
  });
});

describe('allanDeviation of synthetic power-law noise (IEEE Std 1139-2008 / NIST SP 1065 relations)', () => {
  const nu0 = 193.1e12;
  const fs = 1e3; // τ0 = 1 ms

  it('white FM h0: σ_y²(τ) = h0^(y)/(2τ); the ±3σ interval holds the analytic value and the slope reads white FM', () => {
    const h0 = 1e4; // Hz²/Hz, h0^(y) = h0/ν0²
    const phi = createSynthGenerator({ sampleRateHz: fs, output: 'phase', whiteHz2PerHz: h0, seed: 11 }).next(1 << 18).channels[0];
    const r = allanDeviation({ phaseRad: phi }, { sampleIntervalS: 1 / fs, carrierFrequencyHz: nu0, confidence: 0.997 });
    const h0y = h0 / (nu0 * nu0);
    for (const p of r.points.filter((q) => q.averagingFactor <= 4096)) {
      const expected = Math.sqrt(h0y / (2 * p.tauS));
      expect(p.interval[0]).toBeLessThanOrEqual(expected);
      expect(p.interval[1]).toBeGreaterThanOrEqual(expected);
      if (p.averagingFactor <= 64) expect(rel(p.deviation, expected)).toBeLessThan(0.02);
      expect(p.edfNoiseType).toBe('white-fm');
    }
    expect(r.regions[0].slopeClass).toBe('white-fm');
    expect(r.regions[0].referenceSlope).toBe(-0.5);
    expect(Math.abs((r.regions[0].fittedSlope as number) + 0.5)).toBeLessThan(0.02);
  });

  it('random-walk FM h₋₂: σ_y²(τ) = (2π²/3)·h₋₂^(y)·τ at m ≥ 8, slope +½', () => {
    const hm2 = 1e6; // Hz³
    const y = createSynthGenerator({ sampleRateHz: fs, output: 'frequency', randomWalkHz3: hm2, seed: 5 }).next(1 << 17).channels[0];
    for (let i = 0; i < y.length; i++) y[i] /= nu0; // y = ν/ν0
    const r = allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 1 / fs, averagingFactors: [8, 16, 32, 64, 128, 256], confidence: 0.997 });
    const hm2y = hm2 / (nu0 * nu0);
    for (const p of r.points) {
      const expected = Math.sqrt(((2 * Math.PI * Math.PI) / 3) * hm2y * p.tauS);
      // discrete random walk: the relation holds to 1/(2m²) (≤ 0.8 % at m = 8)
      expect(p.interval[0]).toBeLessThanOrEqual(expected);
      expect(p.interval[1]).toBeGreaterThanOrEqual(expected);
      expect(rel(p.deviation, expected)).toBeLessThan(0.1);
      expect(p.slopeClass).toBe('random-walk-fm');
    }
    expect(r.regions).toHaveLength(1);
    expect(Math.abs((r.regions[0].fittedSlope as number) - 0.5)).toBeLessThan(0.05);
  });

  it('white FM at short τ and random walk at long τ mark two regions, −½ then +½', () => {
    const h0 = 1e4;
    const hm2 = 100; // crossover where h0/(2τ) = (2π²/3)h₋₂τ: τ ≈ 1.6 s
    const y = createSynthGenerator({ sampleRateHz: fs, output: 'frequency', whiteHz2PerHz: h0, randomWalkHz3: hm2, seed: 3 }).next(1 << 19).channels[0];
    const r = allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 1 / fs, averagingFactors: [1, 2, 4, 8, 16, 32, 64, 8192, 16384, 32768, 65536] });
    expect(r.regions[0].slopeClass).toBe('white-fm');
    expect(r.regions[r.regions.length - 1].slopeClass).toBe('random-walk-fm');
  });
});

describe('σ_y from the power-law model (METHODS 5.2)', () => {
  it('whiteFmAllanDeviation(1 kHz, 193.1 THz): 2.0660e-12 at 1 ms, 6.5332e-14 at 1 s (METHODS 5.2, computed)', () => {
    expect(rel(whiteFmAllanDeviation(1e3, 193.1e12, 1e-3), 2.066e-12)).toBeLessThan(1e-4);
    expect(rel(whiteFmAllanDeviation(1e3, 193.1e12, 1), 6.5332e-14)).toBeLessThan(1e-4);
  });

  it('powerLawAllanVariance matches 2∫S_y sin⁴(πfτ)/(πfτ)² df integrated numerically (RWFM, FFM, WFM at τ = 10 ms)', () => {
    // independent path: the transfer-function integral of IEEE Std 1139 / NIST SP 1065, trapezoid on a log grid
    const tau = 0.01;
    const integral = (sy: (f: number) => number) => {
      const lo = Math.log(1e-7);
      const hi = Math.log(1e8);
      const n = 400000;
      const du = (hi - lo) / n;
      let s = 0;
      for (let i = 0; i <= n; i++) {
        const f = Math.exp(lo + i * du);
        const a = Math.PI * f * tau;
        const v = (2 * sy(f) * Math.sin(a) ** 4) / (a * a) * f; // df = f du
        s += (i === 0 || i === n ? 0.5 : 1) * v;
      }
      return s * du;
    };
    expect(rel(powerLawAllanVariance({ randomWalkFm: 2 }, tau), integral((f) => 2 / (f * f)))).toBeLessThan(1e-4);
    expect(rel(powerLawAllanVariance({ flickerFm: 3 }, tau), integral((f) => 3 / f))).toBeLessThan(1e-4);
    // white FM: the grid ends at 1e8 Hz; the tail beyond adds about (3/8)·2h0/(π²τ² f_max), 1e-7 relative
    expect(rel(powerLawAllanVariance({ whiteFm: 5 }, tau), integral(() => 5))).toBeLessThan(1e-4);
  });
});

describe('confidence intervals and degrees of freedom', () => {
  it('the interval widens as the confidence grows and always brackets the estimate', () => {
    const narrow = allanDeviation({ fractionalFrequency: fixture.fractionalFrequency }, { sampleIntervalS: 1, confidence: 0.5 });
    const wide = allanDeviation({ fractionalFrequency: fixture.fractionalFrequency }, { sampleIntervalS: 1, confidence: 0.95 });
    narrow.points.forEach((p, i) => {
      expect(p.interval[0]).toBeLessThan(p.deviation);
      expect(p.interval[1]).toBeGreaterThan(p.deviation);
      expect(wide.points[i].interval[0]).toBeLessThan(p.interval[0]);
      expect(wide.points[i].interval[1]).toBeGreaterThan(p.interval[1]);
    });
  });

  it('overlappingAllanEdf(type, N = 1025, m) by hand: white FM m = 1 → 681.78, white PM m = 4 → 510.99, flicker FM m = 1 → 889.68', () => {
    // [3·1024/2 − 2·1023/1025]·4/9 = (1536 − 1.99610)·0.44444 = 681.78
    expect(overlappingAllanEdf('white-fm', 1025, 1)).toBeCloseTo(681.78, 1);
    // white PM, N = 1025, m = 4: 1026·1017/(2·1021) = 510.99
    expect(overlappingAllanEdf('white-pm', 1025, 4)).toBeCloseTo(510.99, 1);
    // flicker FM, m = 1: 2·1023²/(2.3·1025 − 4.9) = 2093058/2352.6 = 889.68
    expect(overlappingAllanEdf('flicker-fm', 1025, 1)).toBeCloseTo(889.68, 1);
  });

  it("a fixed noiseType is used for every point's edf", () => {
    const r = allanDeviation({ fractionalFrequency: NINE }, { sampleIntervalS: 1, noiseType: 'random-walk-fm' });
    expect(r.points.every((p) => p.edfNoiseType === 'random-walk-fm')).toBe(true);
  });
});

describe('allanDeviation rejects bad input, naming the rule', () => {
  const y = NINE;
  it('no record', () => expect(() => allanDeviation({} as never, { sampleIntervalS: 1 })).toThrow(AnalysisInputError));
  it('two records', () =>
    expect(() => allanDeviation({ phaseTimeS: y, fractionalFrequency: y } as never, { sampleIntervalS: 1 })).toThrow(/exactly one record/));
  it('sampleIntervalS <= 0', () => expect(() => allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 0 })).toThrow(/sampleIntervalS/));
  it('phaseRad without carrierFrequencyHz', () => expect(() => allanDeviation({ phaseRad: y }, { sampleIntervalS: 1 })).toThrow(/carrierFrequencyHz/));
  it('carrierFrequencyHz with a fractional-frequency record', () =>
    expect(() => allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 1, carrierFrequencyHz: 1 })).toThrow(/phaseRad records only/));
  it('too short a record', () => expect(() => allanDeviation({ fractionalFrequency: [1] }, { sampleIntervalS: 1 })).toThrow(/at least 3 phase points/));
  it('an averaging factor beyond (N−1)/2', () =>
    expect(() => allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 1, averagingFactors: [5] })).toThrow(/\(N−1\)\/2 = 4/));
  it('averaging factors not increasing', () =>
    expect(() => allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 1, averagingFactors: [2, 1] })).toThrow(/must increase/));
  it('confidence outside (0, 1)', () => expect(() => allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 1, confidence: 1 })).toThrow(/confidence/));
  it('an unknown estimator', () =>
    expect(() => allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 1, estimator: 'modified' as never })).toThrow(/estimator/));
  it('an unknown noise type', () =>
    expect(() => allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 1, noiseType: 'pink' as never })).toThrow(/noiseType/));
  it('a non-finite sample, naming it', () =>
    expect(() => allanDeviation({ fractionalFrequency: [1, 2, NaN, 4] }, { sampleIntervalS: 1 })).toThrow(/sample 2/));
});
