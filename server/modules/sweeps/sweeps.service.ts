/**
 * Sweeps: a laser's intrinsic and β-line linewidths (latest done analysis of each capture) against
 * one operating parameter of its captures. For output power each linewidth gets the fit
 * Δν = a/P + Δν₀ by least squares in 1/P (analysis/laser/power-sweep.ts, Phaseloom METHODS 6.3) once
 * at least 3 points have it; otherwise the reply says why there is no fit.
 */
import type { Knex } from 'knex';
import { fitLinewidthPowerSweep } from '../../../analysis/laser/power-sweep';
import { isAnalysisInputError } from '../../../analysis/errors';
import {
  SWEEP_PARAMETERS,
  type SweepFitOutcome,
  type SweepParameter,
  type SweepPoint,
  type SweepResponse,
} from '../../contracts/sweeps';
import { listLaserSpectra, type LaserSpectrumRow } from '../analyses/analyses.repository';
import type { BenchAccess } from '../benches/bench-policy';
import { assertCaptureAction } from '../captures/capture-policy';
import type { LasersService } from '../lasers/lasers.service';

const COLUMN: Record<SweepParameter, keyof LaserSpectrumRow> = {
  driveCurrentMa: 'drive_current_ma',
  outputPowerMw: 'output_power_mw',
  temperatureC: 'temperature_c',
};

export const MIN_FIT_POINTS = 3;

/** The 1/P fit of one linewidth series over the sweep's points, or why there is none. */
export function powerFit(points: readonly SweepPoint[], pick: (p: SweepPoint) => number | null): SweepFitOutcome {
  const usable = points.filter((p) => p.x > 0 && pick(p) !== null);
  if (usable.length < MIN_FIT_POINTS) {
    return {
      fit: null,
      reason: `the 1/P fit needs at least ${MIN_FIT_POINTS} captures with a positive output power and this linewidth; there ${usable.length === 1 ? 'is' : 'are'} ${usable.length}`,
    };
  }
  try {
    const f = fitLinewidthPowerSweep({ powersMw: usable.map((p) => p.x), linewidthsHz: usable.map((p) => pick(p) as number) });
    return {
      fit: {
        slopeHzW: f.slopeHzW,
        slopeUncertaintyHzW: f.slopeUncertaintyHzW,
        floorHz: f.floorHz,
        floorUncertaintyHz: f.floorUncertaintyHz,
        r2: f.r2,
        points: f.points,
        warnings: f.warnings,
      },
      reason: null,
    };
  } catch (e) {
    if (isAnalysisInputError(e)) return { fit: null, reason: e.message };
    throw e;
  }
}

/** The sweep from a laser's spectrum rows (pure: the tests call it with made-up rows too). */
export function sweepOf(laser: { id: string; name: string }, rows: readonly LaserSpectrumRow[], parameter: SweepParameter): SweepResponse {
  const column = COLUMN[parameter];
  const points: SweepPoint[] = [];
  let withoutParameter = 0;
  for (const r of rows) {
    const x = r[column];
    if (typeof x !== 'number' || !Number.isFinite(x)) {
      withoutParameter++;
      continue;
    }
    points.push({
      captureId: r.capture_id,
      analysisId: r.analysis_id,
      fileName: r.file_name,
      createdAt: new Date(r.created_at).toISOString(),
      x,
      intrinsicLinewidthHz: r.intrinsic_linewidth_hz,
      betaLinewidthHz: r.beta_linewidth_hz,
    });
  }
  points.sort((a, b) => a.x - b.x || a.createdAt.localeCompare(b.createdAt));
  const notPower: SweepFitOutcome = { fit: null, reason: 'only output-power sweeps are fitted (Δν = a/P + Δν₀)' };
  const fits =
    parameter === 'outputPowerMw'
      ? { intrinsic: powerFit(points, (p) => p.intrinsicLinewidthHz), beta: powerFit(points, (p) => p.betaLinewidthHz) }
      : { intrinsic: notPower, beta: notPower };
  return { laser, parameter, unit: SWEEP_PARAMETERS[parameter].unit, points, withoutParameter, fits };
}

export function createSweepsService(deps: { db: Knex; lasers: LasersService }) {
  return {
    async sweep(access: BenchAccess, laserId: string, parameter: SweepParameter): Promise<SweepResponse> {
      assertCaptureAction(access, 'captures.read');
      const laser = await deps.lasers.get(access, laserId);
      const rows = await listLaserSpectra(deps.db, access.benchId, laser.id);
      return sweepOf({ id: laser.id, name: laser.name }, rows, parameter);
    },
  };
}

export type SweepsService = ReturnType<typeof createSweepsService>;
