/**
 * simulations: rate-equation runs that write a synthetic IQ capture onto a bench. A run is 'queued',
 * 'running' (progress and a heartbeat written while the worker thread integrates), then 'done' with the
 * capture and its first analysis, or 'failed' with why. A run whose heartbeat stops (its process died) is
 * reported failed when next read. The run goes with its bench; its capture may be deleted (ids set null).
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('simulations', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('bench_id', ID).notNullable();
    t.specificType('laser_id', ID).nullable();
    t.specificType('created_by', ID).nullable();
    t.string('name', 120).notNullable();
    t.enu('status', ['queued', 'running', 'done', 'failed']).notNullable().defaultTo('queued');
    t.double('progress').notNullable().defaultTo(0);
    t.string('stage', 64).notNullable().defaultTo('queued');
    t.json('parameters').notNullable();
    t.double('duration_s').notNullable();
    t.double('sample_rate_hz').notNullable();
    t.bigInteger('seed').notNullable();
    t.double('max_step_s').nullable();
    t.integer('samples').unsigned().notNullable();
    t.json('prediction').nullable();
    t.specificType('capture_id', ID).nullable();
    t.specificType('analysis_id', ID).nullable();
    t.text('error').nullable();
    t.datetime('heartbeat_at', { precision: 3 }).nullable();
    t.datetime('finished_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['bench_id', 'created_at'], 'simulations_bench_created_idx');
    t.foreign('bench_id', 'simulations_bench_fk').references('benches.id').onDelete('CASCADE');
    t.foreign('laser_id', 'simulations_laser_fk').references('lasers.id').onDelete('SET NULL');
    t.foreign('created_by', 'simulations_created_by_fk').references('users.id').onDelete('SET NULL');
    t.foreign('capture_id', 'simulations_capture_fk').references('captures.id').onDelete('SET NULL');
    t.foreign('analysis_id', 'simulations_analysis_fk').references('analyses.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('simulations');
}
