import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { created, DEMO, type DataApi, scaffoldBody, siteBody, startDataApi } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

describeAccessMatrix('scaffolds: every route by every role of both organisations', () => api, [
  { route: 'GET /scaffolds', request: async () => ({ path: '/scaffolds' }), expect: [200, 200, 200, 200, 200, 200, 200, 200], listOf: 'scaffolds' },
  {
    route: 'GET /scaffolds/:id',
    request: async () => ({ path: `/scaffolds/${DEMO.foremansScaffold}` }),
    expect: [200, 200, 200, 200, 404, 404, 404, 404],
  },
  {
    route: 'POST /scaffolds',
    request: async () => ({ path: '/scaffolds', body: scaffoldBody(DEMO.quaysideSite) }),
    expect: [201, 201, 403, 403, 404, 404, 403, 403],
  },
  {
    route: 'PATCH /scaffolds/:id',
    request: async () => ({ path: `/scaffolds/${DEMO.unmannedScaffold}`, body: { description: 'Rear stair-core tower' } }),
    expect: [200, 200, 403, 403, 404, 404, 403, 403],
  },
  {
    route: 'POST /scaffolds/:id/status',
    request: async () => ({ path: `/scaffolds/${DEMO.unmannedScaffold}/status`, body: { status: 'limited', note: 'Top lift boarded out only' } }),
    expect: [200, 200, 200, 403, 404, 404, 404, 403],
  },
]);

describe('scaffolds', () => {
  it('filters the list by site, status, foreman and overdue inspection', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody());
    const a = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id, { reference: 'F-A', foremanId: api.userIds['demo:foreman'] }));
    const b = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id, { reference: 'F-B' }));
    await created(api, 'demo:inspector', 'POST', `/scaffolds/${a.id}/status`, { status: 'cleared', note: 'Handover inspection' });
    const refs = async (query: string) =>
      (await api.call('demo:manager', 'GET', `/scaffolds?siteId=${site.id}&${query}`)).body.items.map((s: { reference: string }) => s.reference);
    expect(await refs('')).toEqual(['F-A', 'F-B']);
    expect(await refs('status=closed')).toEqual(['F-B']);
    expect(await refs('status=cleared')).toEqual(['F-A']);
    expect(await refs(`foremanId=${api.userIds['demo:foreman']}`)).toEqual(['F-A']);
    expect(await refs('overdue=true')).toEqual([]);
    await api.t.drizzle.execute(sql`UPDATE scaffolds SET next_due_at = now() - interval '1 hour' WHERE id = ${b.id}`);
    expect(await refs('overdue=true')).toEqual(['F-B']);
    expect(await refs('overdue=false')).toEqual(['F-A']);
    expect(await refs('sort=reference&order=desc')).toEqual(['F-B', 'F-A']);
    expect(a.id).not.toBe(b.id);
  });

  it('only names a foreman of the organisation as the one responsible', async () => {
    for (const who of ['demo:inspector', 'other:foreman'] as const) {
      const res = await api.call('demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite, { foremanId: api.userIds[who] }));
      expect(res.status).toBe(400);
      expect(res.body.issues[0].path).toEqual(['foremanId']);
    }
    const ok = await api.call('demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite, { foremanId: api.userIds['demo:foreman'] }));
    expect(ok.status).toBe(201);
    expect(ok.body.foremanId).toBe(api.userIds['demo:foreman']);
  });

  it('records the status change with its reason in the audit trail', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody());
    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id));
    const res = await api.call('demo:inspector', 'POST', `/scaffolds/${scaffold.id}/status`, { status: 'closed', note: 'Ties removed on lift 3' });
    expect(res.body).toMatchObject({ status: 'closed', version: 2 });
    const audit = await api.call('demo:admin', 'GET', `/audit?entityId=${scaffold.id}`);
    expect(audit.body.items[0]).toMatchObject({ action: 'status', before: { status: 'closed' }, after: { status: 'closed', statusNote: 'Ties removed on lift 3' } });
  });

  it('starts a new scaffold closed to use until an inspection records its status', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody());
    const res = await api.call('demo:admin', 'POST', '/scaffolds', { ...scaffoldBody(site.id), status: 'cleared' });
    expect(res.status).toBe(201);
    expect(res.body.status).toBe('closed');
  });

  it('refuses sizes outside sane ranges, naming each field', async () => {
    const res = await api.call('demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite, { lifts: 0, liftHeightM: -2, elevations: ['A', 'A'] }));
    expect(res.status).toBe(400);
    expect(res.body.issues.map((i: { path: unknown[] }) => i.path.join('.')).sort()).toEqual(['elevations', 'liftHeightM', 'lifts']);
  });
});
