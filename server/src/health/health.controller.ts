import { Controller, Get, Inject, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type pg from 'pg';
import { Public } from '../auth/auth.decorators.js';
import { PG_POOL } from '../db/db.tokens.js';
import { ObjectStorage } from '../storage/object-storage.service.js';

/** A check slower than this counts as failed: the health route itself must never hang. */
const CHECK_TIMEOUT_MS = 2_000;

function withinTimeout<T>(work: Promise<T>): Promise<T> {
  return Promise.race([
    work,
    new Promise<T>((_, reject) => setTimeout(() => reject(new Error('timeout')), CHECK_TIMEOUT_MS).unref()),
  ]);
}

export interface HealthReport {
  status: 'ok' | 'degraded' | 'error';
  db: 'ok' | 'unavailable';
  store: 'ok' | 'unavailable';
}

@Public()
@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(
    @Inject(PG_POOL) private readonly pool: pg.Pool,
    private readonly storage: ObjectStorage,
  ) {}

  /**
   * 503 only when PostgreSQL does not answer (load balancers take the replica out). An object
   * store that does not answer is reported as `degraded` with 200: every replica shares it, so
   * taking replicas out would not help, and everything but photos still works.
   */
  @Get()
  async check(@Res({ passthrough: true }) res: Response): Promise<HealthReport> {
    const [db, store] = await Promise.all([
      withinTimeout(this.pool.query('SELECT 1')).then(
        () => 'ok' as const,
        () => 'unavailable' as const,
      ),
      withinTimeout(this.storage.ping()).then(
        () => 'ok' as const,
        () => 'unavailable' as const,
      ),
    ]);
    if (db !== 'ok') {
      res.status(503);
      return { status: 'error', db, store };
    }
    return { status: store === 'ok' ? 'ok' : 'degraded', db, store };
  }
}
