import { Injectable, Logger } from '@nestjs/common';
import { RateLimitRepository } from './rate-limit.repository.js';
import { RateLimitedError } from './rate-limited.error.js';

export interface RateLimitRule {
  /** What is counted, e.g. `sign-in:address:203.0.113.7`. */
  key: string;
  /** Hits allowed per window; the next one is refused. */
  limit: number;
  windowS: number;
}

/** Fixed-window limits kept in PostgreSQL, so every replica sees the same counts. */
@Injectable()
export class RateLimitService {
  private readonly logger = new Logger(RateLimitService.name);

  constructor(private readonly repository: RateLimitRepository) {}

  /** Counts a hit; throws 429 RATE_LIMITED (with the seconds to wait) once the window's limit is passed. */
  async consume(rule: RateLimitRule): Promise<void> {
    const { count, retryAfterS } = await this.repository.hit(rule.key, rule.windowS);
    // Old windows are cleared now and then rather than by a timer each replica would have to run.
    if (Math.random() < 0.01) {
      this.repository.purgeExpired().catch((error: unknown) => this.logger.warn(`purge of rate limits failed: ${String(error)}`));
    }
    if (count > rule.limit) throw new RateLimitedError(retryAfterS);
  }

  /** Takes one attempt under a growing delay; throws 429 RATE_LIMITED with the wait when it comes too soon. */
  async attemptWithDelay(key: string, rule: { freeAttempts: number; quietS: number; baseDelayS: number; maxDelayS: number }): Promise<void> {
    const waitS = await this.repository.attemptWithDelay(key, rule);
    if (waitS !== null) throw new RateLimitedError(waitS);
  }

  /** Gives back one hit (an attempt that succeeded must not count against anyone). */
  async refund(key: string): Promise<void> {
    await this.repository.refund(key);
  }

  /** Forgets a key's window (e.g. an account's failed sign-ins after a successful one). */
  async reset(key: string): Promise<void> {
    await this.repository.clear(key);
  }
}
