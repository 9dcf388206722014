import type { ReportMailQueue } from '../mail/report-mail.queue.js';
import { type OrganisationSettings, readOrganisationSettings } from '@plummet/shared';
import { sql } from 'drizzle-orm';
import type { AuditChange, AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import type { CatalogueItemRow } from '../catalogue/catalogue.mapper.js';
import type { CatalogueRepository } from '../catalogue/catalogue.repository.js';
import { type ConflictInsert, insertConflictRows } from '../common/command-writes.js';
import type { DbExecutor } from '../db/db.tokens.js';
import { findings } from '../db/schema/index.js';
import type { InspectionRow } from '../inspections/inspection.mapper.js';
import type { InspectionsRepository } from '../inspections/inspections.repository.js';
import type { ScaffoldRow } from '../scaffolds/scaffold.mapper.js';
import type { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import type { FindingRow } from './finding.mapper.js';
import type { FindingChanges, FindingInsert, FindingsRepository, FindingWithScope } from './findings.repository.js';

export type FixInsert = Parameters<FindingsRepository['insertFix']>[0];
export type VerificationInsert = Parameters<FindingsRepository['insertVerification']>[0];
export type { ConflictInsert } from '../common/command-writes.js';

/**
 * What a finding command (finding-commands.ts) reads and writes, for the caller's organisation,
 * inside one transaction. DbFindingStore goes to the database statement by statement (a REST call,
 * or one savepoint per pushed mutation); BatchSyncStore (sync/batch-sync-store.ts) works on rows
 * loaded up front and writes a whole push with a few multi-row statements. The rules are the
 * commands', the same for both.
 */
export interface FindingStore {
  /** The transaction's clock: what created_at and the stamps of this change read. */
  now(): Promise<Date>;
  settings(): Promise<OrganisationSettings>;
  scaffold(id: string): Promise<ScaffoldRow | undefined>;
  inspection(id: string): Promise<InspectionRow | undefined>;
  catalogueItem(id: string): Promise<CatalogueItemRow | undefined>;
  isForeman(userId: string): Promise<boolean>;
  /** The owners of photo ids that exist already (in any organisation). */
  photoOwners(ids: string[]): Promise<{ id: string; ownerType: string; ownerId: string }[]>;
  /** Who made the latest fix of the finding. */
  latestFixer(findingId: string): Promise<string | undefined>;
  /** The organisation's finding with its scaffold's foreman, locked until the transaction ends. */
  finding(id: string): Promise<FindingWithScope | undefined>;
  /** Any organisation's finding with this id (a create's retry check). */
  findingAnyOrg(id: string): Promise<FindingRow | undefined>;
  /** Undefined when a finding with this id exists (in any organisation). */
  insertFinding(values: FindingInsert): Promise<FindingRow | undefined>;
  updateFinding(id: string, changes: FindingChanges): Promise<FindingRow>;
  insertConflicts(rows: ConflictInsert[]): Promise<{ id: string; field: string }[]>;
  insertFix(values: FixInsert): Promise<void>;
  insertVerification(values: VerificationInsert): Promise<void>;
  markScaffoldAltered(scaffoldId: string, at: Date): Promise<void>;
  audit(change: AuditChange): Promise<void>;
  /** A High finding was newly assigned: its foreman is told by e-mail, queued in this transaction. */
  assignedHigh(findingId: string, assigneeId: string): Promise<void>;
}

export interface FindingStoreDeps {
  findings: FindingsRepository;
  scaffolds: ScaffoldsRepository;
  inspections: InspectionsRepository;
  catalogue: CatalogueRepository;
  audit: AuditService;
  reportMail: ReportMailQueue;
}

/** Statement by statement, straight to the database (REST, the per-mutation push path, conflict settling). */
export class DbFindingStore implements FindingStore {
  private clock?: Date;
  private orgSettings?: OrganisationSettings;

  constructor(
    private readonly deps: FindingStoreDeps,
    private readonly tx: DbExecutor,
    private readonly user: AuthUser,
    /** Scaffolds read earlier in the same push (only an alteration changes one, and not what is read here). */
    private readonly scaffolds = new Map<string, ScaffoldRow>(),
  ) {}

  async now() {
    if (!this.clock) {
      const [row] = await this.tx.select({ now: sql`now()`.mapWith(findings.updatedAt) }).from(sql`(select 1) one`);
      this.clock = row!.now as Date;
    }
    return this.clock;
  }

  async settings() {
    this.orgSettings ??= readOrganisationSettings(await this.deps.findings.organisationSettings(this.user.organisationId, this.tx));
    return this.orgSettings;
  }

  async scaffold(id: string) {
    const cached = this.scaffolds.get(id);
    if (cached) return cached;
    const row = await this.deps.scaffolds.find(this.user.organisationId, id, this.tx);
    if (row) this.scaffolds.set(id, row);
    return row;
  }

  inspection(id: string) {
    return this.deps.inspections.find(this.user.organisationId, id, this.tx);
  }

  catalogueItem(id: string) {
    return this.deps.catalogue.findVisible(this.user.organisationId, id, this.tx);
  }

  isForeman(userId: string) {
    return this.deps.scaffolds.isForeman(this.user.organisationId, userId, this.tx);
  }

  photoOwners(ids: string[]) {
    return this.deps.findings.photoOwners(ids, this.tx);
  }

  latestFixer(findingId: string) {
    return this.deps.findings.latestFixer(findingId, this.tx);
  }

  finding(id: string) {
    return this.deps.findings.findWithScope(this.user.organisationId, id, this.tx, true);
  }

  findingAnyOrg(id: string) {
    return this.deps.findings.findAnyOrg(id, this.tx);
  }

  insertFinding(values: FindingInsert) {
    return this.deps.findings.insertIfAbsent(values, this.tx);
  }

  updateFinding(id: string, changes: FindingChanges) {
    return this.deps.findings.update(id, changes, this.tx);
  }

  insertConflicts(rows: ConflictInsert[]) {
    return insertConflictRows(this.tx, rows);
  }

  insertFix(values: FixInsert) {
    return this.deps.findings.insertFix(values, this.tx);
  }

  insertVerification(values: VerificationInsert) {
    return this.deps.findings.insertVerification(values, this.tx);
  }

  async markScaffoldAltered(scaffoldId: string, at: Date) {
    await this.deps.findings.markScaffoldsAltered([scaffoldId], at, this.tx);
    this.scaffolds.delete(scaffoldId);
  }

  assignedHigh(findingId: string, assigneeId: string) {
    return this.deps.reportMail.enqueueAssignmentMail(this.tx, findingId, assigneeId);
  }

  audit(change: AuditChange) {
    return this.deps.audit.record(this.tx, this.user, change);
  }
}
