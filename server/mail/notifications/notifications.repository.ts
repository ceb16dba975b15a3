/** Data access for notification_settings and what an "analysis finished" notice needs (Knex only). */
import type { Knex } from 'knex';

export async function findAnalysisFinishedSetting(db: Knex, userId: string): Promise<boolean> {
  const row = await db('notification_settings').where({ user_id: userId }).first<{ analysis_finished: number | boolean } | undefined>('analysis_finished');
  return Boolean(row?.analysis_finished);
}

export async function saveAnalysisFinishedSetting(db: Knex, userId: string, on: boolean): Promise<void> {
  await db('notification_settings')
    .insert({ user_id: userId, analysis_finished: on, updated_at: new Date() })
    .onConflict('user_id')
    .merge(['analysis_finished', 'updated_at']);
}

export interface FinishedAnalysisRow {
  analysis_id: string;
  status: string;
  error: string | null;
  created_by: string | null;
  file_name: string;
  bench_id: string;
  bench_name: string;
  email: string | null;
  analysis_finished: number | boolean | null;
}

/** The analysis with what the notice says, and whether its starter asked for notices. */
export function findFinishedAnalysis(db: Knex, analysisId: string): Promise<FinishedAnalysisRow | undefined> {
  return db('analyses as a')
    .join('captures as c', 'c.id', 'a.capture_id')
    .join('benches as b', 'b.id', 'c.bench_id')
    .leftJoin('users as u', 'u.id', 'a.created_by')
    .leftJoin('notification_settings as n', 'n.user_id', 'a.created_by')
    .where('a.id', analysisId)
    .first(
      'a.id as analysis_id',
      'a.status',
      'a.error',
      'a.created_by',
      'c.file_name',
      'b.id as bench_id',
      'b.name as bench_name',
      'u.email',
      'n.analysis_finished',
    );
}
