import { Inject, Injectable } from '@nestjs/common';
import type { ListResponse, Site, SiteCreate, SiteListQuery, SiteUpdate } from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { toPage } from '../common/keyset.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { toSite } from './site.mapper.js';
import { SitesRepository } from './sites.repository.js';

@Injectable()
export class SitesService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly sites: SitesRepository,
    private readonly audit: AuditService,
  ) {}

  async list(user: AuthUser, query: SiteListQuery): Promise<ListResponse<Site>> {
    const rows = await this.sites.list(user.organisationId, query);
    return toPage(
      rows.map((r) => ({ ...r.row, sortKey: r.sortKey })),
      query,
      toSite,
    );
  }

  async get(user: AuthUser, id: string): Promise<Site> {
    const row = await this.sites.find(user.organisationId, id);
    if (!row) throw AppError.notFound('Site');
    return toSite(row);
  }

  async create(user: AuthUser, input: SiteCreate): Promise<Site> {
    return this.db.transaction(async (tx) => {
      const site = toSite(await this.sites.insert(user.organisationId, input, tx));
      await this.audit.record(tx, user, { entityType: 'site', entityId: site.id, action: 'create', before: null, after: site });
      return site;
    });
  }

  async update(user: AuthUser, id: string, input: SiteUpdate): Promise<Site> {
    const { version, ...changes } = input;
    return this.db.transaction(async (tx) => {
      const current = await this.sites.find(user.organisationId, id, tx, true);
      if (!current) throw AppError.notFound('Site');
      if (version !== undefined && version !== current.version) {
        throw new AppError(ErrorCode.Conflict, `The site changed since version ${version}; it is now at version ${current.version}`);
      }
      const site = toSite(await this.sites.update(id, changes, tx));
      await this.audit.record(tx, user, { entityType: 'site', entityId: id, action: 'update', before: toSite(current), after: site });
      return site;
    });
  }

  /** Refused while the site has scaffolds: their inspection records must be kept. */
  async delete(user: AuthUser, id: string): Promise<void> {
    await this.db.transaction(async (tx) => {
      const current = await this.sites.find(user.organisationId, id, tx, true);
      if (!current) throw AppError.notFound('Site');
      if ((await this.sites.countScaffolds(id, tx)) > 0) {
        throw new AppError(ErrorCode.Conflict, 'The site has scaffolds; their inspection records must be kept, so it cannot be deleted');
      }
      await this.sites.delete(id, tx);
      await this.audit.record(tx, user, { entityType: 'site', entityId: id, action: 'delete', before: toSite(current), after: null });
    });
  }
}
