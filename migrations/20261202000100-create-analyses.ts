/**
 * analyses: one analysis of a capture with stated settings — and the durable job queue. A runner
 * claims a 'queued' row with SELECT … FOR UPDATE SKIP LOCKED, sets 'running', `claimed_by` and a
 * heartbeat, writes progress and stage while it works, and ends 'done' (figures in columns, the CLI's
 * JSON without the series in `result`, a log-binned `display_series`, the full series as a file in
 * storage under `series_key`) or 'failed' (`error`). Rows left 'running' with a stale heartbeat go
 * back to 'queued'. An analysis goes with its capture.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('analyses', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('capture_id', ID).notNullable();
    t.specificType('created_by', ID).nullable();
    t.enu('status', ['queued', 'running', 'done', 'failed']).notNullable().defaultTo('queued');
    t.double('progress').notNullable().defaultTo(0);
    t.string('stage', 64).notNullable().defaultTo('queued');
    t.json('settings').notNullable();
    t.json('result').nullable();
    t.json('display_series').nullable();
    t.specificType('series_key', 'varchar(255) character set ascii collate ascii_bin').nullable();
    t.text('error').nullable();
    t.double('intrinsic_linewidth_hz').nullable();
    t.double('beta_linewidth_hz').nullable();
    t.double('lineshape_fwhm_hz').nullable();
    t.double('white_floor_hz2_per_hz').nullable();
    t.integer('attempts').unsigned().notNullable().defaultTo(0);
    t.string('claimed_by', 64).nullable();
    t.datetime('heartbeat_at', { precision: 3 }).nullable();
    t.datetime('started_at', { precision: 3 }).nullable();
    t.datetime('finished_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['status', 'created_at'], 'analyses_status_created_idx');
    t.index(['capture_id'], 'analyses_capture_idx');
    t.foreign('capture_id', 'analyses_capture_fk').references('captures.id').onDelete('CASCADE');
    t.foreign('created_by', 'analyses_created_by_fk').references('users.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('analyses');
}
