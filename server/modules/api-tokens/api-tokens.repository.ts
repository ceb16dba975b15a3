/** Data access for api_tokens (Knex only). */
import type { Knex } from 'knex';

export interface ApiTokenRow {
  id: string;
  user_id: string;
  name: string;
  prefix: string;
  secret_hash: string;
  created_at: Date;
  expires_at: Date | null;
  last_used_at: Date | null;
  revoked_at: Date | null;
}

export interface ApiTokenOwnerRow extends ApiTokenRow {
  email: string;
  user_name: string;
  user_created_at: Date;
}

export async function insertApiToken(db: Knex, row: Omit<ApiTokenRow, 'last_used_at' | 'revoked_at'>): Promise<void> {
  await db('api_tokens').insert(row);
}

/** The user's tokens that are not revoked, newest first. */
export function listActiveApiTokens(db: Knex, userId: string): Promise<ApiTokenRow[]> {
  return db<ApiTokenRow>('api_tokens')
    .where({ user_id: userId })
    .whereNull('revoked_at')
    .orderBy([
      { column: 'created_at', order: 'desc' },
      { column: 'id', order: 'asc' },
    ]);
}

/** The token with this secret hash, with its owner's account, or undefined. */
export function findApiTokenByHash(db: Knex, secretHash: string): Promise<ApiTokenOwnerRow | undefined> {
  return db('api_tokens')
    .join('users', 'users.id', 'api_tokens.user_id')
    .where('api_tokens.secret_hash', secretHash)
    .first(
      'api_tokens.*',
      'users.email as email',
      'users.name as user_name',
      'users.created_at as user_created_at',
    );
}

/** Marks the user's active token revoked; returns whether there was one. */
export async function revokeApiToken(db: Knex, userId: string, id: string, at: Date): Promise<boolean> {
  const changed = await db('api_tokens').where({ id, user_id: userId }).whereNull('revoked_at').update({ revoked_at: at });
  return changed > 0;
}

export async function touchApiToken(db: Knex, id: string, at: Date): Promise<void> {
  await db('api_tokens').where({ id }).update({ last_used_at: at });
}
