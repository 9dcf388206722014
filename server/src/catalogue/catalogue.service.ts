import { Inject, Injectable } from '@nestjs/common';
import type { CatalogueItem, CatalogueItemCreate, CatalogueItemUpdate, CatalogueListQuery, ListResponse } from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { toPage } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { type CatalogueItemRow, toCatalogueItem } from './catalogue.mapper.js';
import { CatalogueRepository } from './catalogue.repository.js';

@Injectable()
export class CatalogueService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly catalogue: CatalogueRepository,
    private readonly audit: AuditService,
  ) {}

  async list(user: AuthUser, query: CatalogueListQuery): Promise<ListResponse<CatalogueItem>> {
    const rows = await this.catalogue.list(user.organisationId, query);
    return toPage(
      rows.map((r) => ({ ...r.row, sortKey: r.sortKey })),
      query,
      toCatalogueItem,
    );
  }

  async get(user: AuthUser, id: string): Promise<CatalogueItem> {
    const row = await this.catalogue.findVisible(user.organisationId, id);
    if (!row) throw AppError.notFound('Catalogue item');
    return toCatalogueItem(row);
  }

  async create(user: AuthUser, input: CatalogueItemCreate): Promise<CatalogueItem> {
    return this.db.transaction(async (tx) => {
      const item = toCatalogueItem(await this.catalogue.insert(user.organisationId, input, tx));
      await this.audit.record(tx, user, { entityType: 'catalogue-item', entityId: item.id, action: 'create', before: null, after: item });
      return item;
    });
  }

  async update(user: AuthUser, id: string, input: CatalogueItemUpdate): Promise<CatalogueItem> {
    const { version, ...changes } = input;
    return this.db.transaction(async (tx) => {
      const current = await this.ownItem(user, id, tx);
      if (version !== undefined && version !== current.version) {
        throw new AppError(ErrorCode.Conflict, `The item changed since version ${version}; it is now at version ${current.version}`);
      }
      const item = toCatalogueItem(await this.catalogue.update(id, changes, tx));
      await this.audit.record(tx, user, { entityType: 'catalogue-item', entityId: id, action: 'update', before: toCatalogueItem(current), after: item });
      return item;
    });
  }

  /** Findings keep their copy of the item's name, mass and shape; only the link goes. */
  async delete(user: AuthUser, id: string): Promise<void> {
    await this.db.transaction(async (tx) => {
      const current = await this.ownItem(user, id, tx);
      await this.catalogue.delete(id, tx);
      await this.audit.record(tx, user, { entityType: 'catalogue-item', entityId: id, action: 'delete', before: toCatalogueItem(current), after: null });
    });
  }

  /** An item of the caller's organisation; built-ins are shared and cannot be changed (403). */
  private async ownItem(user: AuthUser, id: string, tx: DbExecutor): Promise<CatalogueItemRow> {
    const seen = await this.catalogue.findVisible(user.organisationId, id, tx);
    if (!seen) throw AppError.notFound('Catalogue item');
    if (seen.organisationId === null) throw new AppError(ErrorCode.Forbidden, 'Built-in catalogue items cannot be changed; add an item of your own');
    // Locked only now: row-level security lets no organisation lock (FOR UPDATE) a built-in item.
    const row = await this.catalogue.findVisible(user.organisationId, id, tx, true);
    if (!row) throw AppError.notFound('Catalogue item');
    return row;
  }
}
