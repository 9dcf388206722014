import { Inject, Injectable } from '@nestjs/common';
import {
  type OrganisationSettings,
  type OrganisationSettingsUpdate,
  readOrganisationSettings,
  type SeverityTable,
  SeverityTableError,
  validateSeverityTable,
} from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { OrganisationsRepository } from './organisations.repository.js';

/** The organisation's settings: read by every feature that needs one, changed by admins. */
@Injectable()
export class OrganisationSettingsService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly organisations: OrganisationsRepository,
    private readonly audit: AuditService,
  ) {}

  /** With defaults for what the organisation has not set. */
  async read(organisationId: string, executor?: DbExecutor): Promise<OrganisationSettings> {
    return readOrganisationSettings(await this.organisations.settings(organisationId, executor));
  }

  /** A partial change; a severity table is checked by the physics' own validator, naming the field. */
  async update(user: AuthUser, change: OrganisationSettingsUpdate): Promise<OrganisationSettings> {
    if (change.severityTable !== undefined && change.severityTable !== null) {
      try {
        validateSeverityTable(change.severityTable as SeverityTable);
      } catch (error) {
        if (!(error instanceof SeverityTableError)) throw error;
        throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
          { path: ['severityTable', ...error.field.split(/[.[\]]+/).filter(Boolean).map((p) => (/^\d+$/.test(p) ? Number(p) : p))], code: 'invalid_severity_table', message: error.message },
        ]);
      }
    }
    return this.db.transaction(async (tx) => {
      const before = readOrganisationSettings(await this.organisations.settings(user.organisationId, tx, true));
      const after = readOrganisationSettings({ ...before, ...change });
      if (change.severityTable === null) delete after.severityTable;
      await this.organisations.saveSettings(user.organisationId, after as Record<string, unknown>, tx);
      await this.audit.record(tx, user, { entityType: 'organisation', entityId: user.organisationId, action: 'settings', before, after });
      return after;
    });
  }
}
