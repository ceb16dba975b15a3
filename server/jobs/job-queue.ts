/**
 * The analyses table as a durable job queue (Knex only). A row is claimed inside a transaction with
 * SELECT … FOR UPDATE SKIP LOCKED, so concurrent runners — in this process or on other machines
 * sharing the database — never take the same row; every later write names the claiming runner, so a
 * runner that lost its claim (its row was re-queued as stale) cannot overwrite the new owner's work.
 * Times come from the database (NOW(3)), so the clocks of different machines do not matter.
 */
import type { Knex } from 'knex';
import type { AnalysisFigures, CaptureInput, DisplaySeries, JobSettings } from './analysis-task';

export interface ClaimedJob {
  analysisId: string;
  captureId: string;
  attempts: number;
  captureKey: string;
  input: CaptureInput;
  settings: JobSettings;
}

interface ClaimRow {
  id: string;
  capture_id: string;
  attempts: number;
  settings: string | JobSettings;
  storage_key: string;
  kind: CaptureInput['kind'];
  format: CaptureInput['format'];
  sample_rate_hz: number | null;
  dtype: CaptureInput['dtype'];
  channels: number | null;
  byte_order: CaptureInput['byteOrder'];
  size_bytes: number | string;
  file_name: string;
}

const parseJson = <T>(v: string | T): T => (typeof v === 'string' ? (JSON.parse(v) as T) : v);

/** Claims the oldest queued analysis for `runnerId`, or returns null when none is free. */
export async function claimNextJob(db: Knex, runnerId: string): Promise<ClaimedJob | null> {
  return db.transaction(async (trx) => {
    const [rows] = (await trx.raw(
      `SELECT id FROM analyses WHERE status = 'queued' ORDER BY created_at, id LIMIT 1 FOR UPDATE SKIP LOCKED`,
    )) as [{ id: string }[]];
    const id = rows[0]?.id;
    if (!id) return null;
    await trx('analyses')
      .where({ id, status: 'queued' })
      .update({
        status: 'running',
        claimed_by: runnerId,
        attempts: trx.raw('attempts + 1'),
        progress: 0,
        stage: 'starting',
        error: null,
        started_at: trx.raw('NOW(3)'),
        heartbeat_at: trx.raw('NOW(3)'),
        finished_at: null,
      });
    const row = (await trx('analyses as a')
      .join('captures as c', 'c.id', 'a.capture_id')
      .where('a.id', id)
      .first(
        'a.id',
        'a.capture_id',
        'a.attempts',
        'a.settings',
        'c.storage_key',
        'c.kind',
        'c.format',
        'c.sample_rate_hz',
        'c.dtype',
        'c.channels',
        'c.byte_order',
        'c.size_bytes',
        'c.file_name',
      )) as ClaimRow;
    return {
      analysisId: row.id,
      captureId: row.capture_id,
      attempts: row.attempts,
      captureKey: row.storage_key,
      settings: parseJson<JobSettings>(row.settings),
      input: {
        kind: row.kind,
        format: row.format,
        sampleRateHz: row.sample_rate_hz,
        dtype: row.dtype,
        channels: row.channels === 1 || row.channels === 2 ? row.channels : null,
        byteOrder: row.byte_order,
        sizeBytes: Number(row.size_bytes),
        fileName: row.file_name,
      },
    };
  });
}

/** Writes progress and stage of a job this runner still holds; false when the claim was lost. */
export async function writeProgress(
  db: Knex,
  analysisId: string,
  runnerId: string,
  progress: number,
  stage: string,
): Promise<boolean> {
  const n = await db('analyses')
    .where({ id: analysisId, claimed_by: runnerId, status: 'running' })
    .update({ progress, stage: stage.slice(0, 64), heartbeat_at: db.raw('NOW(3)') });
  return n > 0;
}

/** Refreshes the heartbeat of every job this runner holds. */
export async function beat(db: Knex, runnerId: string, analysisIds: string[]): Promise<void> {
  if (analysisIds.length === 0) return;
  await db('analyses')
    .whereIn('id', analysisIds)
    .andWhere({ claimed_by: runnerId, status: 'running' })
    .update({ heartbeat_at: db.raw('NOW(3)') });
}

/**
 * Rows left 'running' whose heartbeat is older than `staleAfterMs` were held by a process that died:
 * back to 'queued' — or to 'failed' once they have been tried `maxAttempts` times, so that an input
 * that kills its process cannot loop forever. Returns how many rows were re-queued and failed.
 */
export async function recoverStaleJobs(
  db: Knex,
  staleAfterMs: number,
  maxAttempts: number,
): Promise<{ requeued: number; failed: number }> {
  const stale = (q: Knex.QueryBuilder) =>
    q
      .where('status', 'running')
      .andWhere((w) =>
        w
          .whereNull('heartbeat_at')
          .orWhereRaw('heartbeat_at < NOW(3) - INTERVAL ? MICROSECOND', [Math.round(staleAfterMs * 1000)]),
      );
  const failed = await stale(db('analyses'))
    .andWhere('attempts', '>=', maxAttempts)
    .update({
      status: 'failed',
      stage: 'failed',
      finished_at: db.raw('NOW(3)'),
      error: `the analysis was started ${maxAttempts} times and its process stopped each time before it finished`,
    });
  const requeued = await stale(db('analyses')).update({
    status: 'queued',
    stage: 'queued',
    progress: 0,
    claimed_by: null,
    heartbeat_at: null,
  });
  return { requeued, failed };
}

/** Puts this runner's unfinished jobs back in the queue (used when the runner stops). */
export async function releaseJobs(db: Knex, runnerId: string, analysisIds: string[]): Promise<void> {
  if (analysisIds.length === 0) return;
  await db('analyses')
    .whereIn('id', analysisIds)
    .andWhere({ claimed_by: runnerId, status: 'running' })
    .update({
      status: 'queued',
      stage: 'queued',
      progress: 0,
      claimed_by: null,
      heartbeat_at: null,
      attempts: db.raw('GREATEST(attempts, 1) - 1'),
    });
}

export async function completeJob(
  db: Knex,
  analysisId: string,
  runnerId: string,
  done: {
    result: Record<string, unknown>;
    figures: AnalysisFigures;
    displaySeries: DisplaySeries;
    seriesKey: string | null;
  },
): Promise<boolean> {
  const n = await db('analyses')
    .where({ id: analysisId, claimed_by: runnerId, status: 'running' })
    .update({
      status: 'done',
      progress: 1,
      stage: 'done',
      result: JSON.stringify(done.result),
      display_series: JSON.stringify(done.displaySeries),
      series_key: done.seriesKey,
      error: null,
      intrinsic_linewidth_hz: done.figures.intrinsicLinewidthHz,
      beta_linewidth_hz: done.figures.betaLinewidthHz,
      lineshape_fwhm_hz: done.figures.lineshapeFwhmHz,
      white_floor_hz2_per_hz: done.figures.whiteFloorHz2PerHz,
      heartbeat_at: null,
      finished_at: db.raw('NOW(3)'),
    });
  return n > 0;
}

export async function failJob(db: Knex, analysisId: string, runnerId: string, message: string): Promise<boolean> {
  const n = await db('analyses')
    .where({ id: analysisId, claimed_by: runnerId, status: 'running' })
    .update({
      status: 'failed',
      stage: 'failed',
      error: message.slice(0, 60_000),
      heartbeat_at: null,
      finished_at: db.raw('NOW(3)'),
    });
  return n > 0;
}
