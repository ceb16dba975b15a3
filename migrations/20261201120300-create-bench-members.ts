/**
 * bench_members: a person's role on a bench (owner, analyst, viewer). Goes with the bench or the user.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('bench_members', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('bench_id', 'char(24) character set ascii collate ascii_bin').notNullable();
    t.specificType('user_id', 'char(24) character set ascii collate ascii_bin').notNullable();
    t.enu('role', ['owner', 'analyst', 'viewer']).notNullable();
    t.datetime('joined_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.primary(['bench_id', 'user_id']);
    t.index(['user_id'], 'bench_members_user_idx');
    t.foreign('bench_id', 'bench_members_bench_fk').references('benches.id').onDelete('CASCADE');
    t.foreign('user_id', 'bench_members_user_fk').references('users.id').onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('bench_members');
}
