/**
 * analysis_allan: the Allan deviation of an analysis's capture, computed once from the stored file on
 * first request and kept (points with intervals, the slope regions, the basis: fractional with the
 * laser's ν0, or Hz without one). Goes with its analysis.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('analysis_allan', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('analysis_id', ID).primary();
    t.enu('basis', ['fractional', 'hz']).notNullable();
    t.double('nu0_hz').nullable();
    t.json('body').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.foreign('analysis_id', 'analysis_allan_analysis_fk').references('analyses.id').onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('analysis_allan');
}
