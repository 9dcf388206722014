import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, sql } from 'drizzle-orm';
import type { PhotoOwnerType } from '@plummet/shared';
import { photoInScope } from '../common/foreman-scope.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import {
  auditEvents,
  controlChecks,
  findings,
  fixes,
  organisations,
  photos,
  scaffolds,
  verifications,
} from '../db/schema/index.js';

export type PhotoRow = typeof photos.$inferSelect;
export type NewPhotoRow = typeof photos.$inferInsert;

/** The record a photo is attached to, with the people who may add proof photos to a fix. */
export interface PhotoOwnerRow {
  id: string;
  /** Fixes only: who recorded the fix, who the finding is assigned to, the scaffold's foreman. */
  fixPeople?: { fixedBy: string; assigneeId: string | null; scaffoldForemanId: string | null };
}

export interface PhotoAuditEvent {
  organisationId: string;
  actorId: string;
  entityId: string;
  action: 'create' | 'delete';
  before: unknown;
  after: unknown;
}

/** Separates this feature's advisory locks from any other feature's (two-key form). */
const CONTENT_LOCK_SPACE = sql`hashtext('plummet.photos.content')`;

@Injectable()
export class PhotosRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  transaction<T>(work: (tx: DbExecutor) => Promise<T>): Promise<T> {
    return this.db.transaction(work);
  }

  /**
   * Serialises every upload and deletion of one content hash until the transaction ends, across
   * replicas: an upload cannot reuse an object that a deletion is about to remove.
   */
  async lockContent(contentHash: string, ex: DbExecutor): Promise<void> {
    await ex.execute(sql`SELECT pg_advisory_xact_lock(${CONTENT_LOCK_SPACE}, hashtext(${contentHash}))`);
  }

  /** The organisation's photo; with `foremanId`, only if it is in that foreman's scope. */
  async findById(organisationId: string, id: string, ex: DbExecutor = this.db, foremanId?: string): Promise<PhotoRow | undefined> {
    const [row] = await ex
      .select()
      .from(photos)
      .where(
        and(eq(photos.id, id), eq(photos.organisationId, organisationId), foremanId ? photoInScope(photos.ownerType, photos.ownerId, foremanId) : undefined),
      );
    return row;
  }

  /**
   * Ids are generated on phones, so a clash with another organisation's photo is told apart:
   * the organisation's own row, `'taken'` when another organisation's photo has the id (asked
   * through the narrow function photo_id_taken; row-level security hides that row), else undefined.
   */
  async findByIdForUpload(organisationId: string, id: string, ex: DbExecutor = this.db): Promise<PhotoRow | 'taken' | undefined> {
    const [row] = await ex
      .select()
      .from(photos)
      .where(and(eq(photos.id, id), eq(photos.organisationId, organisationId)));
    if (row) return row;
    const result = await ex.execute<{ taken: boolean }>(sql`SELECT photo_id_taken(${id}::uuid) AS taken`);
    return result.rows[0]?.taken ? 'taken' : undefined;
  }

  /** The owner's photos; with `foremanId`, only if the owner is in that foreman's scope. */
  listByOwner(organisationId: string, ownerType: PhotoOwnerType, ownerId: string, foremanId?: string): Promise<PhotoRow[]> {
    return this.db
      .select()
      .from(photos)
      .where(
        and(
          eq(photos.organisationId, organisationId),
          eq(photos.ownerType, ownerType),
          eq(photos.ownerId, ownerId),
          foremanId ? photoInScope(photos.ownerType, photos.ownerId, foremanId) : undefined,
        ),
      )
      .orderBy(asc(photos.createdAt), asc(photos.id));
  }

  /** Inserts unless the id is taken; undefined when another upload of the same id won. */
  async insertIfAbsent(row: NewPhotoRow, ex: DbExecutor): Promise<PhotoRow | undefined> {
    const [inserted] = await ex.insert(photos).values(row).onConflictDoNothing({ target: photos.id }).returning();
    return inserted;
  }

  async delete(organisationId: string, id: string, ex: DbExecutor): Promise<PhotoRow | undefined> {
    const [deleted] = await ex
      .delete(photos)
      .where(and(eq(photos.id, id), eq(photos.organisationId, organisationId)))
      .returning();
    return deleted;
  }

  /**
   * Whether a row of any organisation still points at this content (the object is shared by all
   * of them), through the narrow function photo_content_in_use: row-level security hides the rest.
   */
  async contentInUse(contentHash: string, ex: DbExecutor): Promise<boolean> {
    const result = await ex.execute<{ used: boolean }>(sql`SELECT photo_content_in_use(${contentHash}) AS used`);
    return result.rows[0]?.used === true;
  }

  async organisationSettings(organisationId: string): Promise<unknown> {
    const [row] = await this.db
      .select({ settings: organisations.settings })
      .from(organisations)
      .where(eq(organisations.id, organisationId));
    return row?.settings;
  }

  /** The owner in this organisation, or undefined (unknown or another organisation's). */
  async findOwner(organisationId: string, ownerType: PhotoOwnerType, ownerId: string): Promise<PhotoOwnerRow | undefined> {
    switch (ownerType) {
      case 'finding': {
        const [row] = await this.db
          .select({ id: findings.id })
          .from(findings)
          .where(and(eq(findings.id, ownerId), eq(findings.organisationId, organisationId)));
        return row;
      }
      case 'control-check': {
        const [row] = await this.db
          .select({ id: controlChecks.id })
          .from(controlChecks)
          .where(and(eq(controlChecks.id, ownerId), eq(controlChecks.organisationId, organisationId)));
        return row;
      }
      case 'verification': {
        const [row] = await this.db
          .select({ id: verifications.id })
          .from(verifications)
          .where(and(eq(verifications.id, ownerId), eq(verifications.organisationId, organisationId)));
        return row;
      }
      case 'fix': {
        const [row] = await this.db
          .select({
            id: fixes.id,
            fixedBy: fixes.fixedBy,
            assigneeId: findings.assigneeId,
            scaffoldForemanId: scaffolds.foremanId,
          })
          .from(fixes)
          .innerJoin(findings, eq(findings.id, fixes.findingId))
          .innerJoin(scaffolds, eq(scaffolds.id, findings.scaffoldId))
          .where(and(eq(fixes.id, ownerId), eq(fixes.organisationId, organisationId)));
        if (!row) return undefined;
        const { id, ...fixPeople } = row;
        return { id, fixPeople };
      }
    }
  }

  async insertAudit(event: PhotoAuditEvent, ex: DbExecutor): Promise<void> {
    await ex.insert(auditEvents).values({ ...event, entityType: 'photo' });
  }
}
