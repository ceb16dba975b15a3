/**
 * One call for an RF beat spectrum: the line-shape fits, the −20 dB width and, in self-heterodyne mode,
 * the laser linewidth each shape implies with its stated assumption.
 *
 * Usage:
 *   import { analyseBeatSpectrum } from '../analysis/rf/beat-spectrum-analysis';
 *   const spectrum = parseRfSpectrumCsv(text);                      // analysis/rf/spectrum-csv.ts
 *   const r = analyseBeatSpectrum(spectrum, { mode: 'self-heterodyne', delayS: 122e-6 });
 *   r.fits; r.bestShape; r.twentyDb; r.selfHeterodyne; r.warnings
 *
 * Steps (each in its own file, with its reference): fits of the requested shapes (analysis/rf/line-fit.ts,
 * Levenberg–Marquardt, Voigt by Olivero & Longbothum), the −20 dB width (analysis/rf/twenty-db-width.ts,
 * METHODS 4.2), and for mode 'self-heterodyne' the laser linewidth per fitted shape and from the −20 dB width
 * (analysis/rf/self-heterodyne.ts, Okoshi et al. 1980: half the beat width for a Lorentzian, delay long against
 * the coherence time).
 * Failures: a shape whose fit fails is reported with its message (the others still count); when every
 * requested shape fails, AnalysisInputError carries their messages. A spectrum that does not fall 20 dB on
 * both sides gives twentyDb = null and a warning.
 * Defaults: mode 'beat' (no self-heterodyne reading); all three shapes; the whole spectrum.
 * Worked check: a Lorentzian beat of 62.83 kHz in self-heterodyne mode → laser 31.42 kHz from the Lorentzian fit.
 */

import { AnalysisInputError, isAnalysisInputError } from '../errors';
import { type RfLineFit, type RfLineFitOptions, type RfLineShape, RF_LINE_SHAPES, fitRfLine } from './line-fit';
import { type SelfHeterodyneResult, selfHeterodyneLinewidth } from './self-heterodyne';
import type { RfSpectrum } from './spectrum-csv';
import { type TwentyDbWidth, twentyDbWidth } from './twenty-db-width';

export interface BeatSpectrumOptions extends RfLineFitOptions {
  mode?: 'beat' | 'self-heterodyne';
  shapes?: RfLineShape[];
  /** self-heterodyne delay, s (or fiberLengthM with groupIndex) */
  delayS?: number;
  fiberLengthM?: number;
  groupIndex?: number;
}

export type ShapeOutcome = { shape: RfLineShape; fit: RfLineFit; error: null } | { shape: RfLineShape; fit: null; error: string };

export interface BeatSpectrumAnalysis {
  mode: 'beat' | 'self-heterodyne';
  fits: ShapeOutcome[];
  /** the fitted shape with the smallest residual (the Voigt only when > 1 % better than the simpler shapes) */
  bestShape: RfLineShape;
  twentyDb: TwentyDbWidth | null;
  /** self-heterodyne mode: the laser linewidth from each successful fit, and from the −20 dB width read as Lorentzian */
  selfHeterodyne: { fromFit: Partial<Record<RfLineShape, SelfHeterodyneResult>>; fromTwentyDb: SelfHeterodyneResult | null } | null;
  warnings: string[];
}

export function analyseBeatSpectrum(spectrum: RfSpectrum, options: BeatSpectrumOptions = {}): BeatSpectrumAnalysis {
  const { mode = 'beat', shapes = [...RF_LINE_SHAPES], delayS, fiberLengthM, groupIndex, ...fitOptions } = options ?? {};
  if (mode !== 'beat' && mode !== 'self-heterodyne') throw new AnalysisInputError(`mode must be 'beat' or 'self-heterodyne', got ${String(mode)}`, 'mode');
  if (!Array.isArray(shapes) || shapes.length === 0 || shapes.some((s) => !RF_LINE_SHAPES.includes(s))) {
    throw new AnalysisInputError(`shapes must list some of ${RF_LINE_SHAPES.join(', ')}, got ${JSON.stringify(shapes)}`, 'shapes');
  }
  if (mode === 'beat' && (delayS !== undefined || fiberLengthM !== undefined || groupIndex !== undefined)) {
    throw new AnalysisInputError("delayS, fiberLengthM and groupIndex apply to mode 'self-heterodyne' only", 'mode');
  }
  const warnings: string[] = [];
  const fits: ShapeOutcome[] = shapes.map((shape) => {
    try {
      const fit = fitRfLine(spectrum, shape, fitOptions);
      warnings.push(...fit.warnings.map((w) => `${shape}: ${w}`));
      return { shape, fit, error: null };
    } catch (e) {
      if (!isAnalysisInputError(e)) throw e;
      return { shape, fit: null, error: e.message };
    }
  });
  const ok = fits.filter((o): o is Extract<ShapeOutcome, { error: null }> => o.error === null);
  if (ok.length === 0) {
    throw new AnalysisInputError(`no line shape could be fitted: ${fits.map((o) => `${o.shape}: ${o.error}`).join('; ')}`);
  }
  for (const o of fits) if (o.error !== null) warnings.push(`${o.shape}: ${o.error}`);
  const simple = ok.filter((o) => o.shape !== 'voigt').sort((a, b) => a.fit.residualRmsMw - b.fit.residualRmsMw);
  const voigt = ok.find((o) => o.shape === 'voigt');
  let bestShape: RfLineShape = simple.length > 0 ? simple[0].shape : 'voigt';
  if (voigt && simple.length > 0 && voigt.fit.residualRmsMw < 0.99 * simple[0].fit.residualRmsMw) bestShape = 'voigt';

  let twentyDb: TwentyDbWidth | null = null;
  try {
    twentyDb = twentyDbWidth(spectrum);
    warnings.push(...twentyDb.warnings.map((w) => `−20 dB width: ${w}`));
  } catch (e) {
    if (!isAnalysisInputError(e)) throw e;
    warnings.push(`−20 dB width: ${e.message}`);
  }

  let selfHeterodyne: BeatSpectrumAnalysis['selfHeterodyne'] = null;
  if (mode === 'self-heterodyne') {
    const delay = { delayS, fiberLengthM, groupIndex };
    const fromFit: Partial<Record<RfLineShape, SelfHeterodyneResult>> = {};
    for (const o of ok) {
      fromFit[o.shape] =
        o.shape === 'voigt'
          ? selfHeterodyneLinewidth({ shape: 'voigt', beatLorentzianFwhmHz: o.fit.lorentzianFwhmHz ?? 0, beatGaussianFwhmHz: o.fit.gaussianFwhmHz ?? 0, ...delay })
          : selfHeterodyneLinewidth({ shape: o.shape, beatFwhmHz: o.fit.fwhmHz, ...delay });
    }
    const fromTwentyDb = twentyDb ? selfHeterodyneLinewidth({ shape: 'lorentzian', beatFwhmHz: twentyDb.lorentzianFwhmHz, ...delay }) : null;
    selfHeterodyne = { fromFit, fromTwentyDb };
    const best = fromFit[bestShape];
    if (best) warnings.push(...best.warnings.map((w) => `self-heterodyne: ${w}`));
  }
  return { mode, fits, bestShape, twentyDb, selfHeterodyne, warnings };
}
