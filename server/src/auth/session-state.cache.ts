import { Inject, Injectable } from '@nestjs/common';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { type SessionState, SessionStateRepository } from './session-state.repository.js';

/** Entries kept at most; past this the oldest are dropped (a Map iterates in insertion order). */
const MAX_ENTRIES = 10_000;

/**
 * Per-process memory of each user's session state for SESSION_CHECK_CACHE_MS (2 s by default, at
 * most 5 s). The database stays the only truth: every replica reads the version from PostgreSQL,
 * so a deactivation, role change or password reset takes effect everywhere within that window,
 * without messages between replicas. The cache only saves a query per request for busy users.
 */
@Injectable()
export class SessionStateCache {
  private readonly entries = new Map<string, { state: SessionState | null; until: number }>();
  private readonly ttlMs: number;

  constructor(
    private readonly repository: SessionStateRepository,
    @Inject(APP_CONFIG) config: AppConfig,
  ) {
    this.ttlMs = config.SESSION_CHECK_CACHE_MS;
  }

  async get(userId: string, organisationId: string): Promise<SessionState | null> {
    const key = `${userId}:${organisationId}`;
    const now = Date.now();
    const hit = this.entries.get(key);
    if (hit && hit.until > now) return hit.state;
    const state = await this.repository.find(userId, organisationId);
    this.entries.delete(key);
    if (this.entries.size >= MAX_ENTRIES) this.entries.delete(this.entries.keys().next().value!);
    if (this.ttlMs > 0) this.entries.set(key, { state, until: now + this.ttlMs });
    return state;
  }

  /** Forgets a user at once in this process (other processes catch up within the window). */
  forget(userId: string): void {
    for (const key of this.entries.keys()) if (key.startsWith(`${userId}:`)) this.entries.delete(key);
  }
}
