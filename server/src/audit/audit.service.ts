import { Injectable } from '@nestjs/common';
import type { AuditEvent, AuditListQuery, ListResponse } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { toPage } from '../common/keyset.js';
import type { DbExecutor } from '../db/db.tokens.js';
import { type AuditEventInsert, type AuditEventRow, AuditRepository } from './audit.repository.js';

export type AuditEntityType = 'site' | 'scaffold' | 'inspection' | 'control-check' | 'finding' | 'catalogue-item' | 'organisation';

export interface AuditChange {
  entityType: AuditEntityType;
  entityId: string;
  /** e.g. create, update, delete, status, finish, state:fixed, assign */
  action: string;
  /** The record before (null for a create), as the API shows it. */
  before: unknown;
  /** The record after (null for a delete), as the API shows it. */
  after: unknown;
}

export function toAuditEvent(row: AuditEventRow): AuditEvent {
  return {
    id: String(row.id),
    actorId: row.actorId,
    entityType: row.entityType,
    entityId: row.entityId,
    action: row.action,
    before: row.before ?? null,
    after: row.after ?? null,
    at: row.at.toISOString(),
  };
}

function auditRow(actor: AuthUser, change: AuditChange): AuditEventInsert {
  return {
    organisationId: actor.organisationId,
    actorId: actor.userId,
    entityType: change.entityType,
    entityId: change.entityId,
    action: change.action,
    before: change.before ?? null,
    after: change.after ?? null,
  };
}

/** Every change writes one event, inside the transaction of the change itself. */
@Injectable()
export class AuditService {
  constructor(private readonly audit: AuditRepository) {}

  /** Call with the transaction of the change: the event and the change commit or fail together. */
  async record(tx: DbExecutor, actor: AuthUser, change: AuditChange): Promise<void> {
    await this.audit.insert(auditRow(actor, change), tx);
  }

  /** Several changes by one actor in one statement, same transaction rule as record(). */
  async recordMany(tx: DbExecutor, actor: AuthUser, changes: AuditChange[]): Promise<void> {
    if (!changes.length) return;
    await this.audit.insertMany(
      changes.map((change) => auditRow(actor, change)),
      tx,
    );
  }

  async list(user: AuthUser, query: AuditListQuery): Promise<ListResponse<AuditEvent>> {
    const rows = await this.audit.list(user.organisationId, query);
    return toPage(
      rows.map((r) => ({ ...r.row, id: String(r.row.id), sortKey: r.sortKey, raw: r.row })),
      query,
      (r) => toAuditEvent(r.raw),
    );
  }
}
