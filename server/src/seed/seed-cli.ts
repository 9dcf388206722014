import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import { loadConfig } from '../config/config.js';
import { databaseRole } from '../config/deployment-guards.js';
import { applyMigrations } from '../db/migrate.js';
import * as schema from '../db/schema/index.js';
import { seedDemo } from './seed-demo.js';

/**
 * `node server/dist/seed/seed-cli.js [--migrate-only]`: applies migrations, then seeds the demo,
 * both as the owner (MIGRATION_DATABASE_URL, else DATABASE_URL); the application role of
 * DATABASE_URL is granted its rights.
 */
async function main(): Promise<void> {
  const config = loadConfig();
  const owner = config.MIGRATION_DATABASE_URL;
  const pool = new pg.Pool({ connectionString: owner ?? config.DATABASE_URL, max: 2 });
  try {
    await applyMigrations(pool, config.MIGRATIONS_DIR, owner ? databaseRole(config.DATABASE_URL) || undefined : undefined);
    if (process.argv.includes('--migrate-only')) return;
    const result = await seedDemo(drizzle(pool, { schema }));
    console.log(`demo data ready (${result.users} sign-ins)`);
  } finally {
    await pool.end();
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : String(error));
  process.exit(1);
});
