/**
 * RF beat spectra on a bench: read and fit on upload (analysis/rf/: parseRfSpectrumCsv, then
 * analyseBeatSpectrum — Lorentzian, Gaussian and Voigt on a baseline, the −20 dB width, the
 * self-heterodyne reading); stored only when the file was read and at least one shape converged.
 * Members read; owners and analysts upload; an owner, or the analyst who uploaded it, deletes.
 */
import type { Knex } from 'knex';
import { analyseBeatSpectrum, type BeatSpectrumAnalysis } from '../../../analysis/rf/beat-spectrum-analysis';
import type { SelfHeterodyneResult } from '../../../analysis/rf/self-heterodyne';
import { parseRfSpectrumCsv } from '../../../analysis/rf/spectrum-csv';
import type {
  RfLineFitResult,
  RfLineShape,
  RfSelfHeterodyneReading,
  RfSpectrum,
  RfSpectrumResult,
  RfSpectrumSummary,
  RfSpectrumUploadFields,
  RfTrace,
} from '../../contracts/rf-spectra';
import { AppError, forbidden, notFound } from '../../errors';
import { newId } from '../../lib/ids';
import type { BenchAccess } from '../benches/bench-policy';
import { accessFromRow, assertCaptureAction, assertIdShape } from '../captures/capture-policy';
import { findLaser } from '../lasers/lasers.repository';
import {
  deleteRfSpectrum,
  findRfSpectrumForUser,
  insertRfSpectrum,
  listRfSpectra,
  type RfSpectrumRow,
  type RfSpectrumSummaryRow,
} from './rf-spectra.repository';

type Parsed<T extends { parse: (v: unknown) => unknown }> = ReturnType<T['parse']>;
export type RfUploadInput = Parsed<typeof RfSpectrumUploadFields>;

export const RF_SPECTRUM_NOT_FOUND = 'no such RF spectrum, or it is not on a bench of yours';
/**
 * Data rows accepted in one spectrum: analysers export up to a few ten thousand points. The fits run in the
 * request (a 40 001-point trace takes about 2 s, all three shapes), and the trace with its three curves is
 * one JSON row of a few MB.
 */
export const RF_MAX_ROWS = 40_001;

export interface RfUploadedFile {
  buffer: Buffer;
  originalName: string;
}

const parseJson = <T>(v: string | T): T => (typeof v === 'string' ? (JSON.parse(v) as T) : v);

function toSummary(row: RfSpectrumSummaryRow): RfSpectrumSummary {
  return {
    id: row.id,
    benchId: row.bench_id,
    laserId: row.laser_id,
    name: row.name,
    fileName: row.file_name,
    powerUnit: row.power_unit,
    mode: row.mode,
    delayS: row.delay_s,
    fiberLengthM: row.fiber_length_m,
    groupIndex: row.group_index,
    points: row.points,
    resolutionBandwidthHz: row.resolution_bandwidth_hz,
    bestShape: row.best_shape,
    bestFwhmHz: row.best_fwhm_hz,
    createdBy: row.created_by,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

function reading(r: SelfHeterodyneResult): RfSelfHeterodyneReading {
  return {
    shape: r.shape,
    laserLinewidthHz: r.laserLinewidthHz,
    laserLorentzianFwhmHz: r.laserLorentzianFwhmHz,
    laserGaussianFwhmHz: r.laserGaussianFwhmHz,
    assumption: r.assumption,
    delayS: r.delayS,
    delayLinewidthProduct: r.delayLinewidthProduct,
    shortDelayLinewidthHz: r.shortDelayLinewidthHz,
    warnings: r.warnings,
  };
}

/** The analysis as plain JSON: figures in `result`, the fitted curves beside the trace. */
export function resultOf(a: BeatSpectrumAnalysis): { result: RfSpectrumResult; models: RfTrace['models'] } {
  const models: RfTrace['models'] = {};
  const fits: RfLineFitResult[] = a.fits.map((o) => {
    if (o.fit === null) {
      return {
        shape: o.shape,
        error: o.error,
        centerHz: null,
        centerUncertaintyHz: null,
        fwhmHz: null,
        fwhmUncertaintyHz: null,
        exactFwhmHz: null,
        lorentzianFwhmHz: null,
        lorentzianFwhmUncertaintyHz: null,
        gaussianFwhmHz: null,
        gaussianFwhmUncertaintyHz: null,
        peakMw: null,
        baselineMw: null,
        residualRmsMw: null,
        residualRelative: null,
        iterations: null,
      };
    }
    const f = o.fit;
    models[o.shape] = Array.from(f.modelMw);
    return {
      shape: o.shape,
      error: null,
      centerHz: f.centerHz,
      centerUncertaintyHz: f.centerUncertaintyHz,
      fwhmHz: f.fwhmHz,
      fwhmUncertaintyHz: f.fwhmUncertaintyHz,
      exactFwhmHz: f.exactFwhmHz,
      lorentzianFwhmHz: f.lorentzianFwhmHz,
      lorentzianFwhmUncertaintyHz: f.lorentzianFwhmUncertaintyHz,
      gaussianFwhmHz: f.gaussianFwhmHz,
      gaussianFwhmUncertaintyHz: f.gaussianFwhmUncertaintyHz,
      peakMw: f.peakMw,
      baselineMw: f.baselineMw,
      residualRmsMw: f.residualRmsMw,
      residualRelative: f.residualRelative,
      iterations: f.iterations,
    };
  });
  const t = a.twentyDb;
  const sh = a.selfHeterodyne;
  const fromFit: Partial<Record<RfLineShape, RfSelfHeterodyneReading>> = {};
  if (sh) for (const [shape, r] of Object.entries(sh.fromFit)) if (r) fromFit[shape as RfLineShape] = reading(r);
  return {
    result: {
      fits,
      bestShape: a.bestShape,
      twentyDb: t
        ? { widthHz: t.widthHz, crossingsHz: t.crossingsHz, lorentzianFwhmHz: t.lorentzianFwhmHz, gaussianFwhmHz: t.gaussianFwhmHz, floorDepthDb: t.floorDepthDb }
        : null,
      selfHeterodyne: sh ? { fromFit, fromTwentyDb: sh.fromTwentyDb ? reading(sh.fromTwentyDb) : null } : null,
      warnings: a.warnings,
    },
    models,
  };
}

function assertMayDelete(access: BenchAccess, createdBy: string | null): void {
  if (access.role === 'owner') return;
  if (access.role === 'analyst' && createdBy === access.userId) return;
  throw forbidden(
    access.role === 'analyst'
      ? 'analysts delete only the RF spectra they uploaded; ask an owner of the bench'
      : `your role on this bench (${access.role}) does not allow this; it needs owner, or the analyst who uploaded it`,
  );
}

export function createRfSpectraService(db: Knex) {
  async function load(userId: string, id: string, withData: boolean) {
    assertIdShape(id, RF_SPECTRUM_NOT_FOUND);
    const row = await findRfSpectrumForUser(db, id, userId, withData);
    const access = accessFromRow(row, userId, RF_SPECTRUM_NOT_FOUND);
    return { row: row!, access };
  }

  function toRfSpectrum(row: RfSpectrumRow): RfSpectrum {
    return { ...toSummary(row), result: parseJson(row.result), trace: parseJson(row.trace) };
  }

  return {
    async list(access: BenchAccess): Promise<RfSpectrumSummary[]> {
      assertCaptureAction(access, 'captures.read');
      return (await listRfSpectra(db, access.benchId)).map(toSummary);
    },

    async get(userId: string, id: string): Promise<RfSpectrum> {
      const { row, access } = await load(userId, id, true);
      assertCaptureAction(access, 'captures.read');
      return toRfSpectrum(row);
    },

    /** Reads and fits the file; AnalysisInputError (400 bad_input) when it cannot, and nothing is stored. */
    async create(access: BenchAccess, file: RfUploadedFile, input: RfUploadInput): Promise<RfSpectrum> {
      assertCaptureAction(access, 'captures.write');
      if (input.laserId !== undefined && !(await findLaser(db, access.benchId, input.laserId))) {
        throw new AppError(400, 'validation_failed', 'check this field: laserId', [{ path: 'laserId', message: 'no such laser on this bench' }]);
      }
      const spectrum = parseRfSpectrumCsv(new Uint8Array(file.buffer.buffer, file.buffer.byteOffset, file.buffer.byteLength), {
        powerUnit: input.powerUnit,
        frequencyUnit: input.frequencyUnit,
        maxRows: RF_MAX_ROWS,
      });
      const analysis = analyseBeatSpectrum(spectrum, {
        mode: input.mode,
        ...(input.mode === 'self-heterodyne' ? { delayS: input.delayS, fiberLengthM: input.fiberLengthM, groupIndex: input.groupIndex } : {}),
        ...(spectrum.resolutionBandwidthHz !== null ? { resolutionBandwidthHz: spectrum.resolutionBandwidthHz } : {}),
      });
      const { result, models } = resultOf(analysis);
      result.warnings = [...spectrum.warnings, ...result.warnings];
      const best = result.fits.find((f) => f.shape === result.bestShape)!;
      const row: RfSpectrumRow = {
        id: newId(),
        bench_id: access.benchId,
        laser_id: input.laserId ?? null,
        created_by: access.userId,
        name: input.name,
        file_name: file.originalName.slice(0, 255) || 'spectrum.csv',
        power_unit: spectrum.powerUnit,
        mode: input.mode,
        delay_s: input.delayS ?? null,
        fiber_length_m: input.fiberLengthM ?? null,
        group_index: input.groupIndex ?? null,
        points: spectrum.rows,
        resolution_bandwidth_hz: spectrum.resolutionBandwidthHz,
        best_shape: result.bestShape,
        best_fwhm_hz: best.fwhmHz!,
        result,
        trace: { frequencyHz: Array.from(spectrum.frequencyHz), powerMw: Array.from(spectrum.powerMw), models },
        created_at: new Date(),
      };
      await insertRfSpectrum(db, row);
      return toRfSpectrum(row);
    },

    async remove(userId: string, id: string): Promise<void> {
      const { row, access } = await load(userId, id, false);
      assertCaptureAction(access, 'captures.read');
      assertMayDelete(access, row.created_by);
      if ((await deleteRfSpectrum(db, id)) === 0) throw notFound(RF_SPECTRUM_NOT_FOUND);
    },
  };
}

export type RfSpectraService = ReturnType<typeof createRfSpectraService>;
