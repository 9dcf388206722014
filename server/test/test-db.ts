import { randomBytes } from 'node:crypto';
import pg from 'pg';

/**
 * A fresh database per test file, copied from the migrated template that `npm test` prepares:
 * real PostgreSQL, isolated, and fast (CREATE DATABASE … TEMPLATE is a file copy).
 */
export interface TestDatabase {
  name: string;
  /** The owner's URL (migrations, seeds, fixtures and checks that look across organisations). */
  url: string;
  /** The application role's URL: what the server connects as (row-level security binds it). */
  appUrl: string;
  /** Environment for a server on this database: the application role, the owner for migrations. */
  serverEnv: { DATABASE_URL: string; MIGRATION_DATABASE_URL: string };
  drop(): Promise<void>;
}

function baseUrl(): string {
  const base = process.env.PG_TEST_BASE_URL;
  if (!base) throw new Error('PG_TEST_BASE_URL is not set: run the tests with `npm test`.');
  return base.replace(/\/$/, '');
}

function appBaseUrl(): string {
  return (process.env.PG_TEST_APP_BASE_URL ?? baseUrl()).replace(/\/$/, '');
}

async function admin<T>(fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: `${baseUrl()}/postgres` });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

export async function createTestDatabase(): Promise<TestDatabase> {
  const template = process.env.PG_TEST_TEMPLATE ?? 'plummet_template';
  const name = `t_${randomBytes(6).toString('hex')}`;
  // Another file copying the template at the same moment makes PostgreSQL refuse; retry briefly.
  for (let attempt = 0; ; attempt++) {
    try {
      await admin((c) => c.query(`CREATE DATABASE "${name}" TEMPLATE "${template}"`));
      break;
    } catch (error) {
      if (attempt >= 40 || !/being accessed by other users/.test(String(error))) throw error;
      await new Promise((r) => setTimeout(r, 50 + Math.random() * 100));
    }
  }
  const url = `${baseUrl()}/${name}`;
  const appUrl = `${appBaseUrl()}/${name}`;
  return {
    name,
    url,
    appUrl,
    serverEnv: { DATABASE_URL: appUrl, MIGRATION_DATABASE_URL: url },
    drop: () => admin((c) => c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`)).then(() => undefined),
  };
}
