/**
 * audit_events: the bench's audit trail — who did what, to what, when, on which bench. Rows are only
 * ever inserted by the app (no UPDATE or DELETE anywhere in server/). There are deliberately no
 * foreign keys: deleting a bench or an account must not cascade its history away, so a row keeps the
 * ids (and the actor's e-mail as it was) after the bench or the person is gone. `bench_id` is null
 * for events that belong to a person rather than a bench (sign-ins); the bench's page shows its
 * members' sign-ins from the time they joined.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

const ID = 'char(24) character set ascii collate ascii_bin';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_events', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', ID).primary();
    t.specificType('bench_id', ID).nullable();
    t.specificType('actor_id', ID).nullable();
    t.string('actor_email', 254).nullable();
    t.specificType('action', 'varchar(64) character set ascii collate ascii_bin').notNullable();
    t.specificType('target_type', 'varchar(32) character set ascii collate ascii_bin').nullable();
    t.specificType('target_id', 'varchar(64) character set ascii collate ascii_bin').nullable();
    t.json('details').nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.index(['bench_id', 'created_at'], 'audit_events_bench_created_idx');
    t.index(['actor_id', 'created_at'], 'audit_events_actor_created_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_events');
}
