import { Inject, Injectable } from '@nestjs/common';
import { and, eq, type SQL } from 'drizzle-orm';
import type { AuditListQuery } from '@plummet/shared';
import { keyset } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { auditEvents } from '../db/schema/index.js';

export type AuditEventRow = typeof auditEvents.$inferSelect;
export type AuditEventInsert = typeof auditEvents.$inferInsert;

@Injectable()
export class AuditRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async insert(event: AuditEventInsert, executor: DbExecutor = this.db): Promise<void> {
    await executor.insert(auditEvents).values(event);
  }

  async list(organisationId: string, query: AuditListQuery, executor: DbExecutor = this.db) {
    // Events are appended in time order, so the id orders them by time.
    const page = keyset({ expr: auditEvents.id, cast: 'bigint' }, auditEvents.id, query, 'bigint');
    const where: (SQL | undefined)[] = [eq(auditEvents.organisationId, organisationId), page.after];
    if (query.entityType) where.push(eq(auditEvents.entityType, query.entityType));
    if (query.entityId) where.push(eq(auditEvents.entityId, query.entityId));
    if (query.actorId) where.push(eq(auditEvents.actorId, query.actorId));
    return executor
      .select({ row: auditEvents, sortKey: page.sortKey })
      .from(auditEvents)
      .where(and(...where))
      .orderBy(...page.orderBy)
      .limit(page.fetch);
  }
}
