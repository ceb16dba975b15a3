import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { brentRoot } from '../../analysis/linewidth/brent-root';
import { sineCosineIntegrals } from '../../analysis/linewidth/sine-cosine-integrals';
import { psdAt } from '../../analysis/linewidth/spectrum-grid';
import fixture from '../fixtures/linewidth/sici.json';

describe('sineCosineIntegrals(x) against scipy.special.sici (fixture made by make-sici-fixture.py)', () => {
  it.each(fixture.rows)('x = $x: Si, Cin = γ + ln x − Ci and g = Si − (1 − cos x)/x to 1e-14 (absolute) and 1e-12 (relative)', (row) => {
    const out = sineCosineIntegrals(row.x, { si: 0, cin: 0, g: 0 });
    for (const [got, want] of [
      [out.si, row.si],
      [out.cin, row.cin],
      [out.g, row.g],
    ]) {
      expect(Math.abs(got - want)).toBeLessThanOrEqual(1e-14 + 1e-12 * Math.abs(want));
    }
  });

  it('Si(1) = 0.946083070367183 and Ci(1) = 0.337403922900968 (Abramowitz & Stegun Table 5.1, from memory; scipy agrees)', () => {
    const out = sineCosineIntegrals(1, { si: 0, cin: 0, g: 0 });
    expect(out.si).toBeCloseTo(0.946083070367183, 14);
    // Ci(1) = γ + ln 1 − Cin(1)
    expect(0.5772156649015329 - out.cin).toBeCloseTo(0.337403922900968, 14);
  });

  it('Si(x) → π/2 and g(x) → π/2 as x → ∞; everything is 0 at x = 0', () => {
    const far = sineCosineIntegrals(1e9, { si: 0, cin: 0, g: 0 });
    expect(far.si).toBeCloseTo(Math.PI / 2, 8);
    expect(far.g).toBeCloseTo(Math.PI / 2, 8);
    expect(sineCosineIntegrals(0, { si: 1, cin: 1, g: 1 })).toEqual({ si: 0, cin: 0, g: 0 });
  });
});

describe('brentRoot (Brent 1973)', () => {
  it('brentRoot(x² − 2, 0, 2) = √2 to 1e-14', () => {
    expect(Math.abs(brentRoot((x) => x * x - 2, 0, 2, 1e-15) - Math.SQRT2)).toBeLessThan(1e-14);
  });
  it('brentRoot(cos x − x, 0, 1) = 0.7390851332151607 (the Dottie number)', () => {
    expect(brentRoot((x) => Math.cos(x) - x, 0, 1, 1e-16)).toBeCloseTo(0.7390851332151607, 14);
  });
  it('an interval that does not bracket a root throws AnalysisInputError', () => {
    expect(() => brentRoot((x) => x * x + 1, -1, 1, 1e-12)).toThrow(AnalysisInputError);
  });
});

describe('psdAt reads between grid points as a power law', () => {
  it('points (10 Hz, 100) and (1000 Hz, 1) → S(100 Hz) = 10 (the 1/f law through them)', () => {
    expect(psdAt(Float64Array.of(10, 1000), Float64Array.of(100, 1), 100)).toBeCloseTo(10, 12);
  });
  it('falls back to a straight line next to a zero: (0 Hz, 0), (10 Hz, 100) → S(4 Hz) = 40', () => {
    expect(psdAt(Float64Array.of(0, 10), Float64Array.of(0, 100), 4)).toBeCloseTo(40, 12);
  });
});
