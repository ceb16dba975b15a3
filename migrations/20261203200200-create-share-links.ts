/**
 * share_links: a read-only link to one analysis or one overlay. The token (32 random bytes,
 * base64url) is shown once; only its sha256 is kept (`token_hash`, hex). A link may expire
 * (`expires_at`) and is revoked by setting `revoked_at` (the row stays, so the link answers 410).
 * Exactly one of analysis_id / overlay_id is set; a link goes with its bench and its target.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('share_links', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('bench_id', ID).notNullable();
    t.specificType('token_hash', 'char(64) character set ascii collate ascii_bin').notNullable();
    t.specificType('analysis_id', ID).nullable();
    t.specificType('overlay_id', ID).nullable();
    t.specificType('created_by', ID).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.datetime('expires_at', { precision: 3 }).nullable();
    t.datetime('revoked_at', { precision: 3 }).nullable();
    t.specificType('revoked_by', ID).nullable();
    t.unique(['token_hash'], { indexName: 'share_links_token_hash_unique' });
    t.index(['bench_id', 'created_at'], 'share_links_bench_created_idx');
    t.foreign('bench_id', 'share_links_bench_fk').references('benches.id').onDelete('CASCADE');
    t.foreign('analysis_id', 'share_links_analysis_fk').references('analyses.id').onDelete('CASCADE');
    t.foreign('overlay_id', 'share_links_overlay_fk').references('overlays.id').onDelete('CASCADE');
    t.foreign('created_by', 'share_links_created_by_fk').references('users.id').onDelete('SET NULL');
    t.foreign('revoked_by', 'share_links_revoked_by_fk').references('users.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('share_links');
}
