/** Data access for bench_members joined with users (Knex only). Pass a transaction as `db` to join one. */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';

export interface MemberRow {
  user_id: string;
  email: string;
  name: string;
  role: BenchRole;
  joined_at: Date;
}

function memberQuery(db: Knex, benchId: string) {
  return db('bench_members')
    .join('users', 'users.id', 'bench_members.user_id')
    .where('bench_members.bench_id', benchId)
    .select('bench_members.user_id', 'users.email', 'users.name', 'bench_members.role', 'bench_members.joined_at');
}

export function listMembers(db: Knex, benchId: string): Promise<MemberRow[]> {
  return memberQuery(db, benchId).orderBy([
    { column: 'bench_members.joined_at', order: 'asc' },
    { column: 'users.email', order: 'asc' },
  ]);
}

export async function findMember(db: Knex, benchId: string, userId: string): Promise<MemberRow | undefined> {
  const rows: MemberRow[] = await memberQuery(db, benchId).where('bench_members.user_id', userId);
  return rows[0];
}

/**
 * Locks the bench's owner rows and the target's row (SELECT … FOR UPDATE) inside a transaction, so
 * two concurrent demotions or departures cannot both pass the last-owner rule. Returns the user ids
 * of the owners.
 */
export async function lockOwnersAndMember(trx: Knex.Transaction, benchId: string, userId: string): Promise<string[]> {
  const rows: { user_id: string; role: BenchRole }[] = await trx('bench_members')
    .where({ bench_id: benchId })
    .andWhere((q) => q.where({ role: 'owner' }).orWhere({ user_id: userId }))
    .select('user_id', 'role')
    .forUpdate();
  return rows.filter((r) => r.role === 'owner').map((r) => r.user_id);
}

export async function insertMember(
  db: Knex,
  row: { bench_id: string; user_id: string; role: BenchRole; joined_at: Date },
): Promise<void> {
  await db('bench_members').insert(row);
}

export async function updateMemberRole(db: Knex, benchId: string, userId: string, role: BenchRole): Promise<void> {
  await db('bench_members').where({ bench_id: benchId, user_id: userId }).update({ role });
}

export async function deleteMember(db: Knex, benchId: string, userId: string): Promise<void> {
  await db('bench_members').where({ bench_id: benchId, user_id: userId }).delete();
}
