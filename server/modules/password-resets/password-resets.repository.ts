/** Data access for password_resets (and the password column of users). Pass a transaction as `db`. */
import type { Knex } from 'knex';

export interface PasswordResetRow {
  id: string;
  user_id: string;
  token_hash: string;
  created_at: Date;
  expires_at: Date;
  used_at: Date | null;
}

export async function insertPasswordReset(db: Knex, row: PasswordResetRow): Promise<void> {
  await db('password_resets').insert(row);
}

export function findPasswordResetByTokenHash(
  db: Knex,
  tokenHash: string,
  forUpdate = false,
): Promise<(PasswordResetRow & { email: string }) | undefined> {
  const q = db('password_resets as r')
    .join('users as u', 'u.id', 'r.user_id')
    .where('r.token_hash', tokenHash)
    .first('r.*', 'u.email');
  return forUpdate ? q.forUpdate() : q;
}

/** Marks the link used; false when it was used already. */
export async function markPasswordResetUsed(db: Knex, id: string, at: Date): Promise<boolean> {
  return (await db('password_resets').where({ id }).whereNull('used_at').update({ used_at: at })) === 1;
}

/** Every other open link of the account stops working once one is used. */
export async function retireOtherPasswordResets(db: Knex, userId: string, at: Date): Promise<void> {
  await db('password_resets').where({ user_id: userId }).whereNull('used_at').update({ used_at: at });
}

export async function setPasswordHash(db: Knex, userId: string, passwordHash: string, at: Date): Promise<void> {
  await db('users').where({ id: userId }).update({ password_hash: passwordHash, updated_at: at });
}

/** Ends the account's sessions except `keepSessionId`. */
export async function deleteOtherSessions(db: Knex, userId: string, keepSessionId: string | null): Promise<void> {
  const q = db('sessions').where({ user_id: userId });
  if (keepSessionId) q.whereNot({ id: keepSessionId });
  await q.delete();
}
