/** Data access for the users table (Knex only). Pass a transaction as `db` to join one. */
import type { Knex } from 'knex';

export interface UserRow {
  id: string;
  email: string;
  name: string;
  password_hash: string;
  created_at: Date;
  updated_at: Date;
}

export function findUserByEmail(db: Knex, email: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ email }).first();
}

export function findUserById(db: Knex, id: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ id }).first();
}

export async function insertUser(db: Knex, row: Omit<UserRow, 'updated_at'>): Promise<void> {
  await db<UserRow>('users').insert({ ...row, updated_at: row.created_at });
}
