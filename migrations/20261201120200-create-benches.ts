/**
 * benches: a team's shared space. Who may do what is in bench_members.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('benches', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', 'char(24) character set ascii collate ascii_bin').primary();
    t.string('name', 120).notNullable();
    t.text('description').nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('benches');
}
