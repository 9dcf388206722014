import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { startOfNextDay } from '@plummet/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { api as apiCall } from '../../test/request.js';
import { memberships, organisations, users } from '../db/schema/index.js';
import { created, DEMO, type DataApi, finishBody, inspectionBody, scaffoldBody, siteBody, startDataApi } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

const openInspection = async (a: DataApi, scaffoldId = DEMO.foremansScaffold) =>
  (await created(a, 'demo:inspector', 'POST', '/inspections', inspectionBody(scaffoldId))).id;

describeAccessMatrix('inspections: every route by every role of both organisations', () => api, [
  { route: 'GET /inspections', request: async () => ({ path: '/inspections' }), expect: [200, 200, 200, 200, 200, 200, 200, 200], listOf: 'inspections' },
  {
    route: 'GET /inspections/:id',
    request: async () => ({ path: `/inspections/${DEMO.finishedInspection}` }),
    expect: [200, 200, 200, 200, 404, 404, 404, 404],
  },
  {
    route: 'POST /inspections',
    request: async () => ({ path: '/inspections', body: inspectionBody(DEMO.foremansScaffold) }),
    expect: [403, 403, 201, 403, 403, 403, 404, 403],
  },
  {
    route: 'PATCH /inspections/:id',
    request: async () => ({ path: `/inspections/${DEMO.openInspection}`, body: { equipment: 'Perimeter scaffold with fan, 5 lifts' } }),
    expect: [403, 403, 200, 403, 403, 403, 404, 403],
  },
  {
    route: 'POST /inspections/:id/finish',
    request: async (a) => ({ path: `/inspections/${await openInspection(a)}/finish`, body: finishBody() }),
    expect: [403, 403, 200, 403, 403, 403, 404, 403],
  },
  {
    route: 'PUT /inspections/:id/control-checks/:control',
    request: async () => ({ path: `/inspections/${DEMO.openInspection}/control-checks/toe-boards`, body: { result: 'pass' } }),
    expect: [403, 403, 200, 403, 403, 403, 404, 403],
  },
]);

describe('starting an inspection with the phone’s id', () => {
  it('answers 201 the first time and 200 with the same record when the same body comes again', async () => {
    const body = inspectionBody(DEMO.unmannedScaffold, { startedAt: '2026-03-02T07:45:00Z' });
    const first = await api.call('demo:inspector', 'POST', '/inspections', body);
    const again = await api.call('demo:inspector', 'POST', '/inspections', body);
    expect([first.status, again.status]).toEqual([201, 200]);
    expect(again.body).toEqual(first.body);
  });

  it('answers 409 when the id comes again with another body', async () => {
    const body = inspectionBody(DEMO.unmannedScaffold);
    await created(api, 'demo:inspector', 'POST', '/inspections', body);
    const res = await api.call('demo:inspector', 'POST', '/inspections', { ...body, reason: 'handover' });
    expect(res.status).toBe(409);
  });

  it('answers 404 when another organisation already used the id, revealing nothing', async () => {
    const body = inspectionBody(DEMO.otherScaffold);
    await created(api, 'other:inspector', 'POST', '/inspections', body);
    const res = await api.call('demo:inspector', 'POST', '/inspections', { ...body, scaffoldId: DEMO.unmannedScaffold });
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain(DEMO.otherScaffold);
  });
});

describe('finishing an inspection', () => {
  it('signs the report and puts the next inspection of a 7-day site seven days after the finish', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody({ regime: '7-day' }));
    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id));
    const id = await openInspection(api, scaffold.id);
    const res = await api.call('demo:inspector', 'POST', `/inspections/${id}/finish`, finishBody({ signature: 'M0 0 L10 10', finishedAt: '2099-05-06T16:00:00Z' }));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ finishedAt: '2099-05-06T16:00:00.000Z', signedAt: '2099-05-06T16:00:00.000Z', reporterName: 'Aileen Marsh' });
    const after = await api.call('demo:inspector', 'GET', `/scaffolds/${scaffold.id}`);
    expect(after.body).toMatchObject({ lastInspectedAt: '2099-05-06T16:00:00.000Z', nextDueAt: '2099-05-13T16:00:00.000Z', version: 2 });
  });

  it('puts the next inspection of a pre-shift site at the start of the next local day', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody({ regime: 'pre-shift', timeZone: 'America/Chicago' }));
    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id));
    const id = await openInspection(api, scaffold.id);
    await created(api, 'demo:inspector', 'POST', `/inspections/${id}/finish`, finishBody({ finishedAt: '2099-01-10T03:00:00Z' }));
    const after = await api.call('demo:inspector', 'GET', `/scaffolds/${scaffold.id}`);
    // 03:00Z on 10 January is 21:00 on 9 January in Chicago (CST, UTC−6): next local day starts 10 January 06:00Z.
    expect(after.body.nextDueAt).toBe('2099-01-10T06:00:00.000Z');
    expect(after.body.nextDueAt).toBe(startOfNextDay(new Date('2099-01-10T03:00:00Z'), 'America/Chicago').toISOString());
  });

  it('accepts the same finish again, refuses another one, and refuses changes once signed', async () => {
    const id = await openInspection(api);
    const body = finishBody({ finishedAt: new Date().toISOString() });
    await created(api, 'demo:inspector', 'POST', `/inspections/${id}/finish`, body);
    expect((await api.call('demo:inspector', 'POST', `/inspections/${id}/finish`, body)).status).toBe(200);
    expect((await api.call('demo:inspector', 'POST', `/inspections/${id}/finish`, { ...body, actionTaken: 'Other' })).status).toBe(409);
    expect((await api.call('demo:inspector', 'PATCH', `/inspections/${id}`, { location: 'Elsewhere' })).status).toBe(409);
    expect((await api.call('demo:inspector', 'PUT', `/inspections/${id}/control-checks/brick-guards`, { result: 'fail' })).status).toBe(409);
  });

  it('requires every statutory report field, naming the missing ones', async () => {
    const id = await openInspection(api);
    const res = await api.call('demo:inspector', 'POST', `/inspections/${id}/finish`, { reportFor: 'Client', location: '' });
    expect(res.status).toBe(400);
    const fields = res.body.issues.map((i: { path: string[] }) => i.path[0]);
    expect(fields).toEqual(expect.arrayContaining(['location', 'equipment', 'mattersGivingRisk', 'actionTaken', 'furtherAction', 'reporterName', 'reporterPosition']));
  });

  it('does not move the scaffold dates back when an older inspection is finished late', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody());
    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id));
    const older = await openInspection(api, scaffold.id);
    const newer = await openInspection(api, scaffold.id);
    await created(api, 'demo:inspector', 'POST', `/inspections/${newer}/finish`, finishBody({ finishedAt: '2099-02-10T10:00:00Z' }));
    await created(api, 'demo:inspector', 'POST', `/inspections/${older}/finish`, finishBody({ finishedAt: '2099-02-03T10:00:00Z' }));
    const after = await api.call('demo:inspector', 'GET', `/scaffolds/${scaffold.id}`);
    expect(after.body.lastInspectedAt).toBe('2099-02-10T10:00:00.000Z');
  });
});

describe('an inspection of another inspector', () => {
  it('can be read by the organisation but changed only by the inspector who carries it out (403)', async () => {
    const [user] = await api.t.drizzle.insert(users).values({ email: 'second-inspector@demo.test', name: 'Second Inspector' }).returning();
    const [org] = await api.t.drizzle.select().from(organisations).where(eq(organisations.slug, 'harrow-span'));
    await api.t.drizzle.insert(memberships).values({ userId: user.id, organisationId: org.id, role: 'inspector' });
    const token = await api.t.tokenFor('second-inspector@demo.test');
    const id = await openInspection(api);
    const as2 = (method: string, path: string, body?: unknown) => apiCall(api.t.baseUrl, method, path, { token, body });
    expect((await as2('GET', `/inspections/${id}`)).status).toBe(200);
    expect((await as2('PATCH', `/inspections/${id}`, { location: 'Elsewhere' })).status).toBe(403);
    expect((await as2('POST', `/inspections/${id}/finish`, finishBody())).status).toBe(403);
    expect((await as2('PUT', `/inspections/${id}/control-checks/toe-boards`, { result: 'pass' })).status).toBe(403);
  });
});

describe('control checks', () => {
  it('keeps one answer per control, replacing it and bumping its version', async () => {
    const id = await openInspection(api);
    const first = await api.call('demo:inspector', 'PUT', `/inspections/${id}/control-checks/tool-tethering`, { result: 'fail', note: 'Podgers untethered' });
    const second = await api.call('demo:inspector', 'PUT', `/inspections/${id}/control-checks/tool-tethering`, { result: 'pass' });
    expect(second.body).toMatchObject({ id: first.body.id, result: 'pass', note: '', version: 2 });
    const detail = await api.call('demo:foreman', 'GET', `/inspections/${id}`);
    expect(detail.body.controlChecks).toHaveLength(1);
    expect(detail.body.controlChecks[0]).toMatchObject({ control: 'tool-tethering', result: 'pass' });
  });

  it('answers 404 for a control that does not exist and 400 for a result that does not', async () => {
    const id = await openInspection(api);
    expect((await api.call('demo:inspector', 'PUT', `/inspections/${id}/control-checks/handrails`, { result: 'pass' })).status).toBe(404);
    expect((await api.call('demo:inspector', 'PUT', `/inspections/${id}/control-checks/toe-boards`, { result: 'ok' })).status).toBe(400);
  });
});

describe('listing inspections', () => {
  it('filters by scaffold, site and finished, newest first', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody());
    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id));
    const a = await created(api, 'demo:inspector', 'POST', '/inspections', inspectionBody(scaffold.id, { startedAt: '2099-01-01T08:00:00Z' }));
    const b = await created(api, 'demo:inspector', 'POST', '/inspections', inspectionBody(scaffold.id, { startedAt: '2099-01-02T08:00:00Z' }));
    await created(api, 'demo:inspector', 'POST', `/inspections/${a.id}/finish`, finishBody({ finishedAt: '2099-01-01T09:00:00Z' }));
    const ids = async (q: string) => (await api.call('demo:manager', 'GET', `/inspections?${q}`)).body.items.map((i: { id: string }) => i.id);
    expect(await ids(`scaffoldId=${scaffold.id}`)).toEqual([b.id, a.id]);
    expect(await ids(`siteId=${site.id}&finished=true`)).toEqual([a.id]);
    expect(await ids(`siteId=${site.id}&finished=false`)).toEqual([b.id]);
    expect(await ids(`siteId=${randomUUID()}`)).toEqual([]);
  });
});
