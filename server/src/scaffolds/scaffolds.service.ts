import { Inject, Injectable } from '@nestjs/common';
import {
  liftHeightsMismatch,
  type ListResponse,
  type Scaffold,
  type ScaffoldCreate,
  type ScaffoldListQuery,
  type ScaffoldStatusChange,
  type ScaffoldUpdate,
} from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { scopedForeman } from '../common/foreman-scope.js';
import { toPage } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { SitesRepository } from '../sites/sites.repository.js';
import { ScaffoldCommands } from './scaffold-commands.js';
import { toScaffold } from './scaffold.mapper.js';
import { ScaffoldsRepository } from './scaffolds.repository.js';

/** One height per lift or none (400 naming liftHeightsM), checked against the lifts after the change. */
function checkLiftHeights(lifts: number, liftHeightsM: readonly number[]): void {
  const mismatch = liftHeightsMismatch(lifts, liftHeightsM);
  if (mismatch) {
    throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [{ path: ['liftHeightsM'], code: 'custom', message: mismatch }]);
  }
}

@Injectable()
export class ScaffoldsService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly sites: SitesRepository,
    private readonly audit: AuditService,
    private readonly commands: ScaffoldCommands,
  ) {}

  async list(user: AuthUser, query: ScaffoldListQuery): Promise<ListResponse<Scaffold>> {
    const rows = await this.scaffolds.list(user.organisationId, query, scopedForeman(user));
    return toPage(
      rows.map((r) => ({ ...r.row, sortKey: r.sortKey })),
      query,
      toScaffold,
    );
  }

  async get(user: AuthUser, id: string): Promise<Scaffold> {
    const row = await this.scaffolds.find(user.organisationId, id);
    const foremanId = scopedForeman(user);
    if (!row || (foremanId && !(await this.scaffolds.inForemanScope(id, foremanId)))) throw AppError.notFound('Scaffold');
    return toScaffold(row);
  }

  async create(user: AuthUser, input: ScaffoldCreate): Promise<Scaffold> {
    return this.db.transaction(async (tx) => {
      if (!(await this.sites.find(user.organisationId, input.siteId, tx))) throw AppError.notFound('Site');
      await this.checkForeman(user, input.foremanId, tx);
      const scaffold = toScaffold(await this.scaffolds.insert(user.organisationId, input, tx));
      await this.audit.record(tx, user, { entityType: 'scaffold', entityId: scaffold.id, action: 'create', before: null, after: scaffold });
      return scaffold;
    });
  }

  async update(user: AuthUser, id: string, input: ScaffoldUpdate): Promise<Scaffold> {
    const { version, ...changes } = input;
    return this.db.transaction(async (tx) => {
      const current = await this.scaffolds.find(user.organisationId, id, tx, true);
      if (!current) throw AppError.notFound('Scaffold');
      if (version !== undefined && version !== current.version) {
        throw new AppError(ErrorCode.Conflict, `The scaffold changed since version ${version}; it is now at version ${current.version}`);
      }
      await this.checkForeman(user, changes.foremanId, tx);
      checkLiftHeights(changes.lifts ?? current.lifts, changes.liftHeightsM ?? current.liftHeightsM);
      const scaffold = toScaffold(await this.scaffolds.update(id, changes, tx));
      await this.audit.record(tx, user, { entityType: 'scaffold', entityId: id, action: 'update', before: toScaffold(current), after: scaffold });
      return scaffold;
    });
  }

  /**
   * The tag on the scaffold (cleared / limited / closed, shown in Plummet's own words), changed on
   * site with a reason: the one command (scaffold-commands.ts), as a phone's push runs it.
   */
  async changeStatus(user: AuthUser, id: string, input: ScaffoldStatusChange): Promise<Scaffold> {
    const actor = { user, clientId: null, mutationId: null };
    return toScaffold((await this.db.transaction((tx) => this.commands.changeStatus(tx, actor, id, input))).row);
  }

  /**
   * A manager archives a scaffold that is struck or no longer on the site. Its row stays (reports and
   * findings keep pointing at it); the database writes a tombstone in the same transaction, so it
   * leaves every phone at the next pull. Archiving twice changes nothing.
   */
  async archive(user: AuthUser, id: string): Promise<Scaffold> {
    return this.db.transaction(async (tx) => {
      const current = await this.scaffolds.find(user.organisationId, id, tx, true);
      if (!current) throw AppError.notFound('Scaffold');
      if (current.archivedAt) return toScaffold(current);
      const scaffold = toScaffold(await this.scaffolds.update(id, { archivedAt: new Date() }, tx));
      await this.audit.record(tx, user, { entityType: 'scaffold', entityId: id, action: 'archive', before: toScaffold(current), after: scaffold });
      return scaffold;
    });
  }

  /** The foreman responsible must hold the foreman role in the organisation (400 naming foremanId). */
  private async checkForeman(user: AuthUser, foremanId: string | null | undefined, tx: DbExecutor): Promise<void> {
    if (!foremanId) return;
    if (!(await this.scaffolds.isForeman(user.organisationId, foremanId, tx))) {
      throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
        { path: ['foremanId'], code: 'not_a_foreman', message: 'Not a foreman of this organisation' },
      ]);
    }
  }
}
