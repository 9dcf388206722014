import { existsSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import type pg from 'pg';
import { upsertBuiltinCatalogue } from '../catalogue/catalogue-builtins.js';
import { ensureJobSchema, JOB_SCHEMA } from '../mail/queue/job-schema.js';

/** Arbitrary constant: serialises migrations when several replicas start at once. */
const MIGRATION_LOCK_KEY = 7_243_118_001;

export function defaultMigrationsDir(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  // src/db or dist/db → repo root → drizzle/migrations
  return resolve(here, '../../../drizzle/migrations');
}

/**
 * Applies the committed drizzle-kit migrations, upserts the built-in catalogue and creates the job
 * queue's schema, under an advisory lock. Runs as the owner of the tables; `applicationRole`, when
 * given, is then granted exactly what the running server needs (DML, no DDL, no ownership).
 */
export async function applyMigrations(pool: pg.Pool, migrationsFolder = defaultMigrationsDir(), applicationRole?: string): Promise<void> {
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
      if (applicationRole) await grantApplicationRole(client, applicationRole);
    } finally {
      await client.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]);
    }
    await client.query('RESET statement_timeout; RESET idle_in_transaction_session_timeout');
  } finally {
    client.release();
  }
}

/**
 * The application role reads and writes rows, nothing more: it owns no table, so row-level
 * security (forced on every organisation table) always applies to it. pg-boss's own schema stays
 * outside row-level security; the role gets what pg-boss's workers need there.
 */
async function grantApplicationRole(client: pg.PoolClient, role: string): Promise<void> {
  const [{ current }] = (await client.query<{ current: string }>('SELECT current_user AS current')).rows;
  if (current === role) return;
  const r = client.escapeIdentifier(role);
  await client.query(`
    GRANT USAGE ON SCHEMA public TO ${r};
    GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO ${r};
    GRANT USAGE, SELECT, UPDATE ON ALL SEQUENCES IN SCHEMA public TO ${r};
    GRANT USAGE ON SCHEMA ${JOB_SCHEMA} TO ${r};
    GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA ${JOB_SCHEMA} TO ${r};
    GRANT USAGE, SELECT, UPDATE ON ALL SEQUENCES IN SCHEMA ${JOB_SCHEMA} TO ${r};
    GRANT EXECUTE ON ALL FUNCTIONS IN SCHEMA ${JOB_SCHEMA} TO ${r};`);
}

/** What the server's role can do that would defeat row-level security (empty: nothing). */
export async function rowSecurityBypasses(pool: pg.Pool): Promise<string[]> {
  const { rows } = await pool.query<{ role: string; rolsuper: boolean; rolbypassrls: boolean; owned: number }>(`
    SELECT r.rolname AS role, r.rolsuper, r.rolbypassrls,
      (SELECT count(*)::int FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
        WHERE n.nspname = 'public' AND c.relkind = 'r' AND pg_has_role(current_user, c.relowner, 'USAGE')) AS owned
    FROM pg_roles r WHERE r.rolname = current_user`);
  const role = rows[0];
  if (!role) return [];
  const problems: string[] = [];
  if (role.rolsuper) problems.push(`the role ${role.role} is a superuser`);
  if (role.rolbypassrls) problems.push(`the role ${role.role} has BYPASSRLS`);
  if (role.owned > 0) problems.push(`the role ${role.role} owns ${role.owned} table(s) (or is a member of their owner)`);
  return problems;
}
