import { Inject, Injectable } from '@nestjs/common';
import {
  applyTrigger,
  compareDue,
  dueState,
  isOnDueList,
  REGIME_REGULATION,
  type RegisterDueItem,
  type RegisterDueList,
  type RegisterDueQuery,
  type ScaffoldTrigger,
  type ScaffoldTriggerCreate,
  type ScaffoldTriggerResult,
  suggestedReason,
  TRIGGER_REGULATION,
} from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { scopedForeman } from '../common/foreman-scope.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { toScaffold } from '../scaffolds/scaffold.mapper.js';
import { seenTagWrite } from '../scaffolds/scaffold-commands.js';
import { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import { SitesRepository } from '../sites/sites.repository.js';
import { registerContextOf } from './register-context.js';
import { type DueCandidate, RegisterRepository, type ScaffoldTriggerRow } from './register.repository.js';

export function toScaffoldTrigger(row: ScaffoldTriggerRow): ScaffoldTrigger {
  return {
    id: row.id,
    scaffoldId: row.scaffoldId,
    kind: row.kind,
    note: row.note,
    recordedBy: row.recordedBy,
    recordedAt: row.recordedAt.toISOString(),
    answeredBy: row.answeredBy,
  };
}

function toDueItem(c: DueCandidate, now: Date): RegisterDueItem {
  const context = registerContextOf(c.site, c.scaffold);
  return {
    scaffoldId: c.scaffold.id,
    reference: c.scaffold.reference,
    siteId: c.site.id,
    siteName: c.site.name,
    status: c.scaffold.status,
    regime: context.regime,
    regulation: REGIME_REGULATION[context.regime],
    state: dueState(c.scaffold, c.trigger?.kind ?? null, now, context.timeZone),
    nextDueAt: c.scaffold.nextDueAt?.toISOString() ?? null,
    lastInspectedAt: c.scaffold.lastInspectedAt?.toISOString() ?? null,
    trigger: c.trigger
      ? { kind: c.trigger.kind, note: c.trigger.note, recordedAt: c.trigger.recordedAt.toISOString(), regulation: TRIGGER_REGULATION[context.jurisdiction] }
      : null,
    suggestedReason: suggestedReason(c.trigger?.kind ?? null, c.scaffold.lastInspectedAt, context.regime),
  };
}

/** The statutory register: triggers that close a scaffold until inspected, and what is due. */
@Injectable()
export class RegisterService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly register: RegisterRepository,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly sites: SitesRepository,
    private readonly audit: AuditService,
  ) {}

  /**
   * "Altered" or "adverse weather" on a scaffold (UK WAHR 2005 reg. 12(4)(b)): it is closed to use
   * and its inspection is due now. A foreman may record it only on a scaffold in their scope.
   */
  async trigger(user: AuthUser, scaffoldId: string, input: ScaffoldTriggerCreate): Promise<ScaffoldTriggerResult> {
    return this.db.transaction(async (tx) => {
      const target = await this.scaffolds.findWithSite(user.organisationId, scaffoldId, tx);
      const foremanId = scopedForeman(user);
      if (!target || (foremanId && !(await this.scaffolds.inForemanScope(scaffoldId, foremanId, tx)))) throw AppError.notFound('Scaffold');
      if (target.scaffold.archivedAt) throw new AppError(ErrorCode.Conflict, 'The scaffold is archived');
      const now = new Date();
      const { status, nextDueAt } = applyTrigger(now);
      // Closing is a stamped write of the tag: a phone's unseen offline tag then clashes with it, and closed stands.
      const tag = seenTagWrite(target.scaffold, status, { user, clientId: null, mutationId: null }, now);
      const row = await this.register.closeForTrigger(scaffoldId, { nextDueAt, ...tag, ...(input.kind === 'altered' ? { alteredAt: now } : {}) }, tx);
      const trigger = toScaffoldTrigger(
        await this.register.insertTrigger(
          { organisationId: user.organisationId, scaffoldId, kind: input.kind, note: input.note, recordedBy: user.userId, recordedAt: now },
          tx,
        ),
      );
      const scaffold = toScaffold(row);
      await this.audit.record(tx, user, {
        entityType: 'scaffold',
        entityId: scaffoldId,
        action: `trigger:${input.kind}`,
        before: toScaffold(target.scaffold),
        after: { ...scaffold, trigger },
      });
      return { scaffold, trigger };
    });
  }

  /** Scaffolds waiting on a trigger, never inspected, overdue or due today (in each site's time zone). */
  async due(user: AuthUser, query: RegisterDueQuery): Promise<RegisterDueList> {
    if (query.siteId && !(await this.sites.find(user.organisationId, query.siteId))) throw AppError.notFound('Site');
    const now = new Date();
    const candidates = await this.register.dueCandidates(user.organisationId, query.siteId, scopedForeman(user));
    const items = candidates
      .map((c) => toDueItem(c, now))
      .filter((item) => isOnDueList(item.state))
      .sort(compareDue);
    return { generatedAt: now.toISOString(), items };
  }
}
