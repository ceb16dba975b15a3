/**
 * comments: the discussion thread of a capture's spectrum (one thread per capture, shown on every
 * analysis of it, like its marks). A comment goes with its capture; its author may be deleted (set null).
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('comments', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('capture_id', ID).notNullable();
    t.specificType('author_id', ID).nullable();
    t.text('text').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['capture_id', 'created_at'], 'comments_capture_created_idx');
    t.foreign('capture_id', 'comments_capture_fk').references('captures.id').onDelete('CASCADE');
    t.foreign('author_id', 'comments_author_fk').references('users.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('comments');
}
