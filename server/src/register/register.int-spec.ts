import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { created, DEMO, type DataApi, finishBody, inspectionBody, scaffoldBody, siteBody, startDataApi } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

/** A fresh scaffold of the demo organisation, looked after by the demo foreman. */
async function foremansNewScaffold(a: DataApi, siteId: string = DEMO.quaysideSite): Promise<string> {
  return (await created(a, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(siteId, { foremanId: a.userIds['demo:foreman'] }))).id;
}

/** Inspects and signs a scaffold as the demo inspector, recording `outcome`. */
async function inspect(a: DataApi, scaffoldId: string, outcome: Record<string, unknown>, reason = 'scheduled', finishedAt?: string) {
  const inspection = await created(a, 'demo:inspector', 'POST', '/inspections', inspectionBody(scaffoldId, { reason }));
  const res = await a.call('demo:inspector', 'POST', `/inspections/${inspection.id}/finish`, finishBody({ ...outcome, ...(finishedAt ? { finishedAt } : {}) }));
  return { id: inspection.id, res };
}

const dueOf = async (who: Parameters<DataApi['call']>[0], query = '') => (await api.call(who, 'GET', `/register/due${query}`)).body.items as Record<string, unknown>[];

describeAccessMatrix('register: every route by every role of both organisations', () => api, [
  {
    route: 'POST /scaffolds/:id/trigger',
    request: async (a) => ({ path: `/scaffolds/${await foremansNewScaffold(a)}/trigger`, body: { kind: 'altered', note: 'Ties moved on lift 3' } }),
    expect: [201, 201, 201, 201, 404, 404, 404, 404],
  },
  { route: 'GET /register/due', request: async () => ({ path: '/register/due' }), expect: [200, 200, 200, 200, 200, 200, 200, 200] },
  {
    route: 'GET /register/due?siteId',
    request: async () => ({ path: `/register/due?siteId=${DEMO.quaysideSite}` }),
    expect: [200, 200, 200, 200, 404, 404, 404, 404],
  },
]);

describe('triggers (UK WAHR 2005 reg. 12(4)(b): inspect after an alteration or adverse weather)', () => {
  it('closes an altered scaffold, makes its inspection due now and records who did it', async () => {
    const scaffoldId = await foremansNewScaffold(api);
    await inspect(api, scaffoldId, { tagStatus: 'cleared', accessTagsChanged: true }, 'handover');
    const before = await api.call('demo:manager', 'GET', `/scaffolds/${scaffoldId}`);
    expect(before.body.status).toBe('cleared');

    const t0 = Date.now();
    const res = await api.call('demo:foreman', 'POST', `/scaffolds/${scaffoldId}/trigger`, { kind: 'altered', note: 'Loading bay added on lift 2' });
    expect(res.status).toBe(201);
    expect(res.body.scaffold.status).toBe('closed');
    expect(Math.abs(Date.parse(res.body.scaffold.nextDueAt) - t0)).toBeLessThan(60_000);
    expect(res.body.trigger).toMatchObject({ kind: 'altered', note: 'Loading bay added on lift 2', recordedBy: api.userIds['demo:foreman'], answeredBy: null });

    const audit = await api.call('demo:admin', 'GET', `/audit?entityId=${scaffoldId}`);
    expect(audit.body.items[0]).toMatchObject({ action: 'trigger:altered', before: { status: 'cleared' }, after: { status: 'closed' } });

    const item = (await dueOf('demo:inspector')).find((i) => i.scaffoldId === scaffoldId);
    expect(item).toMatchObject({
      state: 'before-use',
      status: 'closed',
      suggestedReason: 'after-alteration',
      trigger: { kind: 'altered', regulation: 'UK WAHR 2005 reg. 12(4)(b)' },
    });
  });

  it('closes a scaffold after adverse weather, and the next signed inspection answers it', async () => {
    const scaffoldId = await foremansNewScaffold(api);
    await created(api, 'demo:inspector', 'POST', `/scaffolds/${scaffoldId}/trigger`, { kind: 'adverse-weather', note: 'Gusts over 20 m/s overnight' });
    expect((await dueOf('demo:manager')).find((i) => i.scaffoldId === scaffoldId)).toMatchObject({ state: 'before-use', suggestedReason: 'after-bad-weather' });

    const { id, res } = await inspect(api, scaffoldId, { tagStatus: 'limited', restriction: 'Lifts 1–3 only; top lift unboarded', accessTagsChanged: true }, 'after-bad-weather');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ reason: 'after-bad-weather', tagStatus: 'limited', restriction: 'Lifts 1–3 only; top lift unboarded', accessTagsChanged: true });
    const scaffold = await api.call('demo:manager', 'GET', `/scaffolds/${scaffoldId}`);
    expect(scaffold.body.status).toBe('limited');
    const trigger = await api.t.drizzle.execute<{ answered_by: string }>(sql`SELECT answered_by::text FROM scaffold_triggers WHERE scaffold_id = ${scaffoldId}`);
    expect(trigger.rows).toEqual([{ answered_by: id }]);
    expect((await dueOf('demo:manager')).some((i) => i.scaffoldId === scaffoldId)).toBe(false);
  });

  it("refuses a foreman on a scaffold outside their scope as if it did not exist, and changes nothing", async () => {
    const res = await api.call('demo:foreman', 'POST', `/scaffolds/${DEMO.unmannedScaffold}/trigger`, { kind: 'altered', note: 'Moved a tie' });
    expect(res.status).toBe(404);
    const rows = await api.t.drizzle.execute(sql`SELECT 1 FROM scaffold_triggers WHERE scaffold_id = ${DEMO.unmannedScaffold}`);
    expect(rows.rows).toHaveLength(0);
  });

  it('answers each bad body with the field named', async () => {
    const scaffoldId = await foremansNewScaffold(api);
    const bad = await api.call('demo:manager', 'POST', `/scaffolds/${scaffoldId}/trigger`, { kind: 'earthquake', note: '' });
    expect(bad.status).toBe(400);
    expect(bad.body.issues.map((i: { path: string[] }) => i.path.join('.')).sort()).toEqual(['kind', 'note']);
    const archived = await foremansNewScaffold(api);
    await created(api, 'demo:admin', 'POST', `/scaffolds/${archived}/archive`);
    expect((await api.call('demo:manager', 'POST', `/scaffolds/${archived}/trigger`, { kind: 'altered', note: 'x' })).status).toBe(409);
  });
});

describe('the inspection outcome', () => {
  it('needs the restriction in words when limited, and writes nothing without it', async () => {
    const scaffoldId = await foremansNewScaffold(api);
    const { id, res } = await inspect(api, scaffoldId, { tagStatus: 'limited', restriction: ' ', accessTagsChanged: true });
    expect(res.status).toBe(400);
    expect(res.body.issues.map((i: { path: string[] }) => i.path.join('.'))).toEqual(['restriction']);
    const stored = await api.call('demo:inspector', 'GET', `/inspections/${id}`);
    expect(stored.body).toMatchObject({ finishedAt: null, tagStatus: null });
  });

  it('records the reason "before the shift" (US OSHA 29 CFR 1926.451(f)(3)) and the tag status given', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody({ regime: 'pre-shift', timeZone: 'America/New_York' }));
    const scaffoldId = await foremansNewScaffold(api, site.id);
    const { res } = await inspect(api, scaffoldId, { tagStatus: 'closed', accessTagsChanged: false }, 'pre-shift');
    expect(res.body).toMatchObject({ reason: 'pre-shift', tagStatus: 'closed', accessTagsChanged: false });
  });

  it('leaves the tag status as it was when a finish queued before the outcome was asked for arrives', async () => {
    const scaffoldId = await foremansNewScaffold(api);
    const { res } = await inspect(api, scaffoldId, {});
    expect(res.body).toMatchObject({ tagStatus: null, restriction: '', accessTagsChanged: null });
    expect((await api.call('demo:manager', 'GET', `/scaffolds/${scaffoldId}`)).body.status).toBe('closed');
  });
});

describe('the due list', () => {
  it('lists overdue, due-today and never-inspected scaffolds with the regime named, not later or archived ones', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody({ regime: '7-day', timeZone: 'Europe/London' }));
    const [overdue, today, later, fresh, archived] = await Promise.all([1, 2, 3, 4, 5].map(() => foremansNewScaffold(api, site.id)));
    for (const id of [overdue, today, later, archived]) await inspect(api, id, { tagStatus: 'cleared', accessTagsChanged: true });
    await api.t.drizzle.execute(sql`UPDATE scaffolds SET next_due_at = now() - interval '1 hour' WHERE id IN (${overdue}, ${archived})`);
    // Later today in London, whatever the hour the test runs: a minute from now, unless that is past midnight.
    await api.t.drizzle.execute(sql`UPDATE scaffolds SET next_due_at = least(now() + interval '1 minute',
      date_trunc('day', now() AT TIME ZONE 'Europe/London') AT TIME ZONE 'Europe/London' + interval '1 day' - interval '1 second') WHERE id = ${today}`);
    await created(api, 'demo:admin', 'POST', `/scaffolds/${archived}/archive`);

    const items = await dueOf('demo:inspector', `?siteId=${site.id}`);
    const byId = new Map(items.map((i) => [i.scaffoldId, i]));
    expect(byId.get(overdue)).toMatchObject({ state: 'overdue', regime: '7-day', regulation: 'UK WAHR 2005 reg. 12(4)(a)', status: 'cleared' });
    expect(byId.get(fresh)).toMatchObject({ state: 'first-inspection', suggestedReason: 'handover', status: 'closed' });
    expect(byId.has(later)).toBe(false);
    expect(byId.has(archived)).toBe(false);
    // The minute may run out under load; either way it is on the list.
    expect(['due-today', 'overdue']).toContain(byId.get(today)?.state);
    expect(items.map((i) => i.state)).toEqual([...items.map((i) => i.state)].sort((a, b) => ORDER.indexOf(a as string) - ORDER.indexOf(b as string)));
  });

  it('names the pre-shift regime (US OSHA 29 CFR 1926.451(f)(3)) for a pre-shift site', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody({ regime: 'pre-shift', timeZone: 'America/New_York' }));
    const scaffoldId = await foremansNewScaffold(api, site.id);
    expect((await dueOf('demo:manager', `?siteId=${site.id}`))[0]).toMatchObject({ scaffoldId, regime: 'pre-shift', regulation: 'US OSHA 29 CFR 1926.451(f)(3)' });
  });

  it("keeps each organisation's list to its own scaffolds, and a foreman's to their scope", async () => {
    const otherFresh = await created(api, 'other:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.otherSite));
    await created(api, 'demo:manager', 'POST', `/scaffolds/${DEMO.unmannedScaffold}/trigger`, { kind: 'adverse-weather', note: 'Storm' });
    const demoIds = new Set((await dueOf('demo:admin')).map((i) => i.scaffoldId));
    const otherIds = new Set((await dueOf('other:admin')).map((i) => i.scaffoldId));
    expect(otherIds.has(otherFresh.id)).toBe(true);
    expect(demoIds.has(otherFresh.id)).toBe(false);
    expect([...otherIds].filter((id) => demoIds.has(id))).toEqual([]);
    expect(demoIds.has(DEMO.unmannedScaffold)).toBe(true);
    const foremans = await dueOf('demo:foreman');
    expect(foremans.some((i) => i.scaffoldId === DEMO.unmannedScaffold)).toBe(false);
  });
});

const ORDER = ['before-use', 'first-inspection', 'overdue', 'due-today', 'later'];
