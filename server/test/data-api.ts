import { randomUUID } from 'node:crypto';
import { type Role } from '@plummet/shared';
import { sql } from 'drizzle-orm';
import type { Db } from '../src/db/db.tokens.js';
import { DEMO_FINDINGS, DEMO_INSPECTIONS, DEMO_SCAFFOLDS, DEMO_SITES } from '../src/seed/demo-records.js';
import { addOtherOrgRoles, ALL_ROLE_USERS } from './fixtures.js';
import { api, type ApiAnswer } from './request.js';
import { startTestApp, type TestApp } from './test-app.js';

/** A caller: organisation and role, e.g. "demo:foreman". */
export type Who = `${'demo' | 'other'}:${Role}`;
export const EVERYONE: Who[] = ALL_ROLE_USERS.map((u) => `${u.org}:${u.role}` as Who);

/** The seeded records the tests lean on (server/src/seed/demo-records.ts). */
export const DEMO = {
  quaysideSite: DEMO_SITES[0].id,
  fennelSite: DEMO_SITES[1].id,
  otherSite: DEMO_SITES[2].id,
  /** QL-A: the demo foreman is responsible. */
  foremansScaffold: DEMO_SCAFFOLDS[0].id,
  /** QL-B: no foreman. */
  unmannedScaffold: DEMO_SCAFFOLDS[1].id,
  /** FS-1: pre-shift site, the demo foreman responsible. */
  preShiftScaffold: DEMO_SCAFFOLDS[2].id,
  /** FS-2: pre-shift site, no foreman. */
  loadingBayScaffold: DEMO_SCAFFOLDS[3].id,
  otherScaffold: DEMO_SCAFFOLDS[4].id,
  finishedInspection: DEMO_INSPECTIONS[0].id,
  openInspection: DEMO_INSPECTIONS[1].id,
  demoFindings: DEMO_FINDINGS.filter((f) => f.org === 'harrow-span').map((f) => f.id),
  otherFindings: DEMO_FINDINGS.filter((f) => f.org === 'other-build').map((f) => f.id),
};

export interface DataApi {
  t: TestApp;
  tokens: Record<Who, string>;
  userIds: Record<Who, string>;
  call(who: Who | null, method: string, path: string, body?: unknown): Promise<ApiAnswer>;
}

/** The server with the demo seeded and every role in both organisations signed in. */
export async function startDataApi(): Promise<DataApi> {
  const t = await startTestApp();
  await addOtherOrgRoles(t.drizzle);
  const tokens = {} as Record<Who, string>;
  const userIds = {} as Record<Who, string>;
  for (const u of ALL_ROLE_USERS) {
    const who = `${u.org}:${u.role}` as Who;
    tokens[who] = await t.tokenFor(u.email);
    userIds[who] = JSON.parse(Buffer.from(tokens[who].split('.')[1], 'base64url').toString()).sub;
  }
  return {
    t,
    tokens,
    userIds,
    call: (who, method, path, body) => api(t.baseUrl, method, path, { token: who ? tokens[who] : undefined, body }),
  };
}

export const LOOSE_AT_EDGE = { securing: 'loose', edgeDistance: 'at-edge', activity: 'light', wind: 'calm', footTraffic: 'frequent' } as const;

export const siteBody = (overrides: Record<string, unknown> = {}) => ({
  name: `Test site ${randomUUID().slice(0, 8)}`,
  address: '1 Sample Row, Testbury TB1 1AA',
  clientName: 'Sample Client Ltd',
  ...overrides,
});

export const scaffoldBody = (siteId: string, overrides: Record<string, unknown> = {}) => ({
  siteId,
  reference: `T-${randomUUID().slice(0, 6)}`,
  elevations: ['North', 'South'],
  lifts: 5,
  liftHeightM: 2,
  baysPerElevation: 10,
  ...overrides,
});

export const inspectionBody = (scaffoldId: string, overrides: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  scaffoldId,
  reason: 'scheduled',
  windSpeedMps: 4,
  ...overrides,
});

export const finishBody = (overrides: Record<string, unknown> = {}) => ({
  reportFor: 'Sample Client Ltd',
  location: 'Sample site, North elevation',
  equipment: 'Independent scaffold, 5 lifts',
  mattersGivingRisk: 'A loose coupler on lift 4',
  actionTaken: 'Coupler removed',
  furtherAction: 'None',
  reporterName: 'Aileen Marsh',
  reporterPosition: 'Scaffold inspector',
  ...overrides,
});

export const findingBody = (scaffoldId: string, overrides: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  scaffoldId,
  elevation: 'North',
  lift: 3,
  bay: 2,
  heightM: 6,
  item: { name: 'Loose coupler', massKg: 1.1 },
  exposure: 'public',
  likelihoodAnswers: LOOSE_AT_EDGE,
  ...overrides,
});

export const catalogueBody = (overrides: Record<string, unknown> = {}) => ({
  name: `Test item ${randomUUID().slice(0, 6)}`,
  category: 'fitting',
  massKg: 0.9,
  shape: { kind: 'box', lengthM: 0.1, widthM: 0.08, heightM: 0.06 },
  source: 'Weighed on site',
  ...overrides,
});

/** Creates through the API as `who`; throws unless it answers 2xx. */
export async function created<T = { id: string }>(api: DataApi, who: Who, method: string, path: string, body?: unknown): Promise<T> {
  const res = await api.call(who, method, path, body);
  if (res.status >= 300) throw new Error(`${method} ${path} as ${who} answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body as T;
}

const DATA_TABLES = ['sites', 'scaffolds', 'inspections', 'control_checks', 'findings', 'fixes', 'verifications', 'catalogue_items', 'audit_events', 'scaffold_triggers', 'exclusion_zones'] as const;

/** Row count and content fingerprint of every table of the inspection data: a refused request must change neither. */
export async function dataTablesDigest(db: Db): Promise<Record<string, string>> {
  const digest: Record<string, string> = {};
  for (const table of DATA_TABLES) {
    const result = await db.execute<{ n: number; d: string | null }>(
      sql.raw(`SELECT count(*)::int AS n, md5(coalesce(string_agg(t::text, '|' ORDER BY t::text), '')) AS d FROM ${table} t`),
    );
    digest[table] = `${result.rows[0].n}:${result.rows[0].d}`;
  }
  return digest;
}

export async function auditCount(db: Db): Promise<number> {
  const result = await db.execute<{ n: number }>(sql`SELECT count(*)::int AS n FROM audit_events`);
  return result.rows[0].n;
}
