/** Data access for RF beat spectra (Knex only). Bench lists are filtered by bench id; id lookups join the caller's membership. */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';
import type { RfLineShape, RfMode, RfPowerUnit, RfSpectrumResult, RfTrace } from '../../contracts/rf-spectra';

export interface RfSpectrumRow {
  id: string;
  bench_id: string;
  laser_id: string | null;
  created_by: string | null;
  name: string;
  file_name: string;
  power_unit: RfPowerUnit;
  mode: RfMode;
  delay_s: number | null;
  fiber_length_m: number | null;
  group_index: number | null;
  points: number;
  resolution_bandwidth_hz: number | null;
  best_shape: RfLineShape;
  best_fwhm_hz: number;
  /** JSON text as read; an object when written */
  result: string | RfSpectrumResult;
  trace: string | RfTrace;
  created_at: Date;
}

export type RfSpectrumSummaryRow = Omit<RfSpectrumRow, 'result' | 'trace'>;

export const SUMMARY_COLUMNS = [
  'id',
  'bench_id',
  'laser_id',
  'created_by',
  'name',
  'file_name',
  'power_unit',
  'mode',
  'delay_s',
  'fiber_length_m',
  'group_index',
  'points',
  'resolution_bandwidth_hz',
  'best_shape',
  'best_fwhm_hz',
  'created_at',
] as const;

export async function insertRfSpectrum(db: Knex, row: RfSpectrumRow): Promise<void> {
  await db('rf_spectra').insert({ ...row, result: JSON.stringify(row.result), trace: JSON.stringify(row.trace) });
}

export function listRfSpectra(db: Knex, benchId: string): Promise<RfSpectrumSummaryRow[]> {
  return db('rf_spectra')
    .select(SUMMARY_COLUMNS.map((c) => `rf_spectra.${c}`))
    .where({ bench_id: benchId })
    .orderBy([
      { column: 'created_at', order: 'desc' },
      { column: 'id', order: 'asc' },
    ]);
}

/** The row with the caller's role on its bench (role null when not a member). */
export function findRfSpectrumForUser(
  db: Knex,
  id: string,
  userId: string,
  withData: boolean,
): Promise<(RfSpectrumRow & { role: BenchRole | null }) | undefined> {
  const columns = [...SUMMARY_COLUMNS, ...(withData ? (['result', 'trace'] as const) : [])].map((c) => `s.${c}`);
  return db('rf_spectra as s')
    .leftJoin('bench_members as m', function () {
      this.on('m.bench_id', '=', 's.bench_id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .select([...columns, 'm.role as role'])
    .where('s.id', id)
    .first();
}

export function deleteRfSpectrum(db: Knex, id: string): Promise<number> {
  return db('rf_spectra').where({ id }).delete();
}
