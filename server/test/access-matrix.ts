import { sql } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { auditCount, type DataApi, dataTablesDigest, EVERYONE, type Who } from './data-api.js';

/**
 * A role × route matrix: every route tried by every role of both organisations, against records
 * of the demo organisation. Expected statuses are written in the order of EVERYONE:
 *
 *   [demo admin, demo manager, demo inspector, demo foreman, other admin, other manager, other inspector, other foreman]
 *
 * Around every call: a refused call changes no row of the inspection data; an accepted write adds
 * an audit event; a list holds no record of another organisation.
 */
export interface AccessRow {
  route: string;
  /** The path and body for one caller; may first create a fresh target as someone allowed. */
  request(api: DataApi, who: Who): Promise<{ path: string; body?: unknown }>;
  expect: readonly [number, number, number, number, number, number, number, number];
  /** For lists: the table whose ids the items carry, to check that none belongs to another organisation. */
  listOf?: 'sites' | 'scaffolds' | 'inspections' | 'findings' | 'catalogue_items' | 'audit_events';
}

/** Ids among `ids` that belong to an organisation other than `organisationId` (built-in catalogue items belong to none). */
async function foreignIds(api: DataApi, table: NonNullable<AccessRow['listOf']>, ids: string[], organisationId: string): Promise<string[]> {
  if (ids.length === 0) return [];
  const idType = table === 'audit_events' ? 'bigint' : 'uuid';
  const result = await api.t.drizzle.execute<{ id: string }>(
    sql`SELECT id::text AS id FROM ${sql.raw(table)} WHERE id = ANY(${`{${ids.join(',')}}`}::${sql.raw(idType)}[]) AND organisation_id IS NOT NULL AND organisation_id <> ${organisationId}::uuid`,
  );
  return result.rows.map((r) => r.id);
}

export function describeAccessMatrix(title: string, getApi: () => DataApi, rows: AccessRow[]): void {
  describe(title, () => {
    const orgIds: Partial<Record<'demo' | 'other', string>> = {};
    beforeAll(async () => {
      const api = getApi();
      const result = await api.t.drizzle.execute<{ slug: string; id: string }>(sql`SELECT slug, id::text AS id FROM organisations`);
      for (const r of result.rows) orgIds[r.slug === 'harrow-span' ? 'demo' : 'other'] = r.id;
    });

    for (const row of rows) {
      EVERYONE.forEach((who, i) => {
        const status = row.expect[i];
        it(`${row.route} as ${who} answers ${status}`, async () => {
          const api = getApi();
          const { path, body } = await row.request(api, who);
          const method = row.route.split(' ')[0];
          const before = await dataTablesDigest(api.t.drizzle);
          const events = await auditCount(api.t.drizzle);
          const res = await api.call(who, method, path, body);
          expect(res.status, JSON.stringify(res.body)).toBe(status);
          if (status >= 400) {
            expect(typeof res.body.code).toBe('string');
            expect(await dataTablesDigest(api.t.drizzle)).toEqual(before);
          } else if (method !== 'GET') {
            expect(await auditCount(api.t.drizzle)).toBeGreaterThan(events);
          }
          if (row.listOf && status === 200) {
            const ids = (res.body.items as { id: string }[]).map((item) => item.id);
            expect(await foreignIds(api, row.listOf, ids, orgIds[who.startsWith('demo') ? 'demo' : 'other']!)).toEqual([]);
          }
        });
      });
    }
  });
}
