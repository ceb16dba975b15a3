/**
 * Frequency stability of an analysed capture: the overlapping Allan deviation at octave-spaced τ with
 * χ² intervals and slope classes (analysis/noise/allan.ts), from the capture's frequency record
 * (frequency-record.ts). Computed once, on the first request after the analysis is done, by streaming the
 * stored file again (a separate pass: the analysis job and its figures are untouched), then kept in
 * analysis_allan. ν0 comes from the capture's laser (its nominal optical frequency); without one the
 * deviation is of the frequency in Hz, and says so.
 * Intervals: σ²·edf/χ² as analysis/noise/allan.ts states them, with the smallest of the five power-law edf
 * of NIST SP 1065 at each τ (the widest interval). The local slope is too noisy at the longest τ to choose
 * the noise type (a scattered point read as PM would take the white-PM edf, ~N, and an interval far too
 * narrow), so the interval does not rest on it; the slope class is still reported for marking.
 */
import type { Knex } from 'knex';
import { allanDeviation, chiSquareQuantile, overlappingAllanEdf, type AllanNoiseType } from '../../../analysis/noise/allan';
import type { AllanResponse } from '../../contracts/stability';
import { conflict } from '../../errors';
import type { Storage } from '../../storage/storage';
import { accessFromRow, ANALYSIS_NOT_FOUND, assertCaptureAction, assertIdShape } from '../captures/capture-policy';
import { DEFAULT_MAX_RECORD, readFrequencyRecord } from './frequency-record';
import { findAllan, findAllanSource, insertAllan, type AllanSourceRow } from './stability.repository';

export interface StabilityServiceDeps {
  db: Knex;
  storage: Storage;
  /** largest frequency record held in memory (longer ones are pair-averaged); default 2^22 */
  maxRecord?: number;
}

const CHUNK_BYTES = 4 << 20;
const NOISE_TYPES: readonly AllanNoiseType[] = ['white-pm', 'flicker-pm', 'white-fm', 'flicker-fm', 'random-walk-fm'];

/** the widest interval over the five power laws: the smallest edf (at least 1) */
function conservativeInterval(variance: number, phasePoints: number, m: number, confidence: number) {
  const edf = Math.max(1, Math.min(...NOISE_TYPES.map((t) => overlappingAllanEdf(t, phasePoints, m))));
  // σ²·edf/χ²: the upper χ² quantile gives the lower bound
  const lower = Math.sqrt((variance * edf) / chiSquareQuantile((1 + confidence) / 2, edf));
  const upper = Math.sqrt((variance * edf) / chiSquareQuantile((1 - confidence) / 2, edf));
  return { edf, lower, upper };
}

export function createStabilityService(deps: StabilityServiceDeps) {
  const { db, storage } = deps;
  const inFlight = new Map<string, Promise<AllanResponse>>();

  async function compute(row: AllanSourceRow): Promise<AllanResponse> {
    const stream = await storage.open(row.storage_key, { highWaterMark: CHUNK_BYTES });
    let record;
    try {
      record = await readFrequencyRecord(
        stream,
        {
          kind: row.kind,
          format: row.format,
          sampleRateHz: row.sample_rate_hz,
          dtype: row.dtype,
          channels: row.channels === 1 || row.channels === 2 ? row.channels : null,
          byteOrder: row.byte_order,
          sizeBytes: Number(row.size_bytes),
        },
        deps.maxRecord ?? DEFAULT_MAX_RECORD,
      );
    } finally {
      stream.destroy();
    }
    const nu0Hz = row.frequency_thz !== null && row.frequency_thz > 0 ? row.frequency_thz * 1e12 : null;
    // y = ν/ν0 (the constant ν0 itself cancels in the second differences); in Hz without ν0
    const y = nu0Hz !== null ? record.frequencyHz.map((v) => v / nu0Hz) : record.frequencyHz;
    const r = allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: record.sampleIntervalS });
    const warnings = [...r.warnings];
    if (nu0Hz === null) {
      warnings.push("the capture's laser has no optical frequency (or there is no laser): this is the Allan deviation of the frequency in Hz, not of the fractional frequency");
    }
    if (record.decimation > 1) {
      warnings.push(
        `the record of ${record.frequencySamples} frequency samples was averaged in groups of ${record.decimation} to fit in memory: ` +
          `τ starts at ${record.sampleIntervalS.toPrecision(3)} s (the deviation at these τ is unchanged)`,
      );
    }
    return {
      analysisId: row.analysis_id,
      basis: nu0Hz !== null ? 'fractional' : 'hz',
      ...(nu0Hz !== null ? { nu0Hz } : {}),
      estimator: 'overlapping',
      confidence: r.confidence,
      points: r.points.map((p) => ({
        tauS: p.tauS,
        deviation: p.deviation,
        ...conservativeInterval(p.variance, r.phasePoints, p.averagingFactor, r.confidence),
        slopeClass: p.slopeClass,
      })),
      regions: r.regions,
      sampleIntervalS: record.sampleIntervalS,
      decimation: record.decimation,
      phasePoints: r.phasePoints,
      warnings,
    };
  }

  return {
    async allan(userId: string, analysisId: string): Promise<AllanResponse> {
      assertIdShape(analysisId, ANALYSIS_NOT_FOUND);
      const row = await findAllanSource(db, analysisId, userId);
      const access = accessFromRow(row, userId, ANALYSIS_NOT_FOUND);
      assertCaptureAction(access, 'captures.read');
      if (row!.status !== 'done') {
        throw conflict(
          row!.status === 'failed'
            ? 'this analysis failed, so it has no Allan deviation; retry it or start a new one'
            : `this analysis is ${row!.status}; its Allan deviation is there once it is done`,
        );
      }
      const kept = await findAllan(db, analysisId);
      if (kept !== undefined) return (typeof kept === 'string' ? JSON.parse(kept) : kept) as AllanResponse;
      let pending = inFlight.get(analysisId);
      if (!pending) {
        pending = compute(row!).then(async (body) => {
          await insertAllan(db, analysisId, body.basis, body.nu0Hz ?? null, body);
          return body;
        });
        inFlight.set(analysisId, pending);
        void pending.finally(() => inFlight.delete(analysisId)).catch(() => {});
      }
      return pending;
    },
  };
}

export type StabilityService = ReturnType<typeof createStabilityService>;
