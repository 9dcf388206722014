import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { created, DEMO, type DataApi, siteBody, startDataApi } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
  await created(api, 'demo:admin', 'POST', '/sites', siteBody());
  await created(api, 'other:admin', 'POST', '/sites', siteBody());
});
afterAll(async () => {
  await api?.t.close();
});

describeAccessMatrix('audit: every route by every role of both organisations', () => api, [
  { route: 'GET /audit', request: async () => ({ path: '/audit' }), expect: [200, 200, 403, 403, 200, 200, 403, 403], listOf: 'audit_events' },
  {
    route: 'GET /audit (one entity)',
    request: async () => ({ path: `/audit?entityType=scaffold&entityId=${DEMO.unmannedScaffold}` }),
    expect: [200, 200, 403, 403, 200, 200, 403, 403],
    listOf: 'audit_events',
  },
]);

describe('the audit trail', () => {
  it('shows another organisation nothing of a record it cannot see', async () => {
    await created(api, 'demo:manager', 'POST', `/scaffolds/${DEMO.unmannedScaffold}/status`, { status: 'closed', note: 'Storm damage' });
    expect((await api.call('demo:manager', 'GET', `/audit?entityId=${DEMO.unmannedScaffold}`)).body.items).toHaveLength(1);
    expect((await api.call('other:manager', 'GET', `/audit?entityId=${DEMO.unmannedScaffold}`)).body.items).toEqual([]);
  });

  it('names who made each change, newest first, and pages with a cursor', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody());
    for (const name of ['One', 'Two', 'Three']) await created(api, 'demo:admin', 'PATCH', `/sites/${site.id}`, { name });
    const first = await api.call('demo:manager', 'GET', `/audit?entityType=site&entityId=${site.id}&limit=2`);
    expect(first.body.items.map((e: { after: { name: string } }) => e.after.name)).toEqual(['Three', 'Two']);
    expect(first.body.items[0].actorId).toBe(api.userIds['demo:admin']);
    const second = await api.call('demo:manager', 'GET', `/audit?entityType=site&entityId=${site.id}&limit=2&cursor=${first.body.nextCursor}`);
    expect(second.body.items.map((e: { action: string }) => e.action)).toEqual(['update', 'create']);
    expect(second.body.nextCursor).toBeNull();
  });

  it('filters by actor', async () => {
    const res = await api.call('demo:manager', 'GET', `/audit?actorId=${api.userIds['demo:admin']}&limit=200`);
    expect(res.body.items.length).toBeGreaterThan(0);
    for (const e of res.body.items) expect(e.actorId).toBe(api.userIds['demo:admin']);
  });
});

describe('the inspection data API as a whole', () => {
  const ROUTES = [
    ['get', '/api/sites'], ['post', '/api/sites'], ['get', '/api/sites/{id}'], ['patch', '/api/sites/{id}'], ['delete', '/api/sites/{id}'],
    ['get', '/api/scaffolds'], ['post', '/api/scaffolds'], ['get', '/api/scaffolds/{id}'], ['patch', '/api/scaffolds/{id}'], ['post', '/api/scaffolds/{id}/status'],
    ['get', '/api/inspections'], ['post', '/api/inspections'], ['get', '/api/inspections/{id}'], ['patch', '/api/inspections/{id}'],
    ['post', '/api/inspections/{id}/finish'], ['put', '/api/inspections/{id}/control-checks/{control}'],
    ['get', '/api/findings'], ['post', '/api/findings'], ['get', '/api/findings/{id}'], ['patch', '/api/findings/{id}'],
    ['post', '/api/findings/{id}/state'], ['post', '/api/findings/{id}/assign'], ['post', '/api/findings/{id}/hand-back'], ['get', '/api/findings/{id}/history'],
    ['get', '/api/catalogue'], ['post', '/api/catalogue'], ['get', '/api/catalogue/{id}'], ['patch', '/api/catalogue/{id}'], ['delete', '/api/catalogue/{id}'],
    ['get', '/api/audit'],
  ] as const;

  it('lists every route in the OpenAPI document', async () => {
    const doc = (await (await fetch(`${api.t.baseUrl}/api/docs/openapi.json`)).json()) as { paths: Record<string, Record<string, unknown>> };
    for (const [method, path] of ROUTES) expect(doc.paths[path]?.[method], `${method} ${path}`).toBeDefined();
  });

  it('answers 401 to every route without a token', async () => {
    for (const [method, path] of ROUTES) {
      const url = path.replace('/api', '').replace('{id}', DEMO.unmannedScaffold).replace('{control}', 'toe-boards');
      const res = await api.call(null, method.toUpperCase(), url, method === 'get' || method === 'delete' ? undefined : {});
      expect(res.status, `${method} ${path}`).toBe(401);
    }
  });
});
