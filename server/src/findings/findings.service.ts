import { Inject, Injectable } from '@nestjs/common';
import type { Finding, FindingCreate, FindingListItem, FindingListQuery, FindingUpdate, ListResponse } from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { CatalogueRepository } from '../catalogue/catalogue.repository.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { toPage } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { InspectionsRepository } from '../inspections/inspections.repository.js';
import { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import { checkPosition, type FindingFields, findingColumns, newFindingRow, resolveItem } from './finding-input.js';
import { type FindingRow, toFinding, toFindingListItem } from './finding.mapper.js';
import { FindingsRepository, type FindingWithScope } from './findings.repository.js';

/** Whether the caller may see the finding: everyone in the organisation but a foreman outside their scope. */
export function inScope(user: AuthUser, scoped: FindingWithScope): boolean {
  if (user.role !== 'foreman') return true;
  return scoped.scaffoldForemanId === user.userId || scoped.finding.assigneeId === user.userId;
}

const f4 = Math.fround;

/** JSON with sorted keys: jsonb does not keep the key order a client sent. */
function canonical(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => a.localeCompare(b))) : v,
  );
}

/** A repeated create with the body the finding was made from (then it is a retry, not a conflict). */
function sameCreate(row: FindingRow, input: FindingCreate): boolean {
  const item = input.item.catalogueItemId !== undefined
    ? row.catalogueItemId === input.item.catalogueItemId
    : row.catalogueItemId === null &&
      row.itemName === input.item.name &&
      f4(row.massKg) === f4(input.item.massKg!) &&
      canonical(row.shape ?? null) === canonical(input.item.shape ?? null);
  return (
    item &&
    row.scaffoldId === input.scaffoldId &&
    row.inspectionId === input.inspectionId &&
    row.elevation === input.elevation &&
    row.lift === input.lift &&
    row.bay === input.bay &&
    f4(row.heightM) === f4(input.heightM) &&
    row.exposure === input.exposure &&
    canonical(row.likelihoodAnswers) === canonical(input.likelihoodAnswers) &&
    row.notes === input.notes
  );
}

@Injectable()
export class FindingsService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly findings: FindingsRepository,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly inspections: InspectionsRepository,
    private readonly catalogue: CatalogueRepository,
    private readonly audit: AuditService,
  ) {}

  /** Managers, inspectors and admins see all; a foreman sees findings on their scaffolds or assigned to them. */
  async list(user: AuthUser, query: FindingListQuery): Promise<ListResponse<FindingListItem | Finding>> {
    const rows = await this.findings.list(user.organisationId, query, user.role === 'foreman' ? user.userId : undefined);
    const now = Date.now();
    return toPage(
      rows.map((r) => ({ ...r.row, sortKey: r.sortKey })),
      query,
      (row) => (query.estimate === 'full' ? toFinding(row, now) : toFindingListItem(row, now)),
    );
  }

  async get(user: AuthUser, id: string): Promise<Finding> {
    return toFinding((await this.visible(user, id, this.db)).finding);
  }

  /** The finding if the caller may see it; 404 otherwise (another organisation or outside a foreman's scope). */
  async visible(user: AuthUser, id: string, executor: DbExecutor, forUpdate = false): Promise<FindingWithScope> {
    const scoped = await this.findings.findWithScope(user.organisationId, id, executor, forUpdate);
    if (!scoped || !inScope(user, scoped)) throw AppError.notFound('Finding');
    return scoped;
  }

  /** Idempotent by the phone's id, like inspections: same body → the stored finding (`created: false`). */
  async create(user: AuthUser, input: FindingCreate): Promise<{ finding: Finding; created: boolean }> {
    return this.db.transaction(async (tx) => {
      const existing = await this.findings.findAnyOrg(input.id, tx);
      if (existing) return { finding: this.retried(existing, input, user), created: false };

      const scaffold = await this.scaffolds.find(user.organisationId, input.scaffoldId, tx);
      if (!scaffold) throw AppError.notFound('Scaffold');
      const windSpeedMps = await this.inspectionWind(user, input.inspectionId, scaffold.id, tx, true);
      checkPosition(input, scaffold);
      const item = resolveItem(input.item, await this.catalogueItem(user, input.item.catalogueItemId, tx));
      const row = await this.findings.insertIfAbsent(newFindingRow(user, input, item, scaffold.id, windSpeedMps), tx);
      if (!row) {
        const raced = await this.findings.findAnyOrg(input.id, tx);
        if (!raced) throw new AppError(ErrorCode.Conflict, 'The finding id is taken');
        return { finding: this.retried(raced, input, user), created: false };
      }
      const finding = toFinding(row);
      await this.audit.record(tx, user, { entityType: 'finding', entityId: row.id, action: 'create', before: null, after: finding });
      return { finding, created: true };
    });
  }

  private retried(existing: FindingRow, input: FindingCreate, user: AuthUser): Finding {
    if (existing.organisationId !== user.organisationId) throw AppError.notFound('Finding');
    if (!sameCreate(existing, input)) throw new AppError(ErrorCode.Conflict, 'A finding with this id exists with other details');
    return toFinding(existing);
  }

  /** Any change of position, item, exposure or answers recomputes the estimate from the merged fields. */
  async update(user: AuthUser, id: string, input: FindingUpdate): Promise<Finding> {
    const { version, notes, item: itemInput, ...changes } = input;
    return this.db.transaction(async (tx) => {
      const { finding: current } = await this.visible(user, id, tx, true);
      if (version !== undefined && version !== current.version) {
        throw new AppError(ErrorCode.Conflict, `The finding changed since version ${version}; it is now at version ${current.version}`);
      }
      const scaffold = await this.scaffolds.find(user.organisationId, current.scaffoldId, tx);
      if (!scaffold) throw AppError.notFound('Scaffold');
      const item = itemInput
        ? resolveItem(itemInput, await this.catalogueItem(user, itemInput.catalogueItemId, tx))
        : toFinding(current).item;
      const fields: FindingFields = {
        elevation: changes.elevation ?? current.elevation,
        lift: changes.lift ?? current.lift,
        bay: changes.bay ?? current.bay,
        heightM: changes.heightM ?? current.heightM,
        exposure: changes.exposure ?? current.exposure,
        likelihoodAnswers: changes.likelihoodAnswers ?? toFinding(current).likelihoodAnswers,
        item,
      };
      checkPosition(fields, scaffold);
      const windSpeedMps = await this.inspectionWind(user, current.inspectionId, scaffold.id, tx, false);
      const row = await this.findings.update(id, { ...findingColumns(fields, windSpeedMps), ...(notes !== undefined ? { notes } : {}) }, tx);
      const finding = toFinding(row);
      await this.audit.record(tx, user, { entityType: 'finding', entityId: id, action: 'update', before: toFinding(current), after: finding });
      return finding;
    });
  }

  /** The wind of the finding's inspection (for the drift); the inspection must be of the same scaffold. */
  private async inspectionWind(user: AuthUser, inspectionId: string | null, scaffoldId: string, tx: DbExecutor, creating: boolean): Promise<number | null> {
    if (!inspectionId) return null;
    const inspection = await this.inspections.find(user.organisationId, inspectionId, tx);
    if (!inspection) throw AppError.notFound('Inspection');
    if (creating) {
      if (inspection.scaffoldId !== scaffoldId) {
        throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
          { path: ['inspectionId'], code: 'other_scaffold', message: 'The inspection is of another scaffold' },
        ]);
      }
      if (inspection.finishedAt) throw new AppError(ErrorCode.Conflict, 'The inspection is finished and signed; record the finding in a new inspection');
    }
    return inspection.windSpeedMps;
  }

  private async catalogueItem(user: AuthUser, id: string | undefined, tx: DbExecutor) {
    return id === undefined ? undefined : this.catalogue.findVisible(user.organisationId, id, tx);
  }
}
