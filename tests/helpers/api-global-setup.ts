/**
 * Global setup of the vitest 'api' project: a fresh test database per run. Drops and creates
 * PHASELOOM_DB_NAME through the application user (it has ALL PRIVILEGES on the project-local
 * MariaDB) and migrates it to the latest schema. Refuses any database whose name does not end in
 * "_test", so a mistyped variable cannot wipe real data.
 */
import knexFactory from 'knex';
import { loadEnv } from '../../server/config/env';
import { knexConfig } from '../../server/db/knexfile';
import { migrationSource } from './api-migrations';

export default async function setup(): Promise<void> {
  const env = loadEnv();
  const name = env.PHASELOOM_DB_NAME;
  if (!name.endsWith('_test')) {
    throw new Error(
      `the API tests drop and recreate their database; PHASELOOM_DB_NAME must end in _test (got '${name}'). ` +
        'Run them with PHASELOOM_DB_PORT=3309 PHASELOOM_DB_DATADIR=.data/mariadb-test PHASELOOM_DB_NAME=phaseloom_test NODE_ENV=test',
    );
  }
  const config = knexConfig(env);
  const server = knexFactory({
    ...config,
    connection: { ...(config.connection as object), database: undefined },
    pool: { min: 0, max: 1 },
  });
  try {
    await server.raw('DROP DATABASE IF EXISTS ??', [name]);
    await server.raw('CREATE DATABASE ?? CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci', [name]);
  } catch (e) {
    throw new Error(
      `cannot reach the test MariaDB on ${env.PHASELOOM_DB_HOST}:${env.PHASELOOM_DB_PORT} (${(e as Error).message}); ` +
        'start it with PHASELOOM_DB_PORT=3309 PHASELOOM_DB_DATADIR=.data/mariadb-test PHASELOOM_DB_NAME=phaseloom_test npm run db:up',
      { cause: e },
    );
  } finally {
    await server.destroy();
  }
  const db = knexFactory(config);
  try {
    await db.migrate.latest({ migrationSource: migrationSource() });
  } finally {
    await db.destroy();
  }
}
