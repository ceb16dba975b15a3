/**
 * rf_spectra: an RF beat spectrum uploaded to a bench (frequency, power) with the line-shape fits made
 * when it was received. The trace (linear power, mW) and the fitted curves are kept in `trace`; the
 * figures (fits, −20 dB width, self-heterodyne reading, warnings) in `result`; the best shape's FWHM in a
 * column for lists. A spectrum goes with its bench; its laser link is cleared when the laser is removed.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rf_spectra', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('bench_id', ID).notNullable();
    t.specificType('laser_id', ID).nullable();
    t.specificType('created_by', ID).nullable();
    t.string('name', 120).notNullable();
    t.string('file_name', 255).notNullable();
    t.enu('power_unit', ['dBm', 'mW', 'W']).notNullable();
    t.enu('mode', ['beat', 'self-heterodyne']).notNullable();
    t.double('delay_s').nullable();
    t.double('fiber_length_m').nullable();
    t.double('group_index').nullable();
    t.integer('points').unsigned().notNullable();
    t.double('resolution_bandwidth_hz').nullable();
    t.string('best_shape', 16).notNullable();
    t.double('best_fwhm_hz').notNullable();
    t.json('result').notNullable();
    t.json('trace').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['bench_id', 'created_at'], 'rf_spectra_bench_created_idx');
    t.foreign('bench_id', 'rf_spectra_bench_fk').references('benches.id').onDelete('CASCADE');
    t.foreign('laser_id', 'rf_spectra_laser_fk').references('lasers.id').onDelete('SET NULL');
    t.foreign('created_by', 'rf_spectra_created_by_fk').references('users.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rf_spectra');
}
