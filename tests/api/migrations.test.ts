/**
 * Guard test for the schema: every migration's `down` really undoes its `up`. Runs latest → rollback
 * all → latest on a throwaway database (phaseloom_migrations_check), and checks that rollback leaves
 * no table behind and that the second latest builds the same schema as the first.
 */
import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadEnv } from '../../server/config/env';
import { knexConfig } from '../../server/db/knexfile';
import { migrationSource } from '../helpers/api-migrations';

const CHECK_DB = 'phaseloom_migrations_check';
const config = knexConfig(loadEnv());
let server: Knex;
let db: Knex;

beforeAll(async () => {
  server = knexFactory({ ...config, connection: { ...(config.connection as object), database: undefined }, pool: { min: 0, max: 1 } });
  await server.raw('DROP DATABASE IF EXISTS ??', [CHECK_DB]);
  await server.raw('CREATE DATABASE ?? CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci', [CHECK_DB]);
  db = knexFactory({ ...config, connection: { ...(config.connection as object), database: CHECK_DB } });
});

afterAll(async () => {
  await db?.destroy();
  await server?.raw('DROP DATABASE IF EXISTS ??', [CHECK_DB]);
  await server?.destroy();
});

async function tables(): Promise<string[]> {
  const [rows] = await db.raw('SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? ORDER BY table_name', [CHECK_DB]);
  return (rows as { t: string }[]).map((r) => r.t).filter((t) => !t.startsWith('knex_migrations'));
}

async function schema(): Promise<string[]> {
  const out: string[] = [];
  for (const t of await tables()) {
    const [rows] = await db.raw('SHOW CREATE TABLE ??', [t]);
    out.push((rows as Record<string, string>[])[0]['Create Table'].replace(/ AUTO_INCREMENT=\d+/, ''));
  }
  return out;
}

describe('migrations', () => {
  const migrations = { migrationSource: migrationSource() };

  it('latest → rollback all → latest gives the same schema, and rollback leaves no table', async () => {
    const [, applied] = await db.migrate.latest(migrations);
    expect(applied.length).toBeGreaterThanOrEqual(5);
    const first = await schema();
    expect(await tables()).toEqual(expect.arrayContaining(['bench_members', 'benches', 'lasers', 'sessions', 'users']));

    const [, rolledBack] = await db.migrate.rollback(migrations, true);
    expect(rolledBack).toHaveLength(applied.length);
    expect(await tables()).toEqual([]);

    await db.migrate.latest(migrations);
    expect(await schema()).toEqual(first);
  });

  it('every table is InnoDB with utf8mb4', async () => {
    const [rows] = await db.raw(
      'SELECT table_name AS t, engine AS e, table_collation AS c FROM information_schema.tables WHERE table_schema = ?',
      [CHECK_DB],
    );
    for (const r of rows as { t: string; e: string; c: string }[]) {
      expect([r.t, r.e]).toEqual([r.t, 'InnoDB']);
      expect(r.c).toMatch(/^utf8mb4_/);
    }
  });

  it('migration files are timestamped kebab-case TypeScript', async () => {
    const names = await migrationSource().getMigrations([]);
    for (const n of names) expect(n).toMatch(/^\d{14}-[a-z0-9]+(-[a-z0-9]+)*\.ts$/);
  });
});
