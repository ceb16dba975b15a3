/**
 * A resonant bump in S_ν (relaxation-oscillation-like): white noise through a two-pole resonator.
 *
 * Usage:
 *   import { createResonance, resonancePsd } from '../analysis/synth/resonance';
 *   const r = createResonance({ sampleRateHz: 10e6, centerHz: 800e3, widthHz: 60e3, peakHz2PerHz: 5e4 }, gaussian);
 *   r.add(nu);                                   // adds the bump process into nu (in place)
 *   resonancePsd(r.coefficients, 10e6, 800e3);   // 5e4 Hz²/Hz: the peak as asked
 *
 * y[k] = a1·y[k−1] + a2·y[k−2] + g·e[k], a1 = 2ρ·cos θ, a2 = −ρ², θ = 2π f_c/fs, ρ = exp(−π·W/fs):
 * poles at ρ·e^{±iθ}, −3 dB full width ≈ W when W ≪ f_c. One-sided PSD 2g²/(fs·|1 − a1 e^{−iω} − a2 e^{−2iω}|²);
 * g is set so the PSD at f_c equals the requested peak. The state starts stationary: (y[−1], y[−2])
 * drawn with the Yule-Walker autocovariances γ0 = g²(1 − a2)/((1 + a2)((1 − a2)² − a1²)),
 * γ1 = a1·γ0/(1 − a2), so there is no start-up transient.
 * Reference: G. E. P. Box, G. M. Jenkins, "Time Series Analysis: Forecasting and Control",
 *   Holden-Day (1970), ch. 3 (AR(2) process, its spectrum and autocovariances).
 * Units: Hz for frequencies; the peak in the unit²/Hz of the series (Hz²/Hz for ν).
 */

import { AnalysisInputError } from '../errors';
import type { Gaussian } from './gaussian';

export interface ResonanceOptions {
  sampleRateHz: number;
  centerHz: number;
  widthHz: number;
  peakHz2PerHz: number;
}

export interface ResonanceCoefficients {
  a1: number;
  a2: number;
  g: number;
}

export interface Resonance {
  readonly coefficients: ResonanceCoefficients;
  add(out: Float64Array): void;
}

function denominator(c: ResonanceCoefficients, omega: number): number {
  // |1 − a1 e^{−iω} − a2 e^{−2iω}|²
  const re = 1 - c.a1 * Math.cos(omega) - c.a2 * Math.cos(2 * omega);
  const im = c.a1 * Math.sin(omega) + c.a2 * Math.sin(2 * omega);
  return re * re + im * im;
}

export function resonancePsd(c: ResonanceCoefficients, sampleRateHz: number, frequencyHz: number): number {
  return (2 * c.g * c.g) / (sampleRateHz * denominator(c, (2 * Math.PI * frequencyHz) / sampleRateHz));
}

export function resonanceCoefficients(o: ResonanceOptions): ResonanceCoefficients {
  const fs = o.sampleRateHz;
  if (!(o.centerHz > 0 && o.centerHz < fs / 2)) {
    throw new AnalysisInputError(`resonance centerHz must lie in (0, fs/2), got ${o.centerHz}`);
  }
  if (!(o.widthHz > 0 && o.widthHz < o.centerHz)) {
    throw new AnalysisInputError(`resonance widthHz must lie in (0, centerHz), got ${o.widthHz}`);
  }
  if (!(o.peakHz2PerHz > 0 && Number.isFinite(o.peakHz2PerHz))) {
    throw new AnalysisInputError(`resonance peakHz2PerHz must be a positive number, got ${o.peakHz2PerHz}`);
  }
  const rho = Math.exp((-Math.PI * o.widthHz) / fs);
  const theta = (2 * Math.PI * o.centerHz) / fs;
  const c = { a1: 2 * rho * Math.cos(theta), a2: -rho * rho, g: 1 };
  // PSD(f_c) = 2g²/(fs·D(θ)) = peak
  c.g = Math.sqrt((o.peakHz2PerHz * fs * denominator(c, theta)) / 2);
  return c;
}

export function createResonance(o: ResonanceOptions, gaussian: Gaussian): Resonance {
  const c = resonanceCoefficients(o);
  const { a1, a2, g } = c;
  // stationary start from the Yule-Walker autocovariances
  const gamma0 = (g * g * (1 - a2)) / ((1 + a2) * ((1 - a2) * (1 - a2) - a1 * a1));
  const gamma1 = (a1 * gamma0) / (1 - a2);
  const rho1 = gamma1 / gamma0;
  let y1 = Math.sqrt(gamma0) * gaussian.next(); // y[k−1]
  let y2 = rho1 * y1 + Math.sqrt(gamma0 * (1 - rho1 * rho1)) * gaussian.next(); // y[k−2] | y[k−1]
  return {
    coefficients: c,
    add(out) {
      for (let k = 0; k < out.length; k++) {
        const y = a1 * y1 + a2 * y2 + g * gaussian.next();
        y2 = y1;
        y1 = y;
        out[k] += y;
      }
    },
  };
}
