import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import type * as schema from './schema/index.js';

export const PG_POOL = Symbol('PG_POOL');
export const DRIZZLE = Symbol('DRIZZLE');

export type Db = NodePgDatabase<typeof schema>;
/** A database handle or an open transaction: repositories take either so callers own the transaction. */
export type DbExecutor = Db | Parameters<Parameters<Db['transaction']>[0]>[0];
