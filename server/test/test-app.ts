import { JwtService } from '@nestjs/jwt';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { eq } from 'drizzle-orm';
import { drizzle as drizzleOver } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import { createApp } from '../src/bootstrap.js';
import { loadConfig } from '../src/config/config.js';
import { DRIZZLE, type Db } from '../src/db/db.tokens.js';
import * as schema from '../src/db/schema/index.js';
import { memberships, users } from '../src/db/schema/index.js';
import { seedDemo } from '../src/seed/seed-demo.js';
import { createTestDatabase, type TestDatabase } from './test-db.js';

export interface TestApp {
  app: NestExpressApplication;
  db: TestDatabase;
  /**
   * The database as its owner, across organisations (row-level security does not apply): for
   * fixtures and checks. The server itself runs as the application role (`app.get(DRIZZLE)`).
   */
  drizzle: Db;
  baseUrl: string;
  /** An access token for a seeded user, minted directly (independent of the sign-in route). */
  tokenFor(email: string): Promise<string>;
  close(): Promise<void>;
}

/** The whole server on a random loopback port against its own fresh database (demo seeded unless `seed: false`). */
export async function startTestApp(options: { seed?: boolean; env?: Record<string, string> } = {}): Promise<TestApp> {
  const db = await createTestDatabase();
  const config = loadConfig({
    ...process.env,
    ...db.serverEnv,
    PORT: '0',
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
    ...options.env,
  });
  const app = await createApp(config);
  await app.listen(0, '127.0.0.1');
  const ownerPool = new pg.Pool({ connectionString: db.url, max: 4 });
  ownerPool.on('error', () => undefined);
  const drizzle: Db = drizzleOver(ownerPool, { schema });
  if (options.seed !== false) await seedDemo(drizzle);
  const address = app.getHttpServer().address() as { port: number };
  const jwt = app.get(JwtService);
  return {
    app,
    db,
    drizzle,
    baseUrl: `http://127.0.0.1:${address.port}`,
    async tokenFor(email: string) {
      const [row] = await drizzle
        .select({ userId: users.id, org: memberships.organisationId, role: memberships.role, ver: users.sessionVersion })
        .from(users)
        .innerJoin(memberships, eq(memberships.userId, users.id))
        .where(eq(users.email, email));
      if (!row) throw new Error(`no seeded user ${email}`);
      return jwt.signAsync({ sub: row.userId, org: row.org, role: row.role, ver: row.ver });
    },
    async close() {
      await app.close();
      await ownerPool.end();
      await db.drop();
    },
  };
}
