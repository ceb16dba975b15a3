/** Data access for rate-equation simulations (Knex only). */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';
import type { SimulationStatus } from '../../contracts/simulations';

export interface SimulationRow {
  id: string;
  bench_id: string;
  laser_id: string | null;
  created_by: string | null;
  name: string;
  status: SimulationStatus;
  progress: number;
  stage: string;
  parameters: string | object;
  duration_s: number;
  sample_rate_hz: number;
  seed: number | string;
  max_step_s: number | null;
  samples: number;
  prediction: string | object | null;
  capture_id: string | null;
  analysis_id: string | null;
  error: string | null;
  heartbeat_at: Date | null;
  finished_at: Date | null;
  created_at: Date;
}

/** A run with its synthetic capture's analysis (left join: null columns before it is stored). */
export interface SimulationRowWithAnalysis extends SimulationRow {
  a_status: 'queued' | 'running' | 'done' | 'failed' | null;
  a_progress: number | null;
  a_intrinsic_linewidth_hz: number | null;
}

const WITH_ANALYSIS = ['s.*', 'a.status as a_status', 'a.progress as a_progress', 'a.intrinsic_linewidth_hz as a_intrinsic_linewidth_hz'];

export async function insertSimulation(db: Knex, row: Omit<SimulationRow, 'parameters' | 'prediction'> & { parameters: object; prediction: object }): Promise<void> {
  await db('simulations').insert({ ...row, parameters: JSON.stringify(row.parameters), prediction: JSON.stringify(row.prediction) });
}

export async function updateSimulation(
  db: Knex,
  id: string,
  patch: Partial<Pick<SimulationRow, 'status' | 'progress' | 'stage' | 'capture_id' | 'analysis_id' | 'error' | 'heartbeat_at' | 'finished_at'>>,
): Promise<void> {
  await db('simulations').where({ id }).update(patch);
}

/** Heartbeats of runs this process still holds (queued or running). */
export async function beatSimulations(db: Knex, ids: string[], at: Date): Promise<void> {
  if (ids.length === 0) return;
  await db('simulations').whereIn('id', ids).whereIn('status', ['queued', 'running']).update({ heartbeat_at: at });
}

/** Runs whose heartbeat is older than `before` (their process died) are failed; returns how many. */
export async function failStaleSimulations(db: Knex, where: { id?: string; benchId?: string }, before: Date): Promise<number> {
  let q = db('simulations').whereIn('status', ['queued', 'running']).andWhere('heartbeat_at', '<', before);
  if (where.id) q = q.andWhere('id', where.id);
  if (where.benchId) q = q.andWhere('bench_id', where.benchId);
  return q.update({ status: 'failed', stage: 'failed', error: 'the run stopped (its server process ended); start it again', finished_at: new Date() });
}

export async function findSimulationForUser(db: Knex, id: string, userId: string): Promise<(SimulationRowWithAnalysis & { role: BenchRole | null }) | undefined> {
  return db('simulations as s')
    .leftJoin('analyses as a', 'a.id', 's.analysis_id')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 's.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .where('s.id', id)
    .first([...WITH_ANALYSIS, 'm.role as role']);
}

export async function findSimulation(db: Knex, id: string): Promise<SimulationRowWithAnalysis | undefined> {
  return db('simulations as s').leftJoin('analyses as a', 'a.id', 's.analysis_id').where('s.id', id).first(WITH_ANALYSIS);
}

export async function listSimulations(db: Knex, benchId: string, limit = 50): Promise<SimulationRowWithAnalysis[]> {
  return db('simulations as s')
    .leftJoin('analyses as a', 'a.id', 's.analysis_id')
    .where('s.bench_id', benchId)
    .orderBy([
      { column: 's.created_at', order: 'desc' },
      { column: 's.id', order: 'desc' },
    ])
    .limit(limit)
    .select(WITH_ANALYSIS);
}
