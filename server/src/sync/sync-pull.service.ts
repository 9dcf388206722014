import { Inject, Injectable } from '@nestjs/common';
import { SYNC_CURSOR_START, type SyncPullQuery, type SyncPullResponse } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { RawJson } from './raw-json.js';
import type { FeedChange, StampedChange } from './sync-feed-tables.js';
import { SyncPullRepository } from './sync-pull.repository.js';
import { SyncRepository } from './sync.repository.js';

/**
 * GET /api/sync/pull: the caller's changes after a cursor, oldest first, a page at a time. Scoped
 * to the organisation; a foreman gets only their scope (see sync-feed-tables.ts). Every record type
 * a phone holds travels here, and tombstones name the records to drop. With `siteId`, a first pull
 * of that site alone (a phone making the site available offline), under its own cursor.
 */
@Injectable()
export class SyncPullService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly pull: SyncPullRepository,
    private readonly sync: SyncRepository,
  ) {}

  async changes(user: AuthUser, query: SyncPullQuery): Promise<SyncPullPage> {
    const [xid, seq] = (query.cursor ?? SYNC_CURSOR_START).split('.') as [string, string];
    const foremanId = user.role === 'foreman' ? user.userId : undefined;
    // One REPEATABLE READ snapshot: one horizon for every table of the feed (see SyncPullRepository).
    const { page, given } = await this.db.transaction(
      async (tx) => {
        const scope = { organisationId: user.organisationId, userId: user.userId, foremanId, siteId: query.siteId };
        const feed = await this.pull.changes(scope, { xid, seq: Number(seq) }, query.limit + 1, tx, query.format);
        const stamped = feed.slice(0, query.limit);
        const last = stamped.at(-1);
        return {
          page: { changes: stamped.map((c) => c.change), cursor: last ? `${last.xid}.${last.seq}` : `${xid}.${seq}`, hasMore: feed.length > query.limit },
          given: stamped.flatMap(givenVersion),
        };
      },
      { isolationLevel: 'repeatable read', accessMode: 'read only' },
    );
    if (query.clientId) await this.noteGiven(user, query.clientId, given);
    return page;
  }

  /** The versions this page hands the phone, so its later pushes are checked against them. */
  private async noteGiven(user: AuthUser, clientId: string, records: { id: string; version: number }[]): Promise<void> {
    if (!records.length) return;
    if (await this.sync.clientOf(clientId, user.organisationId, user.userId)) await this.sync.recordGiven(clientId, records);
  }
}

/** A page as the pull answers it: findings' records are JSON text PostgreSQL wrote (RawFindingChange), written out by stringifyWithRawJson. */
export interface SyncPullPage extends Omit<SyncPullResponse, 'changes'> {
  changes: FeedChange[];
}

/** The version of the record a change hands the phone, for the records whose pushes are checked against it. */
function givenVersion(c: StampedChange): { id: string; version: number }[] {
  if (c.given) return [c.given];
  const { change } = c;
  if (!('record' in change) || change.record instanceof RawJson) return [];
  return (change.type === 'finding' || change.type === 'inspection' || change.type === 'control-check' || change.type === 'scaffold' || change.type === 'user') &&
    typeof change.record.version === 'number'
    ? [{ id: change.record.id, version: change.record.version }]
    : [];
}
