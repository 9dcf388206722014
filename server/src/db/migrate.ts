import { existsSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import type pg from 'pg';
import { upsertBuiltinCatalogue } from '../catalogue/catalogue-builtins.js';
import { ensureJobSchema } from '../mail/queue/job-schema.js';

/** Arbitrary constant: serialises migrations when several replicas start at once. */
const MIGRATION_LOCK_KEY = 7_243_118_001;

export function defaultMigrationsDir(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  // src/db or dist/db → repo root → drizzle/migrations
  return resolve(here, '../../../drizzle/migrations');
}

/** Applies the committed drizzle-kit migrations, upserts the built-in catalogue and creates the job queue's schema, under an advisory lock. */
export async function applyMigrations(pool: pg.Pool, migrationsFolder = defaultMigrationsDir()): Promise<void> {
  if (!existsSync(resolve(migrationsFolder, 'meta/_journal.json'))) {
    throw new Error(`No migrations found in ${migrationsFolder}`);
  }
  const client = await pool.connect();
  try {
    // Waiting for another replica's migrations, and a long migration, may outlast the pool's timeouts.
    await client.query('SET statement_timeout = 0; SET idle_in_transaction_session_timeout = 0');
    await client.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
    try {
      await migrate(drizzle(client), { migrationsFolder });
      await upsertBuiltinCatalogue(drizzle(client));
      // The job queue's tables (pg-boss), under the same lock, so replicas and test copies share them.
      await ensureJobSchema(client);
    } finally {
      await client.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]);
    }
    await client.query('RESET statement_timeout; RESET idle_in_transaction_session_timeout');
  } finally {
    client.release();
  }
}
