import { Inject, Injectable } from '@nestjs/common';
import type { SyncPush } from '@plummet/shared';
import { type AuditEntityType, AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';

/** The audit action a manager reviews: work handed in after its author was deactivated. */
export const ENDED_SESSION_ACTION = 'recorded-by-deactivated-member';

/**
 * Work recorded offline by someone deactivated before the phone got back online is real (a hazard
 * seen is a hazard), so the push is applied as usual and each record it touched is flagged in the
 * audit trail for a manager to review, instead of being refused and lost on the phone.
 */
@Injectable()
export class EndedSessionPushes {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly audit: AuditService,
  ) {}

  async flag(user: AuthUser, push: SyncPush): Promise<void> {
    const seen = new Set<string>();
    const changes = push.mutations
      .filter((m) => !seen.has(`${m.entity}:${m.entityId}`) && seen.add(`${m.entity}:${m.entityId}`))
      .map((m) => ({
        entityType: m.entity as AuditEntityType,
        entityId: m.entityId,
        action: ENDED_SESSION_ACTION,
        before: null,
        after: { clientId: push.clientId, mutationIds: push.mutations.filter((x) => x.entityId === m.entityId).map((x) => x.id) },
      }));
    await this.audit.recordMany(this.db, user, changes);
  }
}
