/**
 * Corrections of an analysis's S_ν for how it was measured, made from the analysis's full series in
 * storage (the job's stitched Welch spectrum) and kept beside the analysis (which is left as it was):
 *  - reference: subtractReference (analysis/corrections/reference-subtraction.ts, METHODS 4.1) with the
 *    reference's own analysis on the same bench (its series) or its linewidth (white level Δν/π);
 *  - delay-interferometer: correctDelayInterferometer (analysis/corrections/delay-interferometer.ts,
 *    METHODS 4.3) on S_Δφ = S_ν,apparent/f² — the job read the demodulated Δφ as a phase, so its S_ν is f²·S_Δφ.
 * The figures are read again from the corrected spectrum, log-binned like the job's view (30 points per
 * decade, never across a masked notch): white floor (analysis/linewidth/white-floor.ts) as the mean over the
 * analysis's own floor band after a subtraction (the subtraction is linear), by the automatic search below
 * 0.9/τ after an interferometer (METHODS 4.3); intrinsic linewidth π·S_ν,white; β-line linewidth
 * (analysis/linewidth/beta-line.ts) with the analysis's observation time.
 */
import type { Knex } from 'knex';
import { correctDelayInterferometer } from '../../../analysis/corrections/delay-interferometer';
import { subtractReference } from '../../../analysis/corrections/reference-subtraction';
import { AnalysisInputError, isAnalysisInputError } from '../../../analysis/errors';
import { betaLine } from '../../../analysis/linewidth/beta-line';
import { whiteFloor } from '../../../analysis/linewidth/white-floor';
import { logBinSpectrum } from '../../../analysis/spectrum/log-binning';
import type { Spectrum } from '../../../analysis/types';
import type { Correction, CorrectionFigures, CreateCorrectionRequest } from '../../contracts/corrections';
import { AppError, conflict, notFound } from '../../errors';
import { newId } from '../../lib/ids';
import { decodeSeries } from '../../jobs/series-file';
import type { Storage } from '../../storage/storage';
import { findAnalysisForUser } from '../analyses/analyses.repository';
import { accessFromRow, ANALYSIS_NOT_FOUND, assertCaptureAction, assertIdShape } from '../captures/capture-policy';
import { deleteCorrection, findCorrectionForUser, insertCorrection, listCorrections, type CorrectionRow } from './corrections.repository';

type Parsed<T extends { parse: (v: unknown) => unknown }> = ReturnType<T['parse']>;
export type CorrectionInput = Parsed<typeof CreateCorrectionRequest>;

export const CORRECTION_NOT_FOUND = 'no such correction, or it is not on a bench of yours';
const POINTS_PER_DECADE = 30;

export interface CorrectionsServiceDeps {
  db: Knex;
  storage: Storage;
}

async function readAll(storage: Storage, key: string): Promise<Uint8Array> {
  const stream = await storage.open(key);
  const parts: Buffer[] = [];
  for await (const chunk of stream) parts.push(chunk as Buffer);
  return new Uint8Array(Buffer.concat(parts));
}

const finite = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

/**
 * Log bins of the kept bins, one run at a time: a bin never straddles a masked range, so no display
 * point sits inside a notch.
 */
export function binRuns(spectrum: Spectrum, gapsHz: readonly [number, number][]): Spectrum {
  const f = spectrum.frequencyHz;
  const outF: number[] = [];
  const outS: number[] = [];
  let start = 0;
  for (let i = 1; i <= f.length; i++) {
    const gapBetween = i < f.length && gapsHz.some(([a, b]) => f[i - 1] < a && b < f[i]);
    if (i === f.length || gapBetween) {
      const run = { frequencyHz: f.subarray(start, i), psd: spectrum.psd.subarray(start, i) };
      const b = logBinSpectrum(run, { pointsPerDecade: POINTS_PER_DECADE });
      outF.push(...b.frequencyHz);
      outS.push(...b.psd);
      start = i;
    }
  }
  return { frequencyHz: Float64Array.from(outF), psd: Float64Array.from(outS) };
}

export interface FigureOptions {
  observationTimeS: number;
  /** top of the band the figures may use, Hz */
  maxHz?: number;
  /** the white floor as the mean over this band (no search) */
  floorBandHz?: [number, number];
}

/** The linewidth figures of a corrected spectrum (kept bins only), read from its log-binned view. */
export function figuresOf(display: Spectrum, o: FigureOptions, warnings: string[]): CorrectionFigures {
  let floor = null;
  try {
    floor = whiteFloor(display, o.floorBandHz ? { bandHz: o.floorBandHz } : o.maxHz !== undefined ? { maxHz: o.maxHz } : {});
    warnings.push(...floor.warnings);
  } catch (e) {
    if (!isAnalysisInputError(e)) throw e;
    warnings.push(`white floor: ${e.message}`);
  }
  let beta = null;
  try {
    beta = betaLine(display, { observationTimeS: o.observationTimeS, ...(o.maxHz !== undefined ? { maxHz: o.maxHz } : {}) });
    warnings.push(...beta.warnings);
  } catch (e) {
    if (!isAnalysisInputError(e)) throw e;
    warnings.push(`β-line: ${e.message}`);
  }
  return {
    whiteFloorHz2PerHz: finite(floor?.valueHz2PerHz),
    intrinsicLinewidthHz: finite(floor?.intrinsicLinewidthHz),
    betaLinewidthHz: finite(beta?.linewidthHz),
  };
}

function toCorrection(row: CorrectionRow): Correction {
  const body = (typeof row.body === 'string' ? JSON.parse(row.body) : row.body) as Omit<Correction, 'id' | 'analysisId' | 'type' | 'params' | 'createdBy' | 'createdAt'>;
  return {
    id: row.id,
    analysisId: row.analysis_id,
    type: row.type,
    params: typeof row.params === 'string' ? JSON.parse(row.params) : row.params,
    ...body,
    createdBy: row.created_by,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

export function createCorrectionsService(deps: CorrectionsServiceDeps) {
  const { db, storage } = deps;

  async function doneAnalysis(userId: string, analysisId: string) {
    assertIdShape(analysisId, ANALYSIS_NOT_FOUND);
    const row = await findAnalysisForUser(db, analysisId, userId, [
      'id',
      'status',
      'series_key',
      'result',
      'intrinsic_linewidth_hz',
      'beta_linewidth_hz',
      'white_floor_hz2_per_hz',
    ] as const);
    const access = accessFromRow(row, userId, ANALYSIS_NOT_FOUND);
    return { row: row!, access };
  }

  async function seriesOf(row: { status: string; series_key: string | null }, what: string): Promise<Spectrum> {
    if (row.status !== 'done') throw conflict(`${what} is ${row.status}; a correction needs a finished analysis`);
    if (!row.series_key) throw conflict(`${what} kept no series; start a new analysis of its capture`);
    return decodeSeries(await readAll(storage, row.series_key));
  }

  return {
    async list(userId: string, analysisId: string): Promise<Correction[]> {
      const { access } = await doneAnalysis(userId, analysisId);
      assertCaptureAction(access, 'captures.read');
      return (await listCorrections(db, analysisId)).map(toCorrection);
    },

    async get(userId: string, id: string): Promise<Correction> {
      assertIdShape(id, CORRECTION_NOT_FOUND);
      const row = await findCorrectionForUser(db, id, userId);
      accessFromRow(row, userId, CORRECTION_NOT_FOUND);
      return toCorrection(row!);
    },

    async remove(userId: string, id: string): Promise<void> {
      assertIdShape(id, CORRECTION_NOT_FOUND);
      const row = await findCorrectionForUser(db, id, userId);
      const access = accessFromRow(row, userId, CORRECTION_NOT_FOUND);
      assertCaptureAction(access, 'captures.write');
      if ((await deleteCorrection(db, id)) === 0) throw notFound(CORRECTION_NOT_FOUND);
    },

    /** `parse` runs after the role check, so a refused member learns nothing about validation. */
    async create(userId: string, analysisId: string, parse: () => CorrectionInput): Promise<Correction> {
      const { row, access } = await doneAnalysis(userId, analysisId);
      assertCaptureAction(access, 'captures.write');
      const input = parse();
      const measured = await seriesOf(row, 'this analysis');
      // the stitched series starts at f = 0 or just above; the corrections work on f > 0
      let first = 0;
      while (first < measured.frequencyHz.length && !(measured.frequencyHz[first] > 0)) first++;
      const beat: Spectrum = { frequencyHz: measured.frequencyHz.subarray(first), psd: measured.psd.subarray(first) };
      const result = (typeof row.result === 'string' ? JSON.parse(row.result) : row.result) as {
        betaLine?: { observationTimeS?: number };
        input?: { durationS?: number };
        whiteFloor?: { bandHz?: [number, number] };
      } | null;
      const observationTimeS = result?.betaLine?.observationTimeS ?? result?.input?.durationS;
      if (!(typeof observationTimeS === 'number' && observationTimeS > 0)) throw new AnalysisInputError('the analysis states no observation time');

      const warnings: string[] = [];
      let corrected: Spectrum;
      let maxHz: number | undefined;
      const body = { method: null as string | null, notPositiveCount: 0, outsideReferenceCount: 0, maskedCount: 0, maskedRangesHz: [] as [number, number][], firstZeroHz: null as number | null };
      const params: Record<string, string | number> = {};
      if (input.type === 'reference') {
        let reference: Parameters<typeof subtractReference>[1];
        if (input.referenceAnalysisId !== undefined) {
          if (input.referenceAnalysisId === analysisId) {
            throw new AppError(400, 'validation_failed', 'check this field: referenceAnalysisId', [{ path: 'referenceAnalysisId', message: 'the reference must be another analysis' }]);
          }
          const ref = await findAnalysisForUser(db, input.referenceAnalysisId, userId, ['status', 'series_key'] as const);
          if (!ref || ref.bench_id !== access.benchId) {
            throw new AppError(400, 'validation_failed', 'check this field: referenceAnalysisId', [{ path: 'referenceAnalysisId', message: 'no such analysis on this bench' }]);
          }
          const refSeries = await seriesOf(ref, 'the reference analysis');
          let j = 0;
          while (j < refSeries.frequencyHz.length && !(refSeries.frequencyHz[j] > 0)) j++;
          reference = { spectrum: { frequencyHz: refSeries.frequencyHz.subarray(j), psd: refSeries.psd.subarray(j) } };
          params.referenceAnalysisId = input.referenceAnalysisId;
        } else {
          reference = { linewidthHz: input.linewidthHz! };
          params.linewidthHz = input.linewidthHz!;
        }
        const r = subtractReference(beat, reference);
        corrected = r.spectrum;
        warnings.push(...r.warnings);
        Object.assign(body, { method: r.method, notPositiveCount: r.notPositiveCount, outsideReferenceCount: r.outsideReferenceCount });
      } else {
        // the job's S_ν of the demodulated Δφ is f²·S_Δφ
        const f = beat.frequencyHz;
        const sDphi = new Float64Array(f.length);
        for (let i = 0; i < f.length; i++) sDphi[i] = beat.psd[i] / (f[i] * f[i]);
        const r = correctDelayInterferometer({ frequencyHz: f, psd: sDphi }, { delayS: input.delayS, ...(input.maskThreshold !== undefined ? { maskThreshold: input.maskThreshold } : {}) });
        corrected = r.spectrum;
        warnings.push(...r.warnings);
        maxHz = 0.9 / input.delayS;
        params.delayS = input.delayS;
        if (input.maskThreshold !== undefined) params.maskThreshold = input.maskThreshold;
        Object.assign(body, { maskedCount: r.maskedCount, maskedRangesHz: r.maskedRangesHz, firstZeroHz: r.firstZeroHz });
      }
      if (corrected.frequencyHz.length < 8) throw new AnalysisInputError(`the correction leaves ${corrected.frequencyHz.length} bins: too few to read figures from`);
      if (maxHz !== undefined && maxHz <= corrected.frequencyHz[0]) maxHz = undefined;
      const display = binRuns(corrected, body.maskedRangesHz);
      // a subtraction is linear: the floor is read over the analysis's own floor band; after an
      // interferometer the apparent spectrum's band means nothing, so the floor is searched for below 0.9/τ
      const band = input.type === 'reference' ? result?.whiteFloor?.bandHz : undefined;
      const figures = figuresOf(display, { observationTimeS, maxHz, ...(band ? { floorBandHz: band } : {}) }, warnings);
      const correction: CorrectionRow = {
        id: newId(),
        analysis_id: analysisId,
        created_by: userId,
        type: input.type,
        params,
        intrinsic_linewidth_hz: figures.intrinsicLinewidthHz,
        beta_linewidth_hz: figures.betaLinewidthHz,
        white_floor_hz2_per_hz: figures.whiteFloorHz2PerHz,
        body: {
          before: {
            whiteFloorHz2PerHz: row.white_floor_hz2_per_hz,
            intrinsicLinewidthHz: row.intrinsic_linewidth_hz,
            betaLinewidthHz: row.beta_linewidth_hz,
          },
          figures,
          ...body,
          warnings: [...new Set(warnings)],
          display: { frequencyHz: Array.from(display.frequencyHz), frequencyNoiseHz2PerHz: Array.from(display.psd) },
        },
        created_at: new Date(),
      };
      await insertCorrection(db, correction);
      return toCorrection(correction);
    },
  };
}

export type CorrectionsService = ReturnType<typeof createCorrectionsService>;
