import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { residualPhaseError, residualPhaseErrorLorentzian } from '../../analysis/budget/carrier-recovery';
import { evaluateLinkBudget, linkBudgetTable } from '../../analysis/budget/link-budget';
import { frequencyNoise, frequencyNoiseAt, trigamma, wienerIncrementVariance } from '../../analysis/budget/phase-noise-integral';
import { publishedTolerance } from '../../analysis/budget/tolerances';
import type { Spectrum } from '../../analysis/types';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

function logGrid(lo: number, hi: number, perDecade: number, fn: (f: number) => number): Spectrum {
  const n = Math.round(Math.log10(hi / lo) * perDecade) + 1;
  const frequencyHz = new Float64Array(n);
  const psd = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    frequencyHz[i] = lo * 10 ** (i / perDecade);
    psd[i] = fn(frequencyHz[i]);
  }
  return { frequencyHz, psd };
}

describe('published tolerances (METHODS 7.2)', () => {
  it('Pfau, Hoffmann, Noé, JLT 27(8), 989 (2009): at 32 GBd → 13.1 MHz QPSK, 4.48 MHz 16QAM, 1.28 MHz 64QAM summed linewidth', () => {
    expect(publishedTolerance('QPSK').product! * 32e9).toBeCloseTo(13.12e6, -3);
    expect(publishedTolerance('16QAM').product! * 32e9).toBeCloseTo(4.48e6, -3);
    expect(publishedTolerance('64QAM').product! * 32e9).toBeCloseTo(1.28e6, -3);
    expect(publishedTolerance('16QAM').source).toMatch(/Pfau, Hoffmann, Noé/);
    expect(publishedTolerance('16QAM').source).toMatch(/27\(8\), 989-999 \(2009\)/);
  });

  it('8PSK and 32QAM have no verified value: product null, and the source says so', () => {
    for (const f of ['8PSK', '32QAM'] as const) {
      expect(publishedTolerance(f).product).toBeNull();
      expect(publishedTolerance(f).source).toMatch(/no published tolerance verified/);
    }
  });
});

describe('phase-error integrals from S_ν (METHODS 7.1, 7.3)', () => {
  const white100k = frequencyNoise({ whiteHz2PerHz: 1e5 / Math.PI });

  it('Wiener increment: Δν = 100 kHz, R_s = 32 GBd → σ_p² = 2πΔνT_s = 1.963e-5 rad² (METHODS 7.1)', () => {
    expect(rel(wienerIncrementVariance(white100k, 32e9), 1.963e-5)).toBeLessThan(5e-4); // printed to 4 digits
    expect(rel(wienerIncrementVariance(white100k, 32e9), (2 * Math.PI * 1e5) / 32e9)).toBeLessThan(1e-9);
  });

  it('block average, Δν = 100 kHz at 32 GBd: M = 11 → 1.7850e-5, 21 → 3.4283e-5, 41 → 6.7046e-5 rad² (METHODS 7.3 / row 16)', () => {
    for (const [m, v] of [[11, 1.785e-5], [21, 3.4283e-5], [41, 6.7046e-5]] as const) {
      const r = residualPhaseError(white100k, { kind: 'block-average', blockLength: m }, 32e9);
      expect(rel(r.varianceRad2, v)).toBeLessThan(1e-4);
      // the spectral integral against the closed form σ_p² L(L+1)/(3(2L+1)) [METHODS 7.3, derived]
      expect(rel(r.varianceRad2, residualPhaseErrorLorentzian(1e5, { kind: 'block-average', blockLength: m }, 32e9))).toBeLessThan(1e-8);
      expect(rel(r.equivalentLinewidthHz, 1e5)).toBeLessThan(1e-9);
    }
  });

  it('first-order loop: σ_e² = πh₀/(2f_c); h₀ = 1e5/π, f_c = 100 MHz → 5.0000e-4 rad² (METHODS 7.3)', () => {
    const r = residualPhaseError(white100k, { kind: 'first-order-loop', bandwidthHz: 100e6 }, 32e9);
    expect(rel(r.varianceRad2, 5e-4)).toBeLessThan(1e-8);
  });

  it('the same white noise given as a measured log-grid spectrum (1 Hz … 10 GHz, tail held) gives the same σ_e²', () => {
    const spectrum = logGrid(1, 1e10, 50, () => 1e5 / Math.PI);
    const noise = frequencyNoise({ spectra: [{ spectrum }] });
    const ma = residualPhaseError(noise, { kind: 'block-average', blockLength: 21 }, 32e9);
    expect(rel(ma.varianceRad2, 3.4283e-5)).toBeLessThan(1e-4);
    const loop = residualPhaseError(noise, { kind: 'first-order-loop', bandwidthHz: 100e6 }, 32e9);
    expect(rel(loop.varianceRad2, 5e-4)).toBeLessThan(1e-6);
  });

  it('flicker h₋₁ = 1e11 Hz² added to the M = 21 case raises σ_e² by only 6.3e-8 rad² (METHODS 7.3): 1/f noise is tracked', () => {
    // spectrum to 1e14 Hz (≈ 2000 R_s as in METHODS), the white level beyond
    const base = frequencyNoise({ spectra: [{ spectrum: logGrid(1, 1e14, 50, () => 1e5 / Math.PI) }] });
    const withFlicker = frequencyNoise({ spectra: [{ spectrum: logGrid(1, 1e14, 50, (f) => 1e5 / Math.PI + 1e11 / f), tailLevelHz2PerHz: 1e5 / Math.PI }] });
    const rec = { kind: 'block-average', blockLength: 21 } as const;
    const a = residualPhaseError(base, rec, 32e9);
    const b = residualPhaseError(withFlicker, rec, 32e9);
    expect(Math.abs(b.varianceRad2 - a.varianceRad2 - 6.3e-8)).toBeLessThan(0.05e-8);
    // the equivalent Wiener linewidth rises by the same 0.2 %, though the β-line linewidth of such a laser is far larger
    expect(b.equivalentLinewidthHz / a.equivalentLinewidthHz - 1).toBeCloseTo(6.3e-8 / 3.4283e-5, 4);
  });

  it('frequencyNoise sums its parts: white + spectrum (held below, interpolated inside, tail above)', () => {
    const n = frequencyNoise({ spectra: [{ spectrum: logGrid(10, 1000, 1, (f) => 1e6 / f), tailLevelHz2PerHz: 7 }], whiteHz2PerHz: 2 });
    expect(frequencyNoiseAt(n, 1)).toBeCloseTo(2 + 1e5, 9);
    expect(frequencyNoiseAt(n, 100)).toBeCloseTo(2 + 1e4, 9);
    expect(frequencyNoiseAt(n, 31.6227766)).toBeCloseTo(2 + 1e6 / 31.6227766, 3); // the 1/f law between points
    expect(frequencyNoiseAt(n, 1e4)).toBe(9);
  });

  it('trigamma: ψ₁(1) = π²/6, ψ₁(1/2) = π²/2 (closed forms)', () => {
    expect(trigamma(1)).toBeCloseTo((Math.PI * Math.PI) / 6, 12);
    expect(trigamma(0.5)).toBeCloseTo((Math.PI * Math.PI) / 2, 12);
  });
});

describe('evaluateLinkBudget (METHODS 4.1, 7.1-7.3)', () => {
  it('16QAM at 32 GBd with 200 kHz combined: Δν·T_s = 6.25e-6, margin 1.4e-4/6.25e-6 = 22.4 (13.50 dB), pass', () => {
    const r = evaluateLinkBudget({ format: '16QAM', symbolRateBaud: 32e9, linewidthHz: 200e3 });
    expect(r.combinedLinewidthHz).toBe(200e3);
    expect(r.linewidthSymbolProduct).toBeCloseTo(6.25e-6, 18);
    expect(r.toleranceProduct).toBe(1.4e-4);
    expect(r.marginFactor as number).toBeCloseTo(22.4, 10);
    expect(r.marginDb as number).toBeCloseTo(13.502, 3);
    expect(r.pass).toBe(true);
    expect(r.toleranceSource).toMatch(/Pfau/);
    expect(r.caution).toMatch(/confirm it on the link/);
    expect(r.phaseIncrementVarianceRad2).toBeCloseTo(2 * Math.PI * 6.25e-6, 15);
    expect(r.residualPhaseErrorRad2).toBeUndefined();
  });

  it('Lorentzian FWHMs add (METHODS 4.1): Tx 3 MHz + LO 2 MHz for QPSK at 10 GBd → 5e-4 > 4.1e-4: fails by 0.86 dB', () => {
    const r = evaluateLinkBudget({ format: 'QPSK', symbolRateBaud: 10e9, transmitter: { linewidthHz: 3e6 }, localOscillator: { linewidthHz: 2e6 } });
    expect(r.combinedLinewidthHz).toBe(5e6);
    expect(r.linewidthBasis).toBe('lorentzian-sum');
    expect(r.pass).toBe(false);
    expect(r.marginDb as number).toBeCloseTo(10 * Math.log10(4.1e-4 / 5e-4), 10);
    expect(r.verdict).toMatch(/exceeds/);
  });

  it('with a carrier-recovery model the residual σ_e² is reported (M = 21, 100 kHz, 32 GBd → 3.4283e-5 rad²)', () => {
    const r = evaluateLinkBudget({ format: '64QAM', symbolRateBaud: 32e9, linewidthHz: 1e5, carrierRecovery: { kind: 'block-average', blockLength: 21 } });
    expect(rel(r.residualPhaseErrorRad2 as number, 3.4283e-5)).toBeLessThan(1e-4);
    expect(rel(r.equivalentWienerLinewidthHz as number, 1e5)).toBeLessThan(1e-9);
  });

  it('a transmitter given as a measured spectrum: the budget uses the equivalent Wiener linewidth of S_ν,Tx + Δν_LO/π', () => {
    // Tx: white 50 kHz (h₀ = 5e4/π) with strong flicker; LO: 50 kHz Lorentzian → Δν_eq ≈ 100 kHz, flicker adds ~0.2 %
    const tx = logGrid(1, 1e9, 50, (f) => 5e4 / Math.PI + 1e11 / f);
    const r = evaluateLinkBudget({
      format: '16QAM',
      symbolRateBaud: 32e9,
      transmitter: { spectrum: tx, tailLevelHz2PerHz: 5e4 / Math.PI },
      localOscillator: { linewidthHz: 5e4 },
      carrierRecovery: { kind: 'block-average', blockLength: 21 },
    });
    expect(r.linewidthBasis).toBe('equivalent-wiener');
    expect(rel(r.combinedLinewidthHz, 1e5)).toBeLessThan(0.01);
    expect(r.combinedLinewidthHz).toBeGreaterThan(1e5);
    expect(rel(r.residualPhaseErrorRad2 as number, 3.4283e-5)).toBeLessThan(0.01);
  });

  it('8PSK: no verified tolerance → toleranceProduct, margin and pass null, verdict says so', () => {
    const r = evaluateLinkBudget({ format: '8PSK', symbolRateBaud: 32e9, linewidthHz: 1e5 });
    expect(r.toleranceProduct).toBeNull();
    expect(r.marginFactor).toBeNull();
    expect(r.marginDb).toBeNull();
    expect(r.pass).toBeNull();
    expect(r.verdict).toMatch(/no published tolerance verified for 8PSK/);
    expect(r.linewidthSymbolProduct).toBeCloseTo(1e5 / 32e9, 18);
  });

  it('linkBudgetTable: the margin falls with the linewidth-symbol product — ×2 symbol rate = +3.01 dB', () => {
    const rows = linkBudgetTable({ format: 'QPSK', linewidthHz: 1e6 });
    expect(rows.map((r) => r.symbolRateBaud)).toEqual([8e9, 16e9, 32e9, 64e9, 96e9, 128e9]);
    expect((rows[1].marginDb as number) - (rows[0].marginDb as number)).toBeCloseTo(10 * Math.log10(2), 10);
    const custom = linkBudgetTable({ format: '64QAM', linewidthHz: 1e6, carrierRecovery: { kind: 'first-order-loop', bandwidthHz: 1e8 } }, [1e10]);
    expect(custom).toHaveLength(1);
    expect(rel(custom[0].residualPhaseErrorRad2 as number, 1e6 / (2 * 1e8))).toBeLessThan(1e-6);
  });

  it('rejects bad input, naming the rule', () => {
    expect(() => evaluateLinkBudget({ format: '16QAM', symbolRateBaud: -32e9, linewidthHz: 1 })).toThrow(/symbol rate must be a positive/);
    expect(() => evaluateLinkBudget({ format: '256QAM' as never, symbolRateBaud: 1e9, linewidthHz: 1 })).toThrow(/format must be one of/);
    expect(() => evaluateLinkBudget({ format: 'QPSK', symbolRateBaud: 1e9 })).toThrow(/give linewidthHz/);
    expect(() => evaluateLinkBudget({ format: 'QPSK', symbolRateBaud: 1e9, linewidthHz: -5 })).toThrow(/linewidth must be/);
    expect(() => evaluateLinkBudget({ format: 'QPSK', symbolRateBaud: 1e9, linewidthHz: 1, transmitter: { linewidthHz: 1 } })).toThrow(/not both/);
    expect(() => evaluateLinkBudget({ format: 'QPSK', symbolRateBaud: 1e9, transmitter: { linewidthHz: 1 } })).toThrow(/both transmitter and localOscillator/);
    expect(() =>
      evaluateLinkBudget({ format: 'QPSK', symbolRateBaud: 1e9, transmitter: { spectrum: logGrid(1, 10, 5, () => 1) }, localOscillator: { linewidthHz: 1 } }),
    ).toThrow(/needs a carrier-recovery model/);
    expect(() => evaluateLinkBudget({ format: 'QPSK', symbolRateBaud: 1e9, linewidthHz: 1, carrierRecovery: { kind: 'block-average', blockLength: 20 } })).toThrow(
      /odd integer/,
    );
    expect(() => evaluateLinkBudget({ format: 'QPSK', symbolRateBaud: 1e9, linewidthHz: 1, carrierRecovery: { kind: 'first-order-loop', bandwidthHz: 0 } })).toThrow(
      /loop bandwidth/,
    );
    expect(() => evaluateLinkBudget({ format: 'QPSK', symbolRateBaud: 1e9, linewidthHz: 1, carrierRecovery: { kind: 'pll' } as never })).toThrow(AnalysisInputError);
    expect(() => linkBudgetTable({ format: 'QPSK', linewidthHz: 1 }, [])).toThrow(/1 to 64/);
  });
});
