/**
 * One spectrum as overlays and shared pages show it: the analysis's figures, resolved settings and
 * display series with its capture's provenance and laser, read in one query; and the mapping to the
 * contract's parts (figures, settings, operating point, series).
 */
import type { Knex } from 'knex';
import type { AnalysisResult, AnalysisSettings } from '../../contracts/analyses';
import type { DisplaySeries, OperatingPoint, TraceFigures, TraceSettings } from '../../contracts/overlays';
import { parseJsonColumn } from '../analyses/analysis-mapping';

export interface TraceRow {
  analysis_id: string;
  status: string;
  settings: string | object;
  result: string | object | null;
  display_series: string | object | null;
  intrinsic_linewidth_hz: number | null;
  beta_linewidth_hz: number | null;
  lineshape_fwhm_hz: number | null;
  white_floor_hz2_per_hz: number | null;
  finished_at: Date | null;
  capture_id: string;
  bench_id: string;
  file_name: string;
  sha256: string;
  kind: string;
  format: string;
  sample_rate_hz: number | null;
  drive_current_ma: number | null;
  temperature_c: number | null;
  output_power_mw: number | null;
  captured_at: Date;
  laser_id: string | null;
  laser_name: string | null;
}

/** The rows of these analyses (any order; missing ids are simply absent). */
export async function findTraceRows(db: Knex, analysisIds: readonly string[]): Promise<TraceRow[]> {
  if (analysisIds.length === 0) return [];
  return db('analyses as a')
    .join('captures as c', 'c.id', 'a.capture_id')
    .leftJoin('lasers as l', 'l.id', 'c.laser_id')
    .whereIn('a.id', analysisIds)
    .select(
      'a.id as analysis_id',
      'a.status',
      'a.settings',
      'a.result',
      'a.display_series',
      'a.intrinsic_linewidth_hz',
      'a.beta_linewidth_hz',
      'a.lineshape_fwhm_hz',
      'a.white_floor_hz2_per_hz',
      'a.finished_at',
      'c.id as capture_id',
      'c.bench_id',
      'c.file_name',
      'c.sha256',
      'c.kind',
      'c.format',
      'c.sample_rate_hz',
      'c.drive_current_ma',
      'c.temperature_c',
      'c.output_power_mw',
      'c.created_at as captured_at',
      'c.laser_id',
      'l.name as laser_name',
    );
}

/** Ids among `analysisIds` that are done analyses of captures on `benchId`. */
export async function doneAnalysesOnBench(db: Knex, benchId: string, analysisIds: readonly string[]): Promise<Set<string>> {
  if (analysisIds.length === 0) return new Set();
  const rows: { id: string }[] = await db('analyses as a')
    .join('captures as c', 'c.id', 'a.capture_id')
    .where('c.bench_id', benchId)
    .andWhere('a.status', 'done')
    .whereIn('a.id', analysisIds)
    .select('a.id');
  return new Set(rows.map((r) => r.id));
}

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

export function traceFigures(row: TraceRow): TraceFigures {
  const result = parseJsonColumn<AnalysisResult>(row.result);
  return {
    intrinsicLinewidthHz: row.intrinsic_linewidth_hz,
    betaLinewidthHz: row.beta_linewidth_hz,
    lineshapeFwhmHz: row.lineshape_fwhm_hz,
    whiteFloorHz2PerHz: row.white_floor_hz2_per_hz,
    cornerHz: num(result?.noiseModel?.cornerHz),
  };
}

/** The engine's resolved settings (from its report) where it gave them, else what was asked. */
export function traceSettings(row: TraceRow): TraceSettings {
  const result = parseJsonColumn<AnalysisResult>(row.result);
  const asked = parseJsonColumn<AnalysisSettings>(row.settings) ?? {};
  const band = result?.whiteFloor?.bandHz ?? asked.floorBandHz ?? null;
  return {
    window: result?.settings?.window ?? asked.window ?? null,
    segment: num(result?.settings?.segment) ?? asked.segment ?? null,
    overlap: num(result?.settings?.overlap) ?? asked.overlap ?? null,
    averages: num(result?.settings?.averages),
    observationTimeS: num(result?.betaLine?.observationTimeS) ?? asked.observationTimeS ?? null,
    floorBandHz: band ? [band[0], band[1]] : null,
  };
}

export function operatingPoint(row: TraceRow): OperatingPoint {
  return { driveCurrentMa: row.drive_current_ma, temperatureC: row.temperature_c, outputPowerMw: row.output_power_mw };
}

export function traceSeries(row: TraceRow): DisplaySeries | null {
  const s = parseJsonColumn<Partial<DisplaySeries>>(row.display_series);
  if (!s || !Array.isArray(s.frequencyHz) || !Array.isArray(s.frequencyNoiseHz2PerHz)) return null;
  return { frequencyHz: s.frequencyHz, frequencyNoiseHz2PerHz: s.frequencyNoiseHz2PerHz };
}

export const iso = (d: Date | string | null): string | null => (d === null ? null : new Date(d).toISOString());
