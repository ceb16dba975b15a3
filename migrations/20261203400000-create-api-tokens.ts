/**
 * api_tokens: personal API tokens. Only the sha256 of the secret is kept (`secret_hash`, unique: the
 * lookup key), with its first characters in clear (`prefix`) to tell tokens apart. Revoking sets
 * `revoked_at` (the row stays so a revoked token can be answered as such); a token goes with its user.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('api_tokens', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('user_id', ID).notNullable();
    t.string('name', 120).notNullable();
    t.specificType('prefix', 'varchar(16) character set ascii collate ascii_bin').notNullable();
    t.specificType('secret_hash', 'char(64) character set ascii collate ascii_bin').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.datetime('expires_at', { precision: 3 }).nullable();
    t.datetime('last_used_at', { precision: 3 }).nullable();
    t.datetime('revoked_at', { precision: 3 }).nullable();
    t.unique(['secret_hash'], { indexName: 'api_tokens_secret_hash_unique' });
    t.index(['user_id', 'created_at'], 'api_tokens_user_created_idx');
    t.foreign('user_id', 'api_tokens_user_fk').references('users.id').onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('api_tokens');
}
