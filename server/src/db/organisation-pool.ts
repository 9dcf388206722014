import { sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import { currentOrganisation } from './organisation-context.js';
import type { Db } from './db.tokens.js';
import * as schema from './schema/index.js';

/** The statement every organisation-scoped transaction starts with (transaction-local: `true`). */
function setOrganisationSql(organisationId: string): string {
  // organisation-context.ts lets only a uuid through, so it can be written into the text.
  return `SELECT set_config('app.org_id', '${organisationId}', true)`;
}

/**
 * The application's pool. A query sent outside a transaction while an organisation is in scope
 * runs in a transaction of its own that sets `app.org_id` first; without a scope it runs as is
 * (and row-level security shows it no organisation's rows). The setting is transaction-local, so
 * a pooled connection never carries it into another request.
 */
export class OrganisationPool extends pg.Pool {
  // pg's overloads are many; Drizzle calls query(config | text, values) and awaits the promise.
  override query(...args: unknown[]): never {
    const organisationId = currentOrganisation();
    const hasCallback = typeof args[args.length - 1] === 'function';
    if (!organisationId || hasCallback) return (super.query as (...a: unknown[]) => never)(...args);
    return this.queryInOrganisation(organisationId, args) as never;
  }

  private async queryInOrganisation(organisationId: string, args: unknown[]): Promise<pg.QueryResult> {
    const client = await this.connect();
    let broken: Error | undefined;
    try {
      await client.query(`BEGIN; ${setOrganisationSql(organisationId)}`);
      const result = await (client.query as (...a: unknown[]) => Promise<pg.QueryResult>)(...args);
      await client.query('COMMIT');
      return result;
    } catch (error) {
      await client.query('ROLLBACK').catch((rollbackError: Error) => (broken = rollbackError));
      throw error;
    } finally {
      client.release(broken);
    }
  }
}

/**
 * Drizzle over the pool, with every `transaction()` setting the organisation in scope as its first
 * statement. Nested transactions are savepoints on the same connection and keep the setting.
 */
export function organisationScopedDrizzle(pool: pg.Pool): Db {
  const db = drizzle(pool, { schema });
  const transaction = db.transaction.bind(db);
  db.transaction = ((work, config) =>
    transaction(async (tx) => {
      const organisationId = currentOrganisation();
      if (organisationId) await tx.execute(sql.raw(setOrganisationSql(organisationId)));
      return work(tx);
    }, config)) as Db['transaction'];
  return db;
}
