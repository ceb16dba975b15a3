/**
 * Knex configuration shared by the server, the migration script and the tests.
 * Migrations are TypeScript files in migrations/ (timestamped, kebab-case); seeds in migrations/seeds.
 */
import path from 'node:path';
import type { Knex } from 'knex';
import { loadEnv, projectRoot, type Env } from '../config/env';

export function knexConfig(env: Env = loadEnv()): Knex.Config {
  return {
    client: 'mysql2',
    connection: {
      host: env.PHASELOOM_DB_HOST,
      port: env.PHASELOOM_DB_PORT,
      user: env.PHASELOOM_DB_USER,
      password: env.dbPassword,
      database: env.PHASELOOM_DB_NAME,
      charset: 'utf8mb4',
      timezone: 'Z',
      dateStrings: false,
      supportBigNumbers: true,
      bigNumberStrings: false,
    },
    pool: { min: 0, max: 20 },
    migrations: {
      directory: path.join(projectRoot, 'migrations'),
      loadExtensions: ['.ts'],
      tableName: 'knex_migrations',
    },
  };
}

// A function, so that importing this file never reads the environment (the knex CLI calls it).
export default () => knexConfig();
