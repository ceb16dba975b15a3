/**
 * password_resets: a "forgot password" link. Only the SHA-256 (hex) of the 32-byte token is stored;
 * single use (`used_at`, set by a conditional update); valid for one hour. Goes with the account.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('password_resets', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('user_id', ID).notNullable();
    t.specificType('token_hash', 'char(64) character set ascii collate ascii_bin').notNullable().unique('password_resets_token_unique');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.datetime('expires_at', { precision: 3 }).notNullable();
    t.datetime('used_at', { precision: 3 }).nullable();
    t.index(['user_id'], 'password_resets_user_idx');
    t.foreign('user_id', 'password_resets_user_fk').references('users.id').onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('password_resets');
}
