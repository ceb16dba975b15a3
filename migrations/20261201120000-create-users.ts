/**
 * users: one row per account. Ids are random 24-character strings made by the app (ascii_bin, so
 * lookups are exact); e-mails are stored lower-cased and unique; password_hash is an argon2id PHC string.
 */
import type { Knex } from 'knex';

// MariaDB commits DDL implicitly, so a transaction would protect nothing: each file holds one change.
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.engine('InnoDB');
    t.charset('utf8mb4');
    t.collate('utf8mb4_unicode_ci');
    t.specificType('id', 'char(24) character set ascii collate ascii_bin').primary();
    t.string('email', 254).notNullable().unique('users_email_unique');
    t.string('name', 120).notNullable();
    t.string('password_hash', 255).notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users');
}
