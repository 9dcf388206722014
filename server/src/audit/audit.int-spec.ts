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
    await created(api, 'demo:manager', 'POST', `/scaffolds/${DEMO.unmannedScaffold}/status`, { status: 'Do not use', note: 'Storm damage' });
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
