/**
 * Runs `knex migrate:latest` (programmatically, so the TypeScript knexfile needs no extra loader).
 * usage: tsx scripts/migrate.ts [latest|rollback-all]
 */
import { loadEnv } from '../server/config/env';
import { createDb } from '../server/db/knex';

const action = process.argv[2] ?? 'latest';
const db = createDb(loadEnv());
try {
  if (action === 'latest') {
    const [batch, files] = await db.migrate.latest();
    console.error(`phaseloom: migrations: ${files.length ? `batch ${batch}, ${files.length} applied` : 'up to date'}`);
  } else if (action === 'rollback-all') {
    await db.migrate.rollback(undefined, true);
    console.error('phaseloom: migrations rolled back');
  } else {
    throw new Error(`unknown action '${action}' (latest or rollback-all)`);
  }
} catch (e) {
  console.error(`phaseloom: error: migration failed: ${(e as Error).message}`);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
