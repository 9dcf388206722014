import { Controller, Get, Inject, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type pg from 'pg';
import { Public } from '../auth/auth.decorators.js';
import { PG_POOL } from '../db/db.tokens.js';

@Public()
@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(@Inject(PG_POOL) private readonly pool: pg.Pool) {}

  /** 200 only when PostgreSQL answers; 503 otherwise (load balancers take the replica out). */
  @Get()
  async check(@Res({ passthrough: true }) res: Response): Promise<{ status: string; db: string }> {
    try {
      await Promise.race([
        this.pool.query('SELECT 1'),
        new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), 2_000).unref()),
      ]);
      return { status: 'ok', db: 'ok' };
    } catch {
      res.status(503);
      return { status: 'error', db: 'unavailable' };
    }
  }
}
