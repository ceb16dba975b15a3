import { describe, expect, it } from 'vitest';
import { lpsd, planLpsd } from '../../analysis/spectrum/lpsd';
import { createGaussian } from '../../analysis/synth/gaussian';
import { createRandom } from '../../analysis/synth/prng';

describe('planLpsd (Tröbs & Heinzel 2006) reproduces the METHODS 1.5 check values', () => {
  const plan = planLpsd({
    sampleRateHz: 1e6,
    samples: 2 ** 22,
    minHz: 1,
    maxHz: 5e5,
    points: 1000,
    desiredAverages: 100,
    minAverages: 2,
    overlap: 0.5,
  });
  it.each([
    [0, 1, 2506301, 2],
    [300, 51.45, 349407, 23],
    [500, 711.8, 93943, 88],
    [700, 9846, 7681, 1091],
    [999, 5e5, 151, 55187],
  ])('point %i: f ≈ %f Hz, L = %i, K = %i (exact integers)', (j, f, L, K) => {
    expect(plan[j].segmentLength).toBe(L);
    expect(plan[j].averages).toBe(K);
    expect(Math.abs(plan[j].frequencyHz / f - 1)).toBeLessThan(1e-3);
  });

  it('point 0 sits at the fractional bin m = 2.506', () => {
    expect(plan[0].bin).toBeCloseTo(2.506, 3);
  });

  it('rejects fmin below fs/N and too few points', () => {
    expect(() => planLpsd({ sampleRateHz: 1, samples: 100, minHz: 0.001, maxHz: 0.5, points: 10 })).toThrow(/minHz/);
    expect(() => planLpsd({ sampleRateHz: 1, samples: 100, minHz: 0.1, maxHz: 0.5, points: 1 })).toThrow(/points/);
  });
});

describe('lpsd', () => {
  it('white noise σ = 1 at fs = 100 Hz reads 2σ²/fs = 0.02 /Hz at every point within 4/√K', () => {
    const x = new Float64Array(2 ** 16);
    createGaussian(createRandom(21)).fill(x, 1);
    const opts = { sampleRateHz: 100, minHz: 0.1, maxHz: 45, points: 40, desiredAverages: 50, minAverages: 4, overlap: 0.5 };
    const s = lpsd(x, opts);
    const plan = planLpsd({ ...opts, samples: x.length });
    for (let j = 0; j < s.psd.length; j++) {
      expect(Math.abs(s.psd[j] / 0.02 - 1)).toBeLessThan(4 / Math.sqrt(plan[j].averages) + 0.02);
    }
  });
});
