import type { AuditChange, AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import type { CatalogueItemRow } from '../catalogue/catalogue.mapper.js';
import type { CatalogueRepository } from '../catalogue/catalogue.repository.js';
import type { DbExecutor } from '../db/db.tokens.js';
import type { FindingRow } from '../findings/finding.mapper.js';
import type { FindingChanges, FindingInsert, FindingsRepository, FindingWithScope } from '../findings/findings.repository.js';
import type { InspectionRow } from '../inspections/inspection.mapper.js';
import type { InspectionsRepository } from '../inspections/inspections.repository.js';
import type { ScaffoldRow } from '../scaffolds/scaffold.mapper.js';
import type { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import type { SyncConflictInsert, SyncRepository } from './sync.repository.js';

export type FixInsert = Parameters<FindingsRepository['insertFix']>[0];
export type VerificationInsert = Parameters<FindingsRepository['insertVerification']>[0];

/**
 * What applying a finding mutation reads and writes, for the caller's organisation, inside the
 * push's transaction. DbSyncStore goes to the database statement by statement (inside a savepoint
 * per mutation); BatchSyncStore (batch-sync-store.ts) works on rows loaded up front and writes the
 * whole batch with a few multi-row statements. The rules in FindingSyncService are the same for both.
 */
export interface SyncStore {
  scaffold(id: string): Promise<ScaffoldRow | undefined>;
  inspection(id: string): Promise<InspectionRow | undefined>;
  catalogueItem(id: string): Promise<CatalogueItemRow | undefined>;
  /** The organisation's finding with its scaffold's foreman, locked until the transaction ends. */
  finding(id: string): Promise<FindingWithScope | undefined>;
  /** Undefined when a finding with this id exists (in any organisation). */
  insertFinding(values: FindingInsert): Promise<FindingRow | undefined>;
  updateFinding(id: string, changes: FindingChanges): Promise<FindingRow>;
  insertConflicts(rows: SyncConflictInsert[]): Promise<{ id: string; field: string }[]>;
  insertFix(values: FixInsert): Promise<void>;
  insertVerification(values: VerificationInsert): Promise<void>;
  audit(change: AuditChange): Promise<void>;
}

export interface SyncStoreDeps {
  findings: FindingsRepository;
  scaffolds: ScaffoldsRepository;
  inspections: InspectionsRepository;
  catalogue: CatalogueRepository;
  audit: AuditService;
  sync: SyncRepository;
}

/** Statement by statement, straight to the database (the per-mutation path and conflict settling). */
export class DbSyncStore implements SyncStore {
  constructor(
    private readonly deps: SyncStoreDeps,
    private readonly tx: DbExecutor,
    private readonly user: AuthUser,
    /** Scaffolds read earlier in the same push (nothing in a push changes a scaffold). */
    private readonly scaffolds = new Map<string, ScaffoldRow>(),
  ) {}

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

  finding(id: string) {
    return this.deps.findings.findWithScope(this.user.organisationId, id, this.tx, true);
  }

  insertFinding(values: FindingInsert) {
    return this.deps.findings.insertIfAbsent(values, this.tx);
  }

  updateFinding(id: string, changes: FindingChanges) {
    return this.deps.findings.update(id, changes, this.tx);
  }

  insertConflicts(rows: SyncConflictInsert[]) {
    return this.deps.sync.insertConflicts(rows, this.tx);
  }

  insertFix(values: FixInsert) {
    return this.deps.findings.insertFix(values, this.tx);
  }

  insertVerification(values: VerificationInsert) {
    return this.deps.findings.insertVerification(values, this.tx);
  }

  audit(change: AuditChange) {
    return this.deps.audit.record(this.tx, this.user, change);
  }
}
