/**
 * sessions: sign-in sessions (lucia). A session belongs to a user and goes with it.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', 'varchar(64) character set ascii collate ascii_bin').primary();
    t.specificType('user_id', 'char(24) character set ascii collate ascii_bin').notNullable();
    t.datetime('expires_at', { precision: 3 }).notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.foreign('user_id', 'sessions_user_fk').references('users.id').onDelete('CASCADE');
    t.index(['user_id'], 'sessions_user_idx');
    t.index(['expires_at'], 'sessions_expires_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
