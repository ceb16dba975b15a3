/**
 * marks: a note pinned to a frequency or a band of a capture's spectrum ("50 Hz mains", "servo bump").
 * A mark belongs to the capture (its frequency axis), not to one analysis, so it survives re-analysis
 * and shows on every analysis of the capture. A mark at one frequency has `hi_hz` null; a band mark
 * has lo_hz < hi_hz. A mark goes with its capture; its author may be deleted (set null).
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('marks', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('capture_id', ID).notNullable();
    t.specificType('author_id', ID).nullable();
    t.enu('kind', ['spur', 'servo-bump', 'mains', 'relaxation-oscillation', 'other']).notNullable();
    t.string('text', 500).notNullable();
    t.double('lo_hz').notNullable();
    t.double('hi_hz').nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['capture_id', 'lo_hz'], 'marks_capture_lo_idx');
    t.foreign('capture_id', 'marks_capture_fk').references('captures.id').onDelete('CASCADE');
    t.foreign('author_id', 'marks_author_fk').references('users.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('marks');
}
