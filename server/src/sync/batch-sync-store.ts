import { randomUUID } from 'node:crypto';
import type { AuditChange, AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import type { CatalogueItemRow } from '../catalogue/catalogue.mapper.js';
import type { DbExecutor } from '../db/db.tokens.js';
import type { FindingRow } from '../findings/finding.mapper.js';
import type { ConflictInsert, FindingStore, FixInsert, VerificationInsert } from '../findings/finding-store.js';
import type { FindingChanges, FindingInsert } from '../findings/findings.repository.js';
import type { InspectionRow } from '../inspections/inspection.mapper.js';
import { type BatchFinding, CHECKED, type CheckedFinding, type SyncBatchRepository } from './sync-batch.repository.js';

/**
 * The batch could not be written as computed (an id taken meanwhile, a value the database refuses):
 * the push rolls back to its savepoint and applies the mutations one by one instead.
 */
export class BatchFallback extends Error {
  constructor(reason: string) {
    super(reason);
    this.name = 'BatchFallback';
  }
}

/** Keys given as undefined leave a column alone (as Drizzle's insert and set do). */
function defined<T extends object>(values: T): Partial<T> {
  const out: Record<string, unknown> = {};
  for (const key in values) if (values[key] !== undefined) out[key] = values[key];
  return out as Partial<T>;
}

/**
 * A `real` as it reads back: PostgreSQL stores the nearest single-precision float and prints the
 * shortest decimal that identifies it (1.1, not 1.100000023841858), which the driver parses.
 */
export function realAsRead(value: number): number {
  const single = Math.fround(value);
  if (!Number.isFinite(single)) return single;
  for (let digits = 1; digits < 9; digits += 1) {
    const shortest = Number(single.toPrecision(digits));
    if (Math.fround(shortest) === single) return shortest;
  }
  return Number(single.toPrecision(9));
}

/** The row as it reads back from PostgreSQL. */
function asStored(row: FindingRow): FindingRow {
  return { ...row, heightM: realAsRead(row.heightM), massKg: realAsRead(row.massKg), zoneRadiusM: row.zoneRadiusM === null ? null : realAsRead(row.zoneRadiusM) };
}

/** What the mutations applied since the last take() wrote, to go to the database in a few multi-row statements. */
export interface BatchPart {
  insert: FindingRow[];
  update: FindingRow[];
  conflicts: ConflictInsert[];
  fixes: FixInsert[];
  verifications: VerificationInsert[];
  audits: AuditChange[];
  altered: { scaffoldId: string; at: Date }[];
  assignedMails: { findingId: string; assigneeId: string }[];
}

/**
 * A push applied in memory: the findings of the batch are loaded (and locked) up front, each
 * mutation reads and changes these rows with the same rules as the statement-by-statement path,
 * and the outcome is written with a few multi-row statements: take() hands over what the mutations
 * since the last take() computed, write() writes it (so a long batch can write its first part while
 * the next one is computed), flush() does both. begin()/rollback() undo what a rejected mutation
 * did, as the per-mutation savepoint does in the database.
 */
export class BatchSyncStore implements FindingStore {
  private readonly rows = new Map<string, BatchFinding>();
  private readonly created = new Set<string>();
  private readonly changed = new Set<string>();
  /** Findings changed or made since the last take(); of the made ones, those already inserted. */
  private readonly dirty = new Set<string>();
  private readonly inserted = new Set<string>();
  /** How much of each list earlier take()s handed over. */
  private taken = { conflicts: 0, fixes: 0, verifications: 0, audits: 0, altered: 0, assignedMails: 0 };
  private readonly inspections = new Map<string, InspectionRow | undefined>();
  private readonly catalogue = new Map<string, CatalogueItemRow | undefined>();
  private conflicts: ConflictInsert[] = [];
  private fixes: FixInsert[] = [];
  private verifications: VerificationInsert[] = [];
  private audits: AuditChange[] = [];
  private altered: { scaffoldId: string; at: Date }[] = [];
  private assignedMails: { findingId: string; assigneeId: string }[] = [];
  private undo: (() => void)[] = [];
  /** The compared columns of every finding written so far, as the writes returned them. */
  private readonly stored = new Map<string, CheckedFinding>();

  constructor(
    /** Reads of scaffolds, inspections and catalogue items go here (and are kept for the batch). */
    private readonly reads: FindingStore,
    private readonly user: AuthUser,
    loaded: BatchFinding[],
    /** The transaction's now(): what created_at and updated_at get. */
    private readonly now_: Date,
  ) {
    for (const r of loaded) this.rows.set(r.finding.id, r);
  }

  begin(): void {
    const lengths = [this.conflicts.length, this.fixes.length, this.verifications.length, this.audits.length, this.altered.length, this.assignedMails.length] as const;
    this.undo = [
      () => {
        this.conflicts.length = lengths[0];
        this.fixes.length = lengths[1];
        this.verifications.length = lengths[2];
        this.audits.length = lengths[3];
        this.altered.length = lengths[4];
        this.assignedMails.length = lengths[5];
      },
    ];
  }

  rollback(): void {
    for (const step of this.undo.reverse()) step();
    this.undo = [];
  }

  async now() {
    return this.now_;
  }

  settings() {
    return this.reads.settings();
  }

  scaffold(id: string) {
    return this.reads.scaffold(id);
  }

  isForeman(userId: string) {
    return this.reads.isForeman(userId);
  }

  photoOwners(ids: string[]) {
    return this.reads.photoOwners(ids);
  }

  /** Fixes made earlier in this batch first, then the stored ones. */
  async latestFixer(findingId: string) {
    for (let i = this.fixes.length - 1; i >= 0; i -= 1) if (this.fixes[i]!.findingId === findingId) return this.fixes[i]!.fixedBy;
    return this.reads.latestFixer(findingId);
  }

  /** Every finding the batch names was loaded up front, whatever its organisation. */
  async findingAnyOrg(id: string) {
    return this.rows.get(id)?.finding;
  }

  async markScaffoldAltered(scaffoldId: string, at: Date) {
    this.altered.push({ scaffoldId, at });
  }

  async inspection(id: string) {
    if (!this.inspections.has(id)) this.inspections.set(id, await this.reads.inspection(id));
    return this.inspections.get(id);
  }

  async catalogueItem(id: string) {
    if (!this.catalogue.has(id)) this.catalogue.set(id, await this.reads.catalogueItem(id));
    return this.catalogue.get(id);
  }

  async finding(id: string) {
    const r = this.rows.get(id);
    return r && r.finding.organisationId === this.user.organisationId ? r : undefined;
  }

  async insertFinding(values: FindingInsert) {
    if (this.rows.has(values.id)) return undefined;
    const scaffold = await this.reads.scaffold(values.scaffoldId);
    if (!scaffold) throw new BatchFallback('the scaffold of a new finding was not found');
    const finding = asStored({
      inspectionId: null,
      catalogueItemId: null,
      shape: null,
      state: 'open',
      assigneeId: null,
      dueAt: null,
      notes: '',
      madeSafeNote: null,
      madeSafeControl: null,
      zoneRadiusM: null,
      madeSafePhotoIds: [],
      madeSafeUntil: null,
      handBack: null,
      estimateRow: null,
      syncFields: {},
      ...(defined(values) as FindingInsert),
      firstFixedAt: null, // kept by the database (triggers on fixes); never written from here
      createdAt: this.now_,
      updatedAt: this.now_,
      version: 1,
      syncXid: '',
      syncSeq: 0,
    });
    this.rows.set(finding.id, { finding, scaffoldForemanId: scaffold.foremanId, siteId: scaffold.siteId });
    this.created.add(finding.id);
    this.dirty.add(finding.id);
    this.undo.push(() => {
      this.rows.delete(finding.id);
      this.created.delete(finding.id);
      this.dirty.delete(finding.id);
    });
    return finding;
  }

  async updateFinding(id: string, changes: FindingChanges) {
    const before = this.rows.get(id)!;
    const finding = asStored({ ...before.finding, ...(defined(changes) as Partial<FindingRow>), version: before.finding.version + 1, updatedAt: this.now_ });
    const wasChanged = this.changed.has(id);
    const wasDirty = this.dirty.has(id);
    this.rows.set(id, { ...before, finding });
    if (!this.created.has(id)) this.changed.add(id);
    this.dirty.add(id);
    this.undo.push(() => {
      this.rows.set(id, before);
      if (!wasChanged) this.changed.delete(id);
      if (!wasDirty) this.dirty.delete(id);
    });
    return finding;
  }

  async insertConflicts(rows: ConflictInsert[]) {
    const withIds = rows.map((r) => ({ ...r, id: randomUUID() }));
    this.conflicts.push(...withIds);
    return withIds;
  }

  async insertFix(values: FixInsert) {
    this.fixes.push(values);
  }

  async insertVerification(values: VerificationInsert) {
    this.verifications.push(values);
  }

  async audit(change: AuditChange) {
    this.audits.push(change);
  }

  async assignedHigh(findingId: string, assigneeId: string) {
    this.assignedMails.push({ findingId, assigneeId });
  }

  /**
   * What the mutations since the last take() wrote (call between mutations, never inside one): the
   * findings they made (inserted) or changed (updated, also one made in an earlier part) as they
   * now stand, and the rows they added to every other list.
   */
  take(): BatchPart {
    const insert: FindingRow[] = [];
    const update: FindingRow[] = [];
    for (const id of this.dirty) {
      const finding = this.rows.get(id)!.finding;
      if (this.created.has(id) && !this.inserted.has(id)) {
        insert.push(finding);
        this.inserted.add(id);
      } else update.push(finding);
    }
    this.dirty.clear();
    const from = this.taken;
    this.taken = {
      conflicts: this.conflicts.length,
      fixes: this.fixes.length,
      verifications: this.verifications.length,
      audits: this.audits.length,
      altered: this.altered.length,
      assignedMails: this.assignedMails.length,
    };
    return {
      insert,
      update,
      conflicts: this.conflicts.slice(from.conflicts),
      fixes: this.fixes.slice(from.fixes),
      verifications: this.verifications.slice(from.verifications),
      audits: this.audits.slice(from.audits),
      altered: this.altered.slice(from.altered),
      assignedMails: this.assignedMails.slice(from.assignedMails),
    };
  }

  /** Writes a part; call inside a savepoint, parts in the order taken. Throws BatchFallback when the database would not take it as computed. */
  async write(part: BatchPart, tx: DbExecutor, repo: SyncBatchRepository, audit: AuditService): Promise<void> {
    const inserted = await repo.insertFindings(part.insert, tx);
    if (inserted.length !== part.insert.length) throw new BatchFallback('a finding id was taken meanwhile');
    const updated = await repo.updateFindings(part.update, tx);
    if (updated.length !== part.update.length) throw new BatchFallback('a finding changed meanwhile');
    // As stored; a finding written again by a later part is checked as that part left it.
    for (const row of [...inserted, ...updated]) this.stored.set(row.id, row);
    if ((await repo.insertFixes(part.fixes, tx)) !== part.fixes.length) throw new BatchFallback('a fix record id is taken');
    if ((await repo.insertVerifications(part.verifications, tx)) !== part.verifications.length) throw new BatchFallback('a verification record id is taken');
    await repo.insertConflicts(part.conflicts, tx);
    for (const { scaffoldId, at } of part.altered) await repo.markScaffoldAltered(scaffoldId, at, tx);
    await audit.recordMany(tx, this.user, part.audits);
    // Queued through the statement-by-statement store, which runs on the same transaction.
    for (const { findingId, assigneeId } of part.assignedMails) await this.reads.assignedHigh(findingId, assigneeId);
  }

  /** Writes everything not written yet; call inside a savepoint. */
  async flush(tx: DbExecutor, repo: SyncBatchRepository, audit: AuditService): Promise<void> {
    await this.write(this.take(), tx, repo, audit);
  }

  /** The ids of the findings flush() wrote. */
  written(): string[] {
    return [...this.created, ...this.changed];
  }

  /**
   * The batch's rows of `ids` as they now stand (loaded and locked in this transaction, or written
   * by flush() and checked by matchesStored()), and the ids the batch never loaded.
   */
  current(ids: string[]): { found: BatchFinding[]; missing: string[] } {
    const found: BatchFinding[] = [];
    const missing: string[] = [];
    for (const id of ids) {
      const row = this.rows.get(id);
      if (row) found.push(row);
      else missing.push(id);
    }
    return { found, missing };
  }

  /**
   * True when every finding written was stored as it was computed (so every audit row and the
   * answer tell the truth), by what its last write returned. Call after flush().
   */
  matchesStored(): boolean {
    return this.written().every((id) => {
      const mine = this.rows.get(id)!.finding;
      const theirs = this.stored.get(id);
      if (!theirs) return false;
      if (mine.createdAt.getTime() !== theirs.createdAt.getTime() || mine.updatedAt.getTime() !== theirs.updatedAt.getTime()) return false;
      if ((mine.dueAt?.getTime() ?? null) !== (theirs.dueAt?.getTime() ?? null)) return false;
      return CHECKED.every((k) => mine[k] === theirs[k]);
    });
  }
}
