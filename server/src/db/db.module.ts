import { Global, Inject, Module, type OnApplicationShutdown } from '@nestjs/common';
import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { DRIZZLE, PG_POOL } from './db.tokens.js';
import { applyMigrations } from './migrate.js';
import * as schema from './schema/index.js';

@Global()
@Module({
  providers: [
    {
      provide: PG_POOL,
      inject: [APP_CONFIG],
      useFactory: async (config: AppConfig) => {
        const pool = new pg.Pool({
          connectionString: config.DATABASE_URL,
          max: config.DATABASE_POOL_MAX,
          connectionTimeoutMillis: 5_000,
          idleTimeoutMillis: 30_000,
          // Set per connection by PostgreSQL itself: a stuck query or a transaction left open by a
          // stalled request is ended by the server, so it cannot hold a pooled connection for ever.
          statement_timeout: config.DATABASE_STATEMENT_TIMEOUT_MS,
          idle_in_transaction_session_timeout: config.DATABASE_IDLE_IN_TRANSACTION_TIMEOUT_MS,
        });
        // An idle client losing its connection must not crash the process.
        pool.on('error', () => undefined);
        await applyMigrations(pool, config.MIGRATIONS_DIR);
        return pool;
      },
    },
    { provide: DRIZZLE, inject: [PG_POOL], useFactory: (pool: pg.Pool) => drizzle(pool, { schema }) },
  ],
  exports: [PG_POOL, DRIZZLE],
})
export class DbModule implements OnApplicationShutdown {
  constructor(@Inject(PG_POOL) private readonly pool: pg.Pool) {}

  async onApplicationShutdown(): Promise<void> {
    await this.pool.end();
  }
}
