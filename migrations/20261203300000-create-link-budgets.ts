/**
 * link_budgets: coherent-link phase-noise budgets saved on a bench — the request as given (`input`) and
 * the evaluation made when it was saved (`result`, with its table across symbol rates). A budget goes
 * with its bench; its author may leave (created_by set null).
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('link_budgets', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('bench_id', ID).notNullable();
    t.specificType('created_by', ID).nullable();
    t.string('name', 120).notNullable();
    t.json('input').notNullable();
    t.json('result').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['bench_id', 'created_at'], 'link_budgets_bench_created_idx');
    t.foreign('bench_id', 'link_budgets_bench_fk').references('benches.id').onDelete('CASCADE');
    t.foreign('created_by', 'link_budgets_created_by_fk').references('users.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('link_budgets');
}
