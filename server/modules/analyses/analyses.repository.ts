/** Data access for analyses as the routes see them (Knex only); the job runner's writes are in server/jobs/job-queue.ts. */
import type { Knex } from 'knex';
import type { AnalysisStatus } from '../../contracts/analyses';
import type { BenchRole } from '../../contracts/benches';

export interface AnalysisRow {
  id: string;
  capture_id: string;
  created_by: string | null;
  status: AnalysisStatus;
  progress: number;
  stage: string;
  settings: string | object;
  result: string | object | null;
  display_series: string | object | null;
  series_key: string | null;
  error: string | null;
  intrinsic_linewidth_hz: number | null;
  beta_linewidth_hz: number | null;
  lineshape_fwhm_hz: number | null;
  white_floor_hz2_per_hz: number | null;
  attempts: number;
  claimed_by: string | null;
  heartbeat_at: Date | null;
  started_at: Date | null;
  finished_at: Date | null;
  created_at: Date;
}

/** Columns of a summary (no result, no display series). */
export const SUMMARY_COLUMNS = [
  'id',
  'capture_id',
  'status',
  'progress',
  'stage',
  'settings',
  'error',
  'intrinsic_linewidth_hz',
  'beta_linewidth_hz',
  'lineshape_fwhm_hz',
  'white_floor_hz2_per_hz',
  'created_at',
  'started_at',
  'finished_at',
] as const;

export type AnalysisSummaryRow = Pick<AnalysisRow, (typeof SUMMARY_COLUMNS)[number]>;

export interface AnalysisAccessRow {
  bench_id: string;
  uploaded_by: string | null;
  role: BenchRole | null;
}

/**
 * One analysis with its capture's bench and the caller's role there (null: not a member).
 * `columns` picks what to read (the spectrum route needs only the series key).
 */
export async function findAnalysisForUser<C extends keyof AnalysisRow>(
  db: Knex,
  analysisId: string,
  userId: string,
  columns: readonly C[],
): Promise<(Pick<AnalysisRow, C> & AnalysisAccessRow) | undefined> {
  const row: unknown = await db('analyses as a')
    .join('captures as c', 'c.id', 'a.capture_id')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 'c.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .where('a.id', analysisId)
    .first([...columns.map((c) => `a.${c}`), 'c.bench_id', 'c.uploaded_by', 'm.role as role']);
  return row as (Pick<AnalysisRow, C> & AnalysisAccessRow) | undefined;
}

export async function listAnalysesOfCapture(db: Knex, captureId: string): Promise<AnalysisSummaryRow[]> {
  return db('analyses')
    .where({ capture_id: captureId })
    .orderBy([
      { column: 'created_at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .select(SUMMARY_COLUMNS);
}

export async function findAnalysisSummary(db: Knex, analysisId: string): Promise<AnalysisSummaryRow | undefined> {
  return db('analyses').where({ id: analysisId }).first(SUMMARY_COLUMNS);
}

export async function insertAnalysis(
  db: Knex,
  row: { id: string; capture_id: string; created_by: string | null; settings: object; created_at: Date },
): Promise<void> {
  await db('analyses').insert({
    ...row,
    status: 'queued',
    progress: 0,
    stage: 'queued',
    attempts: 0,
    settings: JSON.stringify(row.settings),
  });
}

/** A failed analysis back to the queue; false when it is not failed (any more). */
export async function requeueFailed(db: Knex, analysisId: string): Promise<boolean> {
  const n = await db('analyses').where({ id: analysisId, status: 'failed' }).update({
    status: 'queued',
    progress: 0,
    stage: 'queued',
    error: null,
    attempts: 0,
    claimed_by: null,
    heartbeat_at: null,
    started_at: null,
    finished_at: null,
  });
  return n > 0;
}

export interface LaserSpectrumRow {
  capture_id: string;
  analysis_id: string;
  file_name: string;
  created_at: Date;
  intrinsic_linewidth_hz: number | null;
  beta_linewidth_hz: number | null;
  lineshape_fwhm_hz: number | null;
  drive_current_ma: number | null;
  temperature_c: number | null;
  output_power_mw: number | null;
}

/** For each capture of the laser, its latest done analysis; oldest capture first. */
export async function listLaserSpectra(db: Knex, benchId: string, laserId: string): Promise<LaserSpectrumRow[]> {
  return db('captures as c')
    .joinRaw(
      `JOIN analyses a ON a.id = (SELECT a2.id FROM analyses a2 WHERE a2.capture_id = c.id AND a2.status = 'done'
         ORDER BY a2.finished_at DESC, a2.id DESC LIMIT 1)`,
    )
    .where('c.bench_id', benchId)
    .andWhere('c.laser_id', laserId)
    .orderBy([
      { column: 'c.created_at', order: 'asc' },
      { column: 'c.id', order: 'asc' },
    ])
    .select(
      'c.id as capture_id',
      'a.id as analysis_id',
      'c.file_name',
      'c.created_at',
      'a.intrinsic_linewidth_hz',
      'a.beta_linewidth_hz',
      'a.lineshape_fwhm_hz',
      'c.drive_current_ma',
      'c.temperature_c',
      'c.output_power_mw',
    );
}
