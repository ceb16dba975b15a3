/**
 * invitations: an owner's invitation of an e-mail address to a bench with a role. The link's token
 * (32 random bytes) is never stored — only its SHA-256 (hex). Single use: `accepted_at` is set once,
 * by a conditional update; valid until `expires_at` (7 days). Goes with its bench.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invitations', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('bench_id', ID).notNullable();
    t.string('email', 254).notNullable();
    t.enu('role', ['owner', 'analyst', 'viewer']).notNullable();
    t.specificType('token_hash', 'char(64) character set ascii collate ascii_bin').notNullable().unique('invitations_token_unique');
    t.specificType('invited_by', ID).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.datetime('expires_at', { precision: 3 }).notNullable();
    t.datetime('accepted_at', { precision: 3 }).nullable();
    t.specificType('accepted_by', ID).nullable();
    t.index(['bench_id', 'created_at'], 'invitations_bench_idx');
    t.foreign('bench_id', 'invitations_bench_fk').references('benches.id').onDelete('CASCADE');
    t.foreign('invited_by', 'invitations_invited_by_fk').references('users.id').onDelete('SET NULL');
    t.foreign('accepted_by', 'invitations_accepted_by_fk').references('users.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invitations');
}
