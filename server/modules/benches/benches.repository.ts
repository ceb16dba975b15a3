/** Data access for benches and bench_members (Knex only). Pass a transaction as `db` to join one. */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';

export interface BenchRow {
  id: string;
  name: string;
  description: string | null;
  created_at: Date;
  updated_at: Date;
}

export interface BenchWithRoleRow extends BenchRow {
  role: BenchRole;
}

export interface BenchSummaryRow extends BenchWithRoleRow {
  member_count: number | string;
  laser_count: number | string;
}

export async function insertBench(db: Knex, row: Omit<BenchRow, 'updated_at'>): Promise<void> {
  await db('benches').insert({ ...row, updated_at: row.created_at });
}

export async function insertMembership(
  db: Knex,
  row: { bench_id: string; user_id: string; role: BenchRole; joined_at: Date },
): Promise<void> {
  await db('bench_members').insert(row);
}

/** The caller's role on a bench, or undefined when they are not a member (or there is no bench). */
export async function findRole(db: Knex, benchId: string, userId: string): Promise<BenchRole | undefined> {
  const row = await db('bench_members').where({ bench_id: benchId, user_id: userId }).first('role');
  return row?.role as BenchRole | undefined;
}

export function findBenchForMember(db: Knex, benchId: string, userId: string): Promise<BenchWithRoleRow | undefined> {
  return db('benches')
    .join('bench_members', 'bench_members.bench_id', 'benches.id')
    .where({ 'benches.id': benchId, 'bench_members.user_id': userId })
    .first('benches.*', 'bench_members.role');
}

export function listBenchesForMember(db: Knex, userId: string): Promise<BenchSummaryRow[]> {
  return db('benches')
    .join('bench_members as me', 'me.bench_id', 'benches.id')
    .where('me.user_id', userId)
    .select(
      'benches.*',
      'me.role',
      db('bench_members as m').count('*').whereRaw('m.bench_id = benches.id').as('member_count'),
      db('lasers as l').count('*').whereRaw('l.bench_id = benches.id').as('laser_count'),
    )
    .orderBy([{ column: 'benches.name', order: 'asc' }, { column: 'benches.id', order: 'asc' }]);
}

export async function updateBench(
  db: Knex,
  benchId: string,
  patch: Partial<Pick<BenchRow, 'name' | 'description'>> & { updated_at: Date },
): Promise<void> {
  await db('benches').where({ id: benchId }).update(patch);
}

export async function deleteBench(db: Knex, benchId: string): Promise<void> {
  await db('benches').where({ id: benchId }).delete();
}
