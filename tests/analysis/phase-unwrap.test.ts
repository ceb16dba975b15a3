import { describe, expect, it } from 'vitest';
import { createCarrierStatistics } from '../../analysis/phase/carrier-statistics';
import { createPhaseUnwrapper, unwrapPhase, wrapStep } from '../../analysis/phase/unwrap';

describe('unwrapPhase (numpy.unwrap semantics)', () => {
  it('unwrapPhase([0, 3, 6.5, −3]) = [0, 3, 0.21681…, 3.28318…] as numpy.unwrap', () => {
    const u = unwrapPhase([0, 3, 6.5, -3]);
    [0, 3, 0.21681469282041377, 3.2831853071795862].forEach((v, i) => expect(u[i]).toBeCloseTo(v, 13));
  });

  it('matches numpy.unwrap on steps near ±π (values printed by numpy 2.4)', () => {
    const p = [0.0, 3.1, -3.1, 2.9, -0.5, 3.14159, -3.14159, 6.0, 12.0, -20.0, Math.PI, 0.0];
    const numpy = [
      0.0, 3.1, 3.183185307179586, 2.9, 5.783185307179586, 3.14159, 3.1415953071795863, 6.0, 5.716814692820414,
      5.132741228718345, 3.141592653589793, 0.0,
    ];
    const u = unwrapPhase(p);
    numpy.forEach((v, i) => expect(u[i]).toBeCloseTo(v, 12));
  });

  it('unwrap across block boundaries equals unwrap of the whole record', () => {
    const n = 10007;
    const p = new Float64Array(n);
    const truth = new Float64Array(n);
    let phase = 0;
    for (let k = 0; k < n; k++) {
      phase += 0.9 * Math.sin(k * 0.013) + 0.37 * Math.cos(k * 1.7); // steps up to ~1.3 rad < π
      truth[k] = phase;
      p[k] = Math.atan2(Math.sin(phase), Math.cos(phase)); // wrapped into (−π, π]
    }
    const whole = unwrapPhase(p);
    const u = createPhaseUnwrapper();
    const parts: number[] = [];
    for (const [a, b] of [[0, 1], [1, 2], [2, 500], [500, 501], [501, 7777], [7777, n]]) parts.push(...u.push(p.subarray(a, b)));
    expect(parts).toEqual(Array.from(whole));
    // and it recovers the true phase up to the start value
    for (let k = 0; k < n; k += 997) expect(whole[k] - whole[0]).toBeCloseTo(truth[k] - truth[0], 9);
  });

  it('counts wrapped steps larger than 0.8π (METHODS 2.7 warning)', () => {
    const u = createPhaseUnwrapper();
    u.push([0, 0.5, 0.5 + 0.85 * Math.PI, 0.5 + 0.85 * Math.PI - 0.1]);
    expect(u.largeSteps).toBe(1);
    expect(u.samplesSeen).toBe(4);
  });

  it('wrapStep leaves |d| ≤ π alone and maps larger steps into [−π, π]', () => {
    expect(wrapStep(Math.PI)).toBe(Math.PI);
    expect(wrapStep(-Math.PI)).toBe(-Math.PI);
    expect(wrapStep(4)).toBeCloseTo(4 - 2 * Math.PI, 14);
    expect(wrapStep(-9.5)).toBeCloseTo(-9.5 + 4 * Math.PI, 14);
  });
});

describe('createCarrierStatistics (running mean and least-squares slope)', () => {
  it('ν[k] = 5 + 2·(k/fs): mean 5 + (N−1)/fs, slope 2 Hz/s, whatever the blocks', () => {
    const fs = 1000;
    const n = 5001;
    const nu = Float64Array.from({ length: n }, (_, k) => 5 + 2 * (k / fs));
    const c = createCarrierStatistics(fs);
    c.add(nu.subarray(0, 1));
    c.add(nu.subarray(1, 2000));
    c.add(nu.subarray(2000));
    expect(c.count).toBe(n);
    expect(c.meanHz).toBeCloseTo(5 + (n - 1) / fs, 12);
    expect(c.slopeHzPerS).toBeCloseTo(2, 10);
  });

  it('keeps precision with a 1e9 Hz offset over 1e6 samples (slope of a tiny drift)', () => {
    const fs = 1e6;
    const c = createCarrierStatistics(fs);
    const block = new Float64Array(100000);
    for (let b = 0; b < 10; b++) {
      for (let k = 0; k < block.length; k++) block[k] = 1e9 + 0.5 * ((b * block.length + k) / fs);
      c.add(block);
    }
    expect(c.slopeHzPerS).toBeCloseTo(0.5, 5);
    expect(c.meanHz - 1e9).toBeCloseTo(0.25, 5);
  });
});
