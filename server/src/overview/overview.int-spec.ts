import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { DEMO, type DataApi, startDataApi } from '../../test/data-api.js';
import { insertConflict, insertFinding, insertFix, insertScaffold, insertSite, insertVerification, orgIdOf } from '../../test/manager-fixtures.js';

let api: DataApi;
/** A site built by hand in the demo organisation; every expected count below is counted from this list. */
let site: string;
let scaffoldA: string;
let verifiedAt: Date;

beforeAll(async () => {
  api = await startDataApi();
  const db = api.t.drizzle;
  const org = await orgIdOf(db, 'harrow-span');
  site = await insertSite(db, org, 'Aggregate Test Yard');
  scaffoldA = await insertScaffold(db, org, site, 'cleared', 'past');
  const scaffoldB = await insertScaffold(db, org, site, 'closed', 'later-today');
  const scaffoldC = await insertScaffold(db, org, site, 'limited', 'in-3-days');
  await insertScaffold(db, org, site, 'cleared', null);

  const f1 = await insertFinding(db, org, scaffoldA, { band: 'High', state: 'open', dueInHours: -2, raisedHoursAgo: 5, lift: 2, bay: 4 });
  await insertFinding(db, org, scaffoldA, { band: 'High', state: 'made-safe', dueInHours: 5, raisedHoursAgo: 30, lift: 2, bay: 4, elevation: 'South' });
  const f3 = await insertFinding(db, org, scaffoldA, { band: 'Medium', state: 'open', raisedHoursAgo: 50, lift: 2, bay: 4 });
  const f4 = await insertFinding(db, org, scaffoldA, { band: 'Low', state: 'fixed', raisedHoursAgo: 20, lift: 3, bay: 1 });
  const f5 = await insertFinding(db, org, scaffoldB, { band: 'Medium', state: 'fixed', raisedHoursAgo: 40, lift: 3, bay: 1 });
  const f6 = await insertFinding(db, org, scaffoldA, { band: 'Low', state: 'verified', raisedHoursAgo: 40 * 24, lift: 5, bay: 5 });
  await insertFinding(db, org, scaffoldC, { band: 'Medium', state: 'open', dueInHours: -1, raisedHoursAgo: 2 });
  await insertFix(db, org, f4, 10);
  await insertFix(db, org, f5, 30);
  await insertFix(db, org, f6, 30);
  verifiedAt = new Date(Date.now() - 3_600_000);
  await insertVerification(db, f6, 'verified', verifiedAt.toISOString());
  // Verified a second time in the same week: still one finding closed that week.
  await insertVerification(db, f6, 'verified', verifiedAt.toISOString());
  // First fixed before the period (100 days ago), fixed again within it: not a first fix of the period.
  const f8 = await insertFinding(db, org, scaffoldA, { band: 'High', state: 'verified', raisedHoursAgo: 100 * 24, lift: 7, bay: 7 });
  await insertFix(db, org, f8, 1);
  await insertFix(db, org, f8, 99 * 24);
  await insertConflict(db, org, f1, 'open');
  await insertConflict(db, org, f3, 'resolved');
});
afterAll(async () => {
  await api?.t.close();
});

describeAccessMatrix('overview, trends and reports: every route by every role of both organisations', () => api, [
  { route: 'GET /overview', request: async () => ({ path: '/overview' }), expect: [200, 200, 403, 403, 200, 200, 403, 403] },
  { route: 'GET /overview?siteId', request: async () => ({ path: `/overview?siteId=${DEMO.quaysideSite}` }), expect: [200, 200, 403, 403, 404, 404, 403, 403] },
  { route: 'GET /overview/people', request: async () => ({ path: '/overview/people' }), expect: [200, 200, 200, 403, 200, 200, 200, 403] },
  { route: 'GET /trends', request: async () => ({ path: '/trends' }), expect: [200, 200, 403, 403, 200, 200, 403, 403] },
  { route: 'GET /trends?siteId', request: async () => ({ path: `/trends?siteId=${DEMO.quaysideSite}` }), expect: [200, 200, 403, 403, 404, 404, 403, 403] },
  {
    route: 'GET /reports/scaffold',
    request: async () => ({ path: `/reports/scaffold?scaffoldId=${DEMO.foremansScaffold}` }),
    expect: [200, 200, 200, 403, 404, 404, 404, 403],
  },
]);

describe('the overview of a hand-built site', () => {
  it('counts open findings by band, overdue fixes, fixes waiting for verification and open conflicts', async () => {
    const res = await api.call('demo:manager', 'GET', `/overview?siteId=${site}`);
    expect(res.status).toBe(200);
    const totals = res.body.totals;
    // Open or made safe: two High (1, 2), two Medium (3, 7), no Low (4 and 5 are fixed, 6 verified).
    expect(totals.openByBand).toEqual({ Low: 0, Medium: 2, High: 2 });
    // Past due and not yet fixed: findings 1 and 7.
    expect(totals.overdueFixes).toBe(2);
    // Fixed, not verified: findings 4 and 5.
    expect(totals.waitingVerification).toBe(2);
    // One open conflict (on 1); the one on 3 is settled.
    expect(totals.openConflicts).toBe(1);
  });

  it('counts scaffolds by tag status and their inspections due later today and overdue', async () => {
    const res = await api.call('demo:admin', 'GET', `/overview?siteId=${site}`);
    expect(res.body.totals.scaffoldsByStatus).toEqual([
      { status: 'cleared', count: 2 },
      { status: 'limited', count: 1 },
      { status: 'closed', count: 1 },
    ]);
    expect(res.body.totals.inspectionsDueToday).toBe(1);
    expect(res.body.totals.inspectionsOverdue).toBe(1);
    expect(res.body.sites).toHaveLength(1);
    expect(res.body.sites[0]).toMatchObject({ siteId: site, siteName: 'Aggregate Test Yard', overdueFixes: 2 });
  });

  it('adds every site up into the organisation’s totals, which match counts taken straight from the database', async () => {
    const res = await api.call('demo:manager', 'GET', '/overview');
    const org = await orgIdOf(api.t.drizzle, 'harrow-span');
    const counted = await api.t.drizzle.execute<{ band: string; n: number }>(sql`
      SELECT risk_band AS band, count(*)::int AS n FROM findings
      WHERE organisation_id = ${org} AND state IN ('open', 'made-safe') GROUP BY risk_band`);
    for (const band of ['Low', 'Medium', 'High'] as const) {
      expect(res.body.totals.openByBand[band]).toBe(counted.rows.find((r) => r.band === band)?.n ?? 0);
      expect(res.body.totals.openByBand[band]).toBe(res.body.sites.reduce((sum: number, s: { openByBand: Record<string, number> }) => sum + s.openByBand[band], 0));
    }
    expect(res.body.sites.map((s: { siteId: string }) => s.siteId)).toContain(site);
  });

  it('shows another organisation none of these sites, and answers 404 for the site itself', async () => {
    const res = await api.call('other:manager', 'GET', '/overview');
    expect(res.body.sites.map((s: { siteId: string }) => s.siteId)).not.toContain(site);
    expect((await api.call('other:manager', 'GET', `/overview?siteId=${site}`)).status).toBe(404);
    expect((await api.call('other:admin', 'GET', `/trends?siteId=${site}`)).status).toBe(404);
  });

  it('refuses a site id that is not an id with a 400 naming the field', async () => {
    const res = await api.call('demo:manager', 'GET', '/overview?siteId=nope');
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.issues)).toContain('siteId');
  });
});

describe('the people a manager assigns to', () => {
  it('are the organisation’s members with their roles, and nobody of another organisation', async () => {
    const res = await api.call('demo:manager', 'GET', '/overview/people');
    const ids = res.body.items.map((p: { id: string }) => p.id);
    expect(ids).toContain(api.userIds['demo:foreman']);
    expect(ids).not.toContain(api.userIds['other:foreman']);
    expect(res.body.items.find((p: { id: string }) => p.id === api.userIds['demo:foreman']).role).toBe('foreman');
  });
});

describe('the trends of a hand-built site', () => {
  it('counts every finding raised in the period by band, week by week', async () => {
    const res = await api.call('demo:manager', 'GET', `/trends?siteId=${site}&weeks=12`);
    expect(res.status).toBe(200);
    expect(res.body.weeks).toHaveLength(12);
    const sum = (band: string) => res.body.weeks.reduce((n: number, w: { raised: Record<string, number> }) => n + w.raised[band], 0);
    // Raised within 12 weeks: High 1, 2; Medium 3, 5, 7; Low 4, 6 (40 days ago).
    expect({ High: sum('High'), Medium: sum('Medium'), Low: sum('Low') }).toEqual({ High: 2, Medium: 3, Low: 2 });
  });

  it('counts a verified finding as closed in the week of its verification, once however often it was verified', async () => {
    const res = await api.call('demo:manager', 'GET', `/trends?siteId=${site}`);
    const week = res.body.weeks.find((w: { weekStart: string }) => {
      const start = Date.parse(w.weekStart);
      return start <= verifiedAt.getTime() && verifiedAt.getTime() < start + 7 * 86_400_000;
    });
    expect(week.closed).toEqual({ Low: 1, Medium: 0, High: 0 });
    const closed = res.body.weeks.reduce((n: number, w: { closed: Record<string, number> }) => n + w.closed.Low + w.closed.Medium + w.closed.High, 0);
    expect(closed).toBe(1);
  });

  it('gives the median time to the first fix by band (Low: 10 h and 30 h, median 20 h), leaving out findings first fixed before the period', async () => {
    const res = await api.call('demo:manager', 'GET', `/trends?siteId=${site}`);
    expect(res.body.timeToFix).toEqual([
      { band: 'Low', medianHours: 20, fixes: 2 },
      { band: 'Medium', medianHours: 30, fixes: 1 },
      { band: 'High', medianHours: null, fixes: 0 },
    ]);
  });

  it('keeps each finding’s first fix time as the earliest of its fixes, whichever arrives first or is removed', async () => {
    const db = api.t.drizzle;
    const org = await orgIdOf(db, 'harrow-span');
    const f = await insertFinding(db, org, scaffoldA, { band: 'Low', state: 'verified', raisedHoursAgo: 100, lift: 9, bay: 9 });
    const firstFix = async () =>
      (await db.execute<{ hours: number | null }>(sql`SELECT date_part('epoch', first_fixed_at - created_at) / 3600 AS hours FROM findings WHERE id = ${f}`)).rows[0].hours;
    expect(await firstFix()).toBeNull();
    await insertFix(db, org, f, 50);
    expect(await firstFix()).toBe(50);
    await insertFix(db, org, f, 5); // recorded offline earlier, synced later
    expect(await firstFix()).toBe(5);
    await db.execute(sql`DELETE FROM fixes WHERE finding_id = ${f} AND fixed_at = (SELECT created_at FROM findings WHERE id = ${f}) + interval '5 hours'`);
    expect(await firstFix()).toBe(50);
    await db.execute(sql`DELETE FROM findings WHERE id = ${f}`);
  });

  it('lists the same scaffold, lift and bay with three findings in 30 days as a repeat location, and nothing with fewer', async () => {
    const res = await api.call('demo:manager', 'GET', `/trends?siteId=${site}`);
    expect(res.body.repeatLocations).toHaveLength(1);
    expect(res.body.repeatLocations[0]).toMatchObject({ scaffoldId: scaffoldA, lift: 2, bay: 4, findings: 3, elevations: ['North', 'South'], siteName: 'Aggregate Test Yard' });
  });

  it('refuses a period of zero weeks', async () => {
    expect((await api.call('demo:manager', 'GET', '/trends?weeks=0')).status).toBe(400);
  });
});

describe('the reports of a scaffold', () => {
  it('lists its inspections with inspector, reason and findings count, newest first', async () => {
    const res = await api.call('demo:manager', 'GET', `/reports/scaffold?scaffoldId=${DEMO.foremansScaffold}`);
    expect(res.status).toBe(200);
    const counted = await api.t.drizzle.execute<{ id: string; n: number }>(sql`
      SELECT i.id::text AS id, (SELECT count(*)::int FROM findings f WHERE f.inspection_id = i.id) AS n
      FROM inspections i WHERE i.scaffold_id = ${DEMO.foremansScaffold}`);
    expect(res.body.items).toHaveLength(counted.rows.length);
    for (const item of res.body.items) {
      expect(item.findingsCount).toBe(counted.rows.find((r) => r.id === item.inspectionId)!.n);
      expect(item.inspectorName.length).toBeGreaterThan(0);
    }
    const starts = res.body.items.map((i: { startedAt: string }) => i.startedAt);
    expect([...starts].sort().reverse()).toEqual(starts);
  });

  it('answers 404 for a scaffold of another organisation', async () => {
    expect((await api.call('demo:manager', 'GET', `/reports/scaffold?scaffoldId=${DEMO.otherScaffold}`)).status).toBe(404);
  });
});
