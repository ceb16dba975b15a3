/**
 * captures: one uploaded time-series file on a bench, with how it was taken (kind, sample rate,
 * setup, operating point). The file itself lives in storage under `storage_key` (made by the server,
 * never from user input). The same sha256 on the same bench is flagged by `duplicate_of` (the earlier
 * capture) but still stored. A capture goes with its bench; its laser may be deleted (set null).
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('captures', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('bench_id', ID).notNullable();
    t.specificType('laser_id', ID).nullable();
    t.specificType('uploaded_by', ID).nullable();
    t.string('file_name', 255).notNullable();
    t.specificType('storage_key', 'varchar(255) character set ascii collate ascii_bin').notNullable();
    t.bigInteger('size_bytes').unsigned().notNullable();
    t.specificType('sha256', 'char(64) character set ascii collate ascii_bin').notNullable();
    t.enu('format', ['csv', 'npy', 'wav', 'raw']).notNullable();
    t.enu('kind', ['phase', 'iq', 'beat', 'frequency']).notNullable();
    t.double('sample_rate_hz').nullable();
    t.string('dtype', 16).nullable();
    t.tinyint('channels').unsigned().nullable();
    t.string('byte_order', 8).nullable();
    t.enu('setup', ['heterodyne', 'self-heterodyne', 'coherent-receiver', 'other']).nullable();
    t.json('setup_params').nullable();
    t.double('drive_current_ma').nullable();
    t.double('temperature_c').nullable();
    t.double('output_power_mw').nullable();
    t.text('notes').nullable();
    t.json('tags').nullable();
    t.specificType('duplicate_of', ID).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['bench_id', 'created_at'], 'captures_bench_created_idx');
    t.index(['bench_id', 'sha256'], 'captures_bench_sha256_idx');
    t.index(['laser_id'], 'captures_laser_idx');
    t.unique(['storage_key'], { indexName: 'captures_storage_key_unique' });
    t.foreign('bench_id', 'captures_bench_fk').references('benches.id').onDelete('CASCADE');
    t.foreign('laser_id', 'captures_laser_fk').references('lasers.id').onDelete('SET NULL');
    t.foreign('uploaded_by', 'captures_uploaded_by_fk').references('users.id').onDelete('SET NULL');
    t.foreign('duplicate_of', 'captures_duplicate_of_fk').references('captures.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('captures');
}
