/** Data access for invitations (Knex only). Pass a transaction as `db` to join one. */
import type { Knex } from 'knex';
import type { BenchRole } from '../../contracts/benches';

export interface InvitationRow {
  id: string;
  bench_id: string;
  email: string;
  role: BenchRole;
  token_hash: string;
  invited_by: string | null;
  created_at: Date;
  expires_at: Date;
  accepted_at: Date | null;
  accepted_by: string | null;
}

export interface InvitationListRow extends InvitationRow {
  inviter_name: string | null;
  inviter_email: string | null;
}

export async function insertInvitation(db: Knex, row: InvitationRow): Promise<void> {
  await db('invitations').insert(row);
}

export function listInvitations(db: Knex, benchId: string): Promise<InvitationListRow[]> {
  return db('invitations as i')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .where('i.bench_id', benchId)
    .select('i.*', 'u.name as inviter_name', 'u.email as inviter_email')
    .orderBy([
      { column: 'i.created_at', order: 'desc' },
      { column: 'i.id', order: 'asc' },
    ])
    .limit(200);
}

export function findInvitationById(db: Knex, id: string): Promise<InvitationListRow | undefined> {
  return db('invitations as i')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .where('i.id', id)
    .first('i.*', 'u.name as inviter_name', 'u.email as inviter_email');
}

export interface InvitationByTokenRow extends InvitationListRow {
  bench_name: string;
}

/** The invitation with this token hash (with its bench's name); `forUpdate` locks the row. */
export function findInvitationByTokenHash(db: Knex, tokenHash: string, forUpdate = false): Promise<InvitationByTokenRow | undefined> {
  const q = db('invitations as i')
    .join('benches as b', 'b.id', 'i.bench_id')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .where('i.token_hash', tokenHash)
    .first('i.*', 'b.name as bench_name', 'u.name as inviter_name', 'u.email as inviter_email');
  return forUpdate ? q.forUpdate() : q;
}

/** Marks the invitation used; false when it was used already (single use under concurrency). */
export async function markInvitationAccepted(db: Knex, id: string, userId: string, at: Date): Promise<boolean> {
  const n = await db('invitations').where({ id }).whereNull('accepted_at').update({ accepted_at: at, accepted_by: userId });
  return n === 1;
}
