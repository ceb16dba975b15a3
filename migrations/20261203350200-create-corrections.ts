/**
 * corrections: a measurement correction applied to an analysis's S_ν — a reference laser subtracted
 * (heterodyne against a reference of known noise: its analysis on the bench, or a linewidth) or an
 * unbalanced interferometer's transfer function divided out with the notches masked — and the figures
 * read again from the corrected spectrum. The analysis itself is left as it was. Goes with its analysis.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('corrections', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('analysis_id', ID).notNullable();
    t.specificType('created_by', ID).nullable();
    t.enu('type', ['reference', 'delay-interferometer']).notNullable();
    t.json('params').notNullable();
    t.double('intrinsic_linewidth_hz').nullable();
    t.double('beta_linewidth_hz').nullable();
    t.double('white_floor_hz2_per_hz').nullable();
    t.json('body').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['analysis_id', 'created_at'], 'corrections_analysis_created_idx');
    t.foreign('analysis_id', 'corrections_analysis_fk').references('analyses.id').onDelete('CASCADE');
    t.foreign('created_by', 'corrections_created_by_fk').references('users.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('corrections');
}
