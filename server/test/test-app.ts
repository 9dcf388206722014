import type { NestExpressApplication } from '@nestjs/platform-express';
import { createApp } from '../src/bootstrap.js';
import { loadConfig } from '../src/config/config.js';
import { createTestDatabase, type TestDatabase } from './test-db.js';

export interface TestApp {
  app: NestExpressApplication;
  db: TestDatabase;
  baseUrl: string;
  close(): Promise<void>;
}

/** The whole server on a random loopback port against its own fresh database. */
export async function startTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const db = await createTestDatabase();
  const config = loadConfig({ ...process.env, DATABASE_URL: db.url, PORT: '0', LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn', ...env });
  const app = await createApp(config);
  await app.listen(0, '127.0.0.1');
  const address = app.getHttpServer().address() as { port: number };
  return {
    app,
    db,
    baseUrl: `http://127.0.0.1:${address.port}`,
    async close() {
      await app.close();
      await db.drop();
    },
  };
}
