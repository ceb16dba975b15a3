/**
 * notification_settings: a person's e-mail notices (opt-in; no row = everything off).
 * `analysis_finished`: an e-mail when an analysis they started finishes (done or failed).
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('notification_settings', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('user_id', 'char(24) character set ascii collate ascii_bin').primary();
    t.boolean('analysis_finished').notNullable().defaultTo(false);
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.foreign('user_id', 'notification_settings_user_fk').references('users.id').onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('notification_settings');
}
