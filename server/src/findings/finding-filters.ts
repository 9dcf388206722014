import { eq, inArray, type SQL, sql } from 'drizzle-orm';
import type { FindingExportQuery } from '@plummet/shared';
import { findings, scaffolds } from '../db/schema/index.js';

/** `%` and `_` typed by a user are letters, not wildcards. */
const likeText = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * The WHERE conditions of a findings list or export: the organisation, a foreman's scope and every
 * filter of the query. One place, so the export holds exactly the rows the list pages through.
 */
export function findingFilters(organisationId: string, query: Omit<FindingExportQuery, 'sort' | 'order'>, foremanId?: string): SQL[] {
  const scaffoldsWhere = (condition: SQL) =>
    sql`${findings.scaffoldId} in (select ${scaffolds.id} from ${scaffolds} where ${scaffolds.organisationId} = ${organisationId} and ${condition})`;
  const where: SQL[] = [eq(findings.organisationId, organisationId)];
  if (foremanId) where.push(sql`(${scaffoldsWhere(sql`${scaffolds.foremanId} = ${foremanId}`)} or ${findings.assigneeId} = ${foremanId})`);
  if (query.siteId) where.push(scaffoldsWhere(sql`${scaffolds.siteId} = ${query.siteId}`));
  if (query.scaffoldId) where.push(eq(findings.scaffoldId, query.scaffoldId));
  if (query.inspectionId) where.push(eq(findings.inspectionId, query.inspectionId));
  if (query.state) where.push(inArray(findings.state, query.state));
  if (query.riskBand) where.push(inArray(findings.riskBand, query.riskBand));
  if (query.assigneeId) where.push(eq(findings.assigneeId, query.assigneeId));
  const overdue = sql`(${findings.dueAt} < now() and ${findings.state} in ('open', 'made-safe'))`;
  if (query.overdue === true) where.push(overdue);
  if (query.overdue === false) where.push(sql`not coalesce(${overdue}, false)`);
  if (query.raisedFrom) where.push(sql`${findings.createdAt} >= ${query.raisedFrom}::timestamptz`);
  if (query.raisedTo) where.push(sql`${findings.createdAt} < ${query.raisedTo}::timestamptz`);
  if (query.q) {
    const pattern = likeText(query.q);
    where.push(sql`(${findings.itemName} ilike ${pattern} or ${findings.notes} ilike ${pattern})`);
  }
  return where;
}
