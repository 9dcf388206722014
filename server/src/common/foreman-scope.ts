/**
 * A foreman's scope on the REST reads, the same as the change feed's (sync/sync-feed-tables.ts):
 * the scaffolds they look after or that carry findings assigned to them, what hangs off those,
 * and the findings on them or assigned to them. Managers, admins and inspectors see the whole
 * organisation. Out-of-scope records answer as if they did not exist (404), like another
 * organisation's.
 */
import { sql, type SQL } from 'drizzle-orm';
import type { AuthUser } from '../auth/auth.types.js';
import { foremanFindings, foremanScaffolds } from '../sync/sync-feed-tables.js';

/** The caller's id when their reads are scoped (a foreman), else undefined. */
export function scopedForeman(user: AuthUser): string | undefined {
  return user.role === 'foreman' ? user.userId : undefined;
}

/** `scaffoldId` (a column or value) is one of the foreman's scaffolds. */
export function scaffoldInScope(scaffoldId: SQL | unknown, foremanId: string): SQL {
  return sql`${scaffoldId} in ${foremanScaffolds(foremanId)}`;
}

/** A photo row (its owner type and id columns) belongs to a record in the foreman's scope. */
export function photoInScope(ownerType: unknown, ownerId: unknown, foremanId: string): SQL {
  const scaffoldsOf = foremanScaffolds(foremanId);
  const findingsOf = foremanFindings(foremanId);
  return sql`((${ownerType} = 'finding' and ${ownerId} in ${findingsOf})
    or (${ownerType} = 'fix' and ${ownerId} in (select id from fixes where finding_id in ${findingsOf}))
    or (${ownerType} = 'verification' and ${ownerId} in (select id from verifications where finding_id in ${findingsOf}))
    or (${ownerType} = 'control-check' and ${ownerId} in (select c.id from control_checks c join inspections i on i.id = c.inspection_id where i.scaffold_id in ${scaffoldsOf})))`;
}
