/** Data access for the Allan deviation of analyses (Knex only). Id lookups join the caller's membership. */
import type { Knex } from 'knex';
import type { AnalysisStatus } from '../../contracts/analyses';
import type { BenchRole } from '../../contracts/benches';
import type { ByteOrder, CaptureFormat, CaptureKind, RawDtype } from '../../contracts/captures';

export interface AllanSourceRow {
  analysis_id: string;
  status: AnalysisStatus;
  bench_id: string;
  role: BenchRole | null;
  storage_key: string;
  size_bytes: number | string;
  format: CaptureFormat;
  kind: CaptureKind;
  sample_rate_hz: number | null;
  dtype: RawDtype | null;
  channels: number | null;
  byte_order: ByteOrder | null;
  frequency_thz: number | null;
}

/** The analysis, its capture's reading facts, its laser's optical frequency and the caller's role. */
export function findAllanSource(db: Knex, analysisId: string, userId: string): Promise<AllanSourceRow | undefined> {
  return db('analyses as a')
    .join('captures as c', 'c.id', 'a.capture_id')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 'c.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .leftJoin('lasers as l', 'l.id', 'c.laser_id')
    .select(
      'a.id as analysis_id',
      'a.status',
      'c.bench_id',
      'm.role as role',
      'c.storage_key',
      'c.size_bytes',
      'c.format',
      'c.kind',
      'c.sample_rate_hz',
      'c.dtype',
      'c.channels',
      'c.byte_order',
      'l.frequency_thz',
    )
    .where('a.id', analysisId)
    .first();
}

export async function findAllan(db: Knex, analysisId: string): Promise<string | Record<string, unknown> | undefined> {
  const row = await db('analysis_allan').select('body').where({ analysis_id: analysisId }).first();
  return row?.body;
}

/** Keeps the first computation when two requests raced. */
export async function insertAllan(db: Knex, analysisId: string, basis: 'fractional' | 'hz', nu0Hz: number | null, body: unknown): Promise<void> {
  await db.raw('INSERT IGNORE INTO analysis_allan (analysis_id, basis, nu0_hz, body) VALUES (?, ?, ?, ?)', [analysisId, basis, nu0Hz, JSON.stringify(body)]);
}
