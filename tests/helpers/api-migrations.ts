/**
 * A Knex migration source for tests. Knex imports migration files with Node's own import(), which
 * cannot read TypeScript inside vitest (scripts get it from tsx); this source lists migrations/ the
 * same way (same names, so knex_migrations rows match) and imports each file through vitest.
 */
import { readdirSync } from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { projectRoot } from '../../server/config/env';

type Migration = Knex.Migration;

export function migrationSource(directory = path.join(projectRoot, 'migrations')): Knex.MigrationSource<string> {
  return {
    async getMigrations() {
      return readdirSync(directory)
        .filter((f) => f.endsWith('.ts'))
        .sort();
    },
    getMigrationName(name) {
      return name;
    },
    async getMigration(name): Promise<Migration> {
      return (await import(path.join(directory, name))) as Migration;
    },
  };
}
