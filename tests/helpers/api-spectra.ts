/**
 * Rows made directly in API tests: a capture on a bench and one analysis of it, without running the
 * engine (for routes that only read stored figures: overlays, sweeps, share links).
 */
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { newId } from '../../server/lib/ids';

let seq = 0;

export interface SpectrumRows {
  laserId?: string | null;
  fileName?: string;
  outputPowerMw?: number | null;
  driveCurrentMa?: number | null;
  temperatureC?: number | null;
  intrinsicHz?: number | null;
  betaHz?: number | null;
  status?: 'done' | 'queued' | 'failed';
  finishedAt?: Date;
  captureId?: string;
}

/** Inserts a capture (unless captureId is given) and one analysis of it; returns both ids. */
export async function insertSpectrum(db: Knex, benchId: string, uploadedBy: string, o: SpectrumRows = {}) {
  seq += 1;
  const captureId = o.captureId ?? newId();
  if (!o.captureId) {
    await db('captures').insert({
      id: captureId,
      bench_id: benchId,
      laser_id: o.laserId ?? null,
      uploaded_by: uploadedBy,
      file_name: o.fileName ?? `capture-${seq}.npy`,
      storage_key: `test/${captureId}`,
      size_bytes: 1024,
      sha256: createHash('sha256').update(captureId).digest('hex'),
      format: 'npy',
      kind: 'phase',
      sample_rate_hz: 1e6,
      drive_current_ma: o.driveCurrentMa ?? null,
      temperature_c: o.temperatureC ?? null,
      output_power_mw: o.outputPowerMw ?? null,
      created_at: new Date(Date.UTC(2026, 10, 1, 0, 0, seq)),
    });
  }
  const analysisId = newId();
  const status = o.status ?? 'done';
  const intrinsic = o.intrinsicHz === undefined ? 1000 : o.intrinsicHz;
  const beta = o.betaHz === undefined ? 20_000 : o.betaHz;
  await db('analyses').insert({
    id: analysisId,
    capture_id: captureId,
    created_by: uploadedBy,
    status,
    progress: status === 'done' ? 1 : 0,
    stage: status,
    settings: JSON.stringify({ window: 'hann' }),
    result:
      status === 'done'
        ? JSON.stringify({
            settings: { window: 'hann', segment: 4096, overlap: 0.5, averages: 31 },
            whiteFloor: { valueHz2PerHz: 318.3, bandHz: [1e4, 1e5] },
            intrinsicLinewidthHz: intrinsic,
            betaLine: { observationTimeS: 0.01, crossingHz: 3e4, areaHz2: 1e8, linewidthHz: beta },
            lineshape: { fwhmHz: 25_000 },
            noiseModel: { whiteHz2PerHz: 318.3, flickerHz2: 3e7, randomWalkHz3: null, cornerHz: 94_250 },
            spurs: [],
          })
        : null,
    display_series: status === 'done' ? JSON.stringify({ frequencyHz: [10, 100, 1000, 10000], frequencyNoiseHz2PerHz: [1e6, 1e5, 1e4, 318.3] }) : null,
    intrinsic_linewidth_hz: status === 'done' ? intrinsic : null,
    beta_linewidth_hz: status === 'done' ? beta : null,
    lineshape_fwhm_hz: status === 'done' ? 25_000 : null,
    white_floor_hz2_per_hz: status === 'done' ? 318.3 : null,
    finished_at: status === 'done' ? (o.finishedAt ?? new Date(Date.UTC(2026, 10, 2, 0, 0, seq))) : null,
    created_at: new Date(Date.UTC(2026, 10, 1, 0, 0, seq)),
  });
  return { captureId, analysisId };
}
