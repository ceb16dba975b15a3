/**
 * Running mean and least-squares slope of a uniformly sampled series (carrier offset and drift).
 *
 * Usage:
 *   import { createCarrierStatistics } from '../analysis/phase/carrier-statistics';
 *   const c = createCarrierStatistics(10e6);        // sample rate of the frequency series, Hz
 *   c.add(nuBlock1); c.add(nuBlock2);
 *   c.meanHz;  c.slopeHzPerS;                       // carrier offset, linear drift
 *
 * Each block is reduced with two passes about its own means (count, mean time, mean value, Σ(t−t̄)²,
 * Σ(t−t̄)(ν−ν̄)), and blocks are merged with the pairwise update of Chan, Golub and LeVeque, so
 * records of 10⁹ samples keep full precision: T. F. Chan, G. H. Golub, R. J. LeVeque, "Algorithms for
 * computing the sample variance: analysis and recommendations", The American Statistician 37(3),
 * 242-247 (1983). Slope = Σ(t−t̄)(ν−ν̄) / Σ(t−t̄)² (ordinary least squares).
 * Units: ν in Hz, t = k/fs in s; slope in Hz/s (0 while fewer than 2 samples).
 * Worked check: ν[k] = 5 + 2·(k/fs) → mean 5 + (N−1)/fs, slope 2 Hz/s.
 */

export interface CarrierStatistics {
  add(values: ArrayLike<number>): void;
  readonly count: number;
  readonly meanHz: number;
  readonly slopeHzPerS: number;
}

export function createCarrierStatistics(sampleRateHz: number): CarrierStatistics {
  let count = 0;
  let meanT = 0; // in samples
  let meanV = 0;
  let sTT = 0; // Σ(t − t̄)²
  let sTV = 0; // Σ(t − t̄)(ν − ν̄)
  return {
    add(values) {
      const n = values.length;
      if (n === 0) return;
      const t0 = count; // sample index of the block's first value
      // block mean about a reference value (the running mean, or the first value): summing
      // deviations keeps full precision when ν carries a large offset (1e9 Hz)
      const ref = count > 0 ? meanV : values[0];
      let dev = 0;
      for (let k = 0; k < n; k++) dev += values[k] - ref;
      const bv = ref + dev / n;
      const bt = t0 + (n - 1) / 2;
      const btt = (n * (n * n - 1)) / 12; // Σ(k − k̄)² for k = 0..n−1
      let btv = 0;
      const kMid = (n - 1) / 2;
      for (let k = 0; k < n; k++) btv += (k - kMid) * (values[k] - bv);
      // Chan–Golub–LeVeque merge of (count, meanT, meanV, sTT, sTV) with the block's
      const total = count + n;
      const dt = bt - meanT;
      const dv = bv - meanV;
      sTT += btt + (dt * dt * count * n) / total;
      sTV += btv + (dt * dv * count * n) / total;
      meanT += (dt * n) / total;
      meanV += (dv * n) / total;
      count = total;
    },
    get count() {
      return count;
    },
    get meanHz() {
      return meanV;
    },
    get slopeHzPerS() {
      // slope per sample × fs = Hz/s
      return sTT > 0 ? (sTV / sTT) * sampleRateHz : 0;
    },
  };
}
