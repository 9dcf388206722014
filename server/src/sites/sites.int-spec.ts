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

const freshSite = async (a: DataApi) => (await created(a, 'demo:admin', 'POST', '/sites', siteBody())).id;

describeAccessMatrix('sites: every route by every role of both organisations', () => api, [
  { route: 'GET /sites', request: async () => ({ path: '/sites' }), expect: [200, 200, 200, 200, 200, 200, 200, 200], listOf: 'sites' },
  { route: 'GET /sites/:id', request: async () => ({ path: `/sites/${DEMO.quaysideSite}` }), expect: [200, 200, 200, 200, 404, 404, 404, 404] },
  { route: 'POST /sites', request: async () => ({ path: '/sites', body: siteBody() }), expect: [201, 201, 403, 403, 201, 201, 403, 403] },
  {
    route: 'PATCH /sites/:id',
    request: async () => ({ path: `/sites/${DEMO.quaysideSite}`, body: { clientName: 'Eastmouth Libraries Trust' } }),
    expect: [200, 200, 403, 403, 404, 404, 403, 403],
  },
  {
    route: 'DELETE /sites/:id',
    request: async (a) => ({ path: `/sites/${await freshSite(a)}` }),
    expect: [204, 403, 403, 403, 404, 403, 403, 403],
  },
]);

describe('sites', () => {
  it('bumps version and updated_at on a change and records the site before and after', async () => {
    const site = await created<{ id: string; version: number; updatedAt: string }>(api, 'demo:admin', 'POST', '/sites', siteBody());
    const res = await api.call('demo:admin', 'PATCH', `/sites/${site.id}`, { regime: 'pre-shift', version: 1 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ regime: 'pre-shift', version: 2 });
    expect(new Date(res.body.updatedAt).getTime()).toBeGreaterThan(new Date(site.updatedAt).getTime());
    const audit = await api.call('demo:manager', 'GET', `/audit?entityType=site&entityId=${site.id}`);
    expect(audit.body.items.map((e: { action: string }) => e.action)).toEqual(['update', 'create']);
    expect(audit.body.items[0].before).toMatchObject({ regime: '7-day', version: 1 });
    expect(audit.body.items[0].after).toMatchObject({ regime: 'pre-shift', version: 2 });
  });

  it('refuses a change made against a stale version with 409 CONFLICT', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody());
    await created(api, 'demo:admin', 'PATCH', `/sites/${site.id}`, { name: 'First change' });
    const res = await api.call('demo:admin', 'PATCH', `/sites/${site.id}`, { name: 'Second change', version: 1 });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('CONFLICT');
  });

  it('refuses to delete a site that has scaffolds, keeping their records', async () => {
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody());
    await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id));
    const res = await api.call('demo:admin', 'DELETE', `/sites/${site.id}`);
    expect(res.status).toBe(409);
    expect((await api.call('demo:admin', 'GET', `/sites/${site.id}`)).status).toBe(200);
  });

  it('answers 404 for an id that is not a UUID and for an unknown UUID', async () => {
    expect((await api.call('demo:admin', 'GET', '/sites/not-a-uuid')).status).toBe(404);
    expect((await api.call('demo:admin', 'GET', '/sites/7d1f4c52-0000-4000-8000-000000000000')).status).toBe(404);
  });

  it('refuses an unknown time zone and a bad e-mail recipient, naming the fields', async () => {
    const res = await api.call('demo:admin', 'POST', '/sites', siteBody({ timeZone: 'Mars/Olympus', reportRecipients: ['nope'] }));
    expect(res.status).toBe(400);
    const paths = res.body.issues.map((i: { path: unknown[] }) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['timeZone', 'reportRecipients.0']));
  });

  it('pages the list by name with a cursor, without repeats or gaps', async () => {
    for (let i = 0; i < 5; i++) await created(api, 'demo:admin', 'POST', '/sites', siteBody({ name: `Paging site ${i}` }));
    const all = await api.call('demo:inspector', 'GET', '/sites?limit=200');
    const names: string[] = [];
    let cursor: string | null = null;
    do {
      const res = await api.call('demo:inspector', 'GET', `/sites?limit=2${cursor ? `&cursor=${cursor}` : ''}`);
      expect(res.status).toBe(200);
      expect(res.body.items.length).toBeLessThanOrEqual(2);
      names.push(...res.body.items.map((s: { name: string }) => s.name));
      cursor = res.body.nextCursor;
    } while (cursor);
    expect(names).toEqual(all.body.items.map((s: { name: string }) => s.name));
    expect([...names].sort()).toEqual(names);
  });

  it('refuses a cursor made for another sort, and a limit above 200', async () => {
    const first = await api.call('demo:inspector', 'GET', '/sites?limit=1');
    expect((await api.call('demo:inspector', 'GET', `/sites?sort=createdAt&cursor=${first.body.nextCursor}`)).status).toBe(400);
    const tooMany = await api.call('demo:inspector', 'GET', '/sites?limit=201');
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.issues[0].path).toEqual(['limit']);
    expect((await api.call('demo:inspector', 'GET', '/sites?sort=address')).status).toBe(400);
  });
});
