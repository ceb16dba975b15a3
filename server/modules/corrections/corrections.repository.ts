/** Data access for corrections (Knex only). Id lookups join the caller's membership through analysis and capture. */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';

export interface CorrectionRow {
  id: string;
  analysis_id: string;
  created_by: string | null;
  type: 'reference' | 'delay-interferometer';
  params: string | Record<string, string | number>;
  intrinsic_linewidth_hz: number | null;
  beta_linewidth_hz: number | null;
  white_floor_hz2_per_hz: number | null;
  /** JSON text as read: the rest of the Correction */
  body: string | Record<string, unknown>;
  created_at: Date;
}

export async function insertCorrection(db: Knex, row: CorrectionRow): Promise<void> {
  await db('corrections').insert({ ...row, params: JSON.stringify(row.params), body: JSON.stringify(row.body) });
}

export function listCorrections(db: Knex, analysisId: string): Promise<CorrectionRow[]> {
  return db('corrections').where({ analysis_id: analysisId }).orderBy([
    { column: 'created_at', order: 'desc' },
    { column: 'id', order: 'asc' },
  ]);
}

export function findCorrectionForUser(db: Knex, id: string, userId: string): Promise<(CorrectionRow & { bench_id: string; role: BenchRole | null }) | undefined> {
  return db('corrections as k')
    .join('analyses as a', 'a.id', 'k.analysis_id')
    .join('captures as c', 'c.id', 'a.capture_id')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 'c.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .select('k.*', 'c.bench_id', 'm.role as role')
    .where('k.id', id)
    .first();
}

export function deleteCorrection(db: Knex, id: string): Promise<number> {
  return db('corrections').where({ id }).delete();
}
