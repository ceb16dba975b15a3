/**
 * lasers: devices under test on a bench. Nominal wavelength and optical frequency are stored together
 * (the app derives one from the other); names are unique per bench (case-insensitive collation).
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('lasers', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', 'char(24) character set ascii collate ascii_bin').primary();
    t.specificType('bench_id', 'char(24) character set ascii collate ascii_bin').notNullable();
    t.string('name', 120).notNullable();
    t.enu('type', ['dfb', 'dbr', 'external-cavity', 'fibre', 'vcsel', 'other']).notNullable();
    t.double('wavelength_nm').nullable();
    t.double('frequency_thz').nullable();
    t.text('notes').nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.unique(['bench_id', 'name'], { indexName: 'lasers_bench_name_unique' });
    t.foreign('bench_id', 'lasers_bench_fk').references('benches.id').onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('lasers');
}
