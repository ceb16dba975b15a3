/**
 * overlays: a saved comparison of several spectra (analyses) on one plot, named, on a bench.
 * Its traces are rows of overlay_traces in plot order (migration 20261203200100). An overlay goes
 * with its bench; its author may leave (set null).
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('overlays', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('bench_id', ID).notNullable();
    t.string('name', 120).notNullable();
    t.specificType('created_by', ID).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['bench_id', 'created_at'], 'overlays_bench_created_idx');
    t.foreign('bench_id', 'overlays_bench_fk').references('benches.id').onDelete('CASCADE');
    t.foreign('created_by', 'overlays_created_by_fk').references('users.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('overlays');
}
