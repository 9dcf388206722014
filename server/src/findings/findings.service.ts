import { Inject, Injectable } from '@nestjs/common';
import type { Finding, FindingHistoryEntry, FindingListItem, FindingListQuery, ListResponse } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { toPage } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { pgCode } from '../sync/mutation-rejected.js';
import { type CommandActor, findingNotFound, inScope } from './finding-command-rules.js';
import { FindingCommands } from './finding-commands.js';
import { toFindingHistory } from './finding-history.js';
import type { FindingStore } from './finding-store.js';
import { type ExportFinding, toExportFinding, toFinding, toFindingListItem } from './finding.mapper.js';
import { FindingsRepository, type FindingWithScope } from './findings.repository.js';

export { inScope } from './finding-command-rules.js';

/**
 * The REST adapter of the findings: reads, and each write run as its command (finding-commands.ts)
 * in a transaction of its own. A command's rejection is an AppError the global filter answers.
 */
@Injectable()
export class FindingsService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly findings: FindingsRepository,
    private readonly commands: FindingCommands,
  ) {}

  /** Managers, inspectors and admins see all; a foreman sees findings on their scaffolds or assigned to them. */
  async list(user: AuthUser, query: FindingListQuery): Promise<ListResponse<FindingListItem | Finding>> {
    return query.estimate === 'full' ? this.listWhole(user, query) : this.listRows(user, query);
  }

  /** Rows of the list (FindingListItemSchema). */
  async listRows(user: AuthUser, query: FindingListQuery): Promise<ListResponse<FindingListItem>> {
    const rows = await this.findings.list(user.organisationId, query, this.foremanScope(user));
    const now = Date.now();
    return toPage(rows.map((r) => ({ ...r.row, sortKey: r.sortKey })), query, (row) => toFindingListItem(row, now));
  }

  /** The same page, each finding whole as GET /findings/:id answers it. */
  async listWhole(user: AuthUser, query: FindingListQuery): Promise<ListResponse<Finding>> {
    const rows = await this.findings.listWhole(user.organisationId, query, this.foremanScope(user));
    const now = Date.now();
    return toPage(rows.map((r) => ({ ...r.row, sortKey: r.sortKey })), query, (row) => toFinding(row, now));
  }

  /** The same page as the export writes it (the export pages through the list with these). */
  async exportPage(user: AuthUser, query: FindingListQuery): Promise<ListResponse<ExportFinding>> {
    const rows = await this.findings.listForExport(user.organisationId, query, this.foremanScope(user));
    const now = Date.now();
    return toPage(rows.map((r) => ({ ...r.row, sortKey: r.sortKey })), query, (row) => toExportFinding(row, now));
  }

  private foremanScope(user: AuthUser): string | undefined {
    return user.role === 'foreman' ? user.userId : undefined;
  }

  async get(user: AuthUser, id: string): Promise<Finding> {
    return toFinding((await this.visible(user, id, this.db)).finding);
  }

  /** Created, state changes (fixes, verifications), edits, assignments and hand backs, oldest first. */
  async history(user: AuthUser, id: string): Promise<{ items: FindingHistoryEntry[] }> {
    const scoped = await this.visible(user, id, this.db);
    return { items: toFindingHistory(scoped.finding, await this.findings.auditTrail(user.organisationId, id)) };
  }

  /** The finding if the caller may see it; 404 otherwise (another organisation or outside a foreman's scope). */
  private async visible(user: AuthUser, id: string, executor: DbExecutor): Promise<FindingWithScope> {
    const scoped = await this.findings.findWithScope(user.organisationId, id, executor);
    if (!scoped || !inScope(user, scoped)) throw findingNotFound();
    return scoped;
  }

  /** Idempotent by the phone's id: same body → the stored finding (`created: false`). */
  async create(user: AuthUser, body: unknown): Promise<{ finding: Finding; created: boolean }> {
    const result = await this.run(user, (store, actor) => this.commands.create(store, actor, body));
    return { finding: toFinding(result.row), created: result.created };
  }

  async update(user: AuthUser, id: string, body: unknown): Promise<Finding> {
    return toFinding((await this.run(user, (store, actor) => this.commands.edit(store, actor, id, body))).row);
  }

  async changeState(user: AuthUser, id: string, body: unknown): Promise<Finding> {
    return toFinding((await this.run(user, (store, actor) => this.commands.changeState(store, actor, id, body))).row);
  }

  async assign(user: AuthUser, id: string, body: unknown): Promise<Finding> {
    return toFinding((await this.run(user, (store, actor) => this.commands.assign(store, actor, id, body))).row);
  }

  async handBack(user: AuthUser, id: string, body: unknown): Promise<Finding> {
    return toFinding((await this.run(user, (store, actor) => this.commands.handBack(store, actor, id, body))).row);
  }

  /** One transaction per command; a record id taken by another fix or verification is the caller's 409. */
  private async run<T>(user: AuthUser, command: (store: FindingStore, actor: CommandActor) => Promise<T>): Promise<T> {
    try {
      return await this.db.transaction((tx) => command(this.commands.store(tx, user), { user, clientId: null, mutationId: null }));
    } catch (error) {
      if (pgCode(error) === '23505') throw new AppError(ErrorCode.Conflict, 'The record id of this change is already used');
      throw error;
    }
  }
}
