/**
 * The scopes a pull may be narrowed to, as SQL subqueries: a foreman's scope (the scaffolds they
 * look after or that carry findings assigned to them) and a site's (a first pull for one site, made
 * when a phone makes the site available offline). Both together: the foreman's part of that site.
 * Undefined: the caller's whole organisation.
 */
import { sql, type SQL } from 'drizzle-orm';

export interface PullScope {
  /** Set for a foreman: only their scope travels. */
  foremanId: string | undefined;
  /** Set for a site's first pull: only that site's records (and the organisation's catalogue and the caller's profile). */
  siteId?: string;
}

const foremanClause = (foremanId: string) => sql`(s.foreman_id = ${foremanId} or exists (select 1 from findings f where f.scaffold_id = s.id and f.assignee_id = ${foremanId}))`;

/** Scaffolds (not archived) in scope. */
export function scaffoldsInScope({ foremanId, siteId }: PullScope): SQL | undefined {
  if (!foremanId && !siteId) return undefined;
  const foreman = foremanId ? sql` and ${foremanClause(foremanId)}` : sql``;
  const site = siteId ? sql` and s.site_id = ${siteId}` : sql``;
  return sql`(select s.id from scaffolds s where s.archived_at is null${foreman}${site})`;
}

/** Findings in scope: on a foreman's scaffolds or assigned to them, and on the site. */
export function findingsInScope({ foremanId, siteId }: PullScope): SQL | undefined {
  if (!foremanId && !siteId) return undefined;
  const foreman = foremanId ? sql` and (s.foreman_id = ${foremanId} or f.assignee_id = ${foremanId})` : sql``;
  const site = siteId ? sql` and s.site_id = ${siteId}` : sql``;
  return sql`(select f.id from findings f join scaffolds s on s.id = f.scaffold_id where s.archived_at is null${foreman}${site})`;
}

/** Sites in scope: the site asked for; for a foreman, the sites of their scaffolds. */
export function sitesInScope(scope: PullScope): SQL | undefined {
  const scaffolds = scope.foremanId ? scaffoldsInScope(scope) : undefined;
  if (scaffolds) return sql`(select site_id from scaffolds where id in ${scaffolds})`;
  return scope.siteId ? sql`(select ${scope.siteId}::uuid)` : undefined;
}
