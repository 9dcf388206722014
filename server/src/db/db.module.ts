import { Global, Inject, Logger, Module, type OnApplicationShutdown } from '@nestjs/common';
import pg from 'pg';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { databaseRole } from '../config/deployment-guards.js';
import { DRIZZLE, PG_POOL } from './db.tokens.js';
import { applyMigrations, rowSecurityBypasses } from './migrate.js';
import { OrganisationPool, organisationScopedDrizzle } from './organisation-pool.js';

/** Migrates as the owner (MIGRATION_DATABASE_URL) when given, granting the application role its rights. */
async function migrate(config: AppConfig, pool: pg.Pool): Promise<void> {
  if (!config.MIGRATION_DATABASE_URL) return applyMigrations(pool, config.MIGRATIONS_DIR);
  const owner = new pg.Pool({ connectionString: config.MIGRATION_DATABASE_URL, max: 1 });
  owner.on('error', () => undefined);
  try {
    await applyMigrations(owner, config.MIGRATIONS_DIR, databaseRole(config.DATABASE_URL) || undefined);
  } finally {
    await owner.end();
  }
}

/** Production refuses an application role that row-level security would not bind; elsewhere it is said once. */
async function checkApplicationRole(config: AppConfig, pool: pg.Pool): Promise<void> {
  const problems = await rowSecurityBypasses(pool);
  if (problems.length === 0) return;
  const message = `DATABASE_URL: ${problems.join('; ')}, so organisation isolation is not enforced by PostgreSQL`;
  if (config.NODE_ENV === 'production') throw new Error(`${message}. Use the application role (docs/operations.md).`);
  new Logger('Database').warn(message);
}

@Global()
@Module({
  providers: [
    {
      provide: PG_POOL,
      inject: [APP_CONFIG],
      useFactory: async (config: AppConfig) => {
        const pool = new OrganisationPool({
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
        await migrate(config, pool);
        await checkApplicationRole(config, pool);
        return pool;
      },
    },
    { provide: DRIZZLE, inject: [PG_POOL], useFactory: (pool: pg.Pool) => organisationScopedDrizzle(pool) },
  ],
  exports: [PG_POOL, DRIZZLE],
})
export class DbModule implements OnApplicationShutdown {
  constructor(@Inject(PG_POOL) private readonly pool: pg.Pool) {}

  async onApplicationShutdown(): Promise<void> {
    await this.pool.end();
  }
}
