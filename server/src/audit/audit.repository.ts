import { Inject, Injectable } from '@nestjs/common';
import { and, eq, type SQL, sql } from 'drizzle-orm';
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

  /**
   * Many events in one statement, in order (so their ids keep the order of the changes). They
   * travel as one JSON parameter: big before/after records make bind parameters slow.
   */
  async insertMany(events: AuditEventInsert[], executor: DbExecutor = this.db): Promise<void> {
    if (!events.length) return;
    const rows = events.map((e) => ({
      organisation_id: e.organisationId,
      actor_id: e.actorId ?? null,
      entity_type: e.entityType,
      entity_id: e.entityId,
      action: e.action,
      before: e.before ?? null,
      after: e.after ?? null,
    }));
    await executor.execute(sql`
      insert into audit_events (organisation_id, actor_id, entity_type, entity_id, action, before, after)
      select r.organisation_id, r.actor_id, r.entity_type, r.entity_id, r.action, r.before, r.after
      from json_populate_recordset(null::audit_events, ${JSON.stringify(rows)}::json) with ordinality r
      order by r.ordinality`);
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
