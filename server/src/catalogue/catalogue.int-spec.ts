import { BUILTIN_ITEMS } from '@plummet/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { catalogueBody, created, DEMO, type DataApi, findingBody, startDataApi } from '../../test/data-api.js';

let api: DataApi;
let demoItem: string;
let otherItem: string;
beforeAll(async () => {
  api = await startDataApi();
  demoItem = (await created(api, 'demo:admin', 'POST', '/catalogue', catalogueBody({ name: 'Harrow & Span edge protection clip' }))).id;
  otherItem = (await created(api, 'other:admin', 'POST', '/catalogue', catalogueBody({ name: 'Otherbuild banner weight' }))).id;
});
afterAll(async () => {
  await api?.t.close();
});

const freshItem = async (a: DataApi) => (await created(a, 'demo:admin', 'POST', '/catalogue', catalogueBody())).id;

describeAccessMatrix('catalogue: every route by every role of both organisations', () => api, [
  { route: 'GET /catalogue', request: async () => ({ path: '/catalogue?limit=200' }), expect: [200, 200, 200, 200, 200, 200, 200, 200], listOf: 'catalogue_items' },
  { route: 'GET /catalogue/:id', request: async () => ({ path: `/catalogue/${demoItem}` }), expect: [200, 200, 200, 200, 404, 404, 404, 404] },
  { route: 'POST /catalogue', request: async () => ({ path: '/catalogue', body: catalogueBody() }), expect: [201, 403, 403, 403, 201, 403, 403, 403] },
  { route: 'PATCH /catalogue/:id', request: async () => ({ path: `/catalogue/${demoItem}`, body: { massKg: 0.95 } }), expect: [200, 403, 403, 403, 404, 403, 403, 403] },
  { route: 'DELETE /catalogue/:id', request: async (a) => ({ path: `/catalogue/${await freshItem(a)}` }), expect: [204, 403, 403, 403, 404, 403, 403, 403] },
]);

describe('the built-in catalogue', () => {
  it('is upserted once at start: every built-in item is listed for every organisation with its source', async () => {
    for (const who of ['demo:foreman', 'other:inspector'] as const) {
      const res = await api.call(who, 'GET', '/catalogue?builtIn=true&limit=200');
      expect(res.body.items).toHaveLength(BUILTIN_ITEMS.length);
      for (const item of res.body.items) expect(item).toMatchObject({ builtIn: true, source: expect.any(String) });
    }
  });

  it('cannot be changed or deleted, even by an admin', async () => {
    const builtin = BUILTIN_ITEMS[0].id;
    expect((await api.call('demo:admin', 'PATCH', `/catalogue/${builtin}`, { massKg: 9 })).status).toBe(403);
    expect((await api.call('other:admin', 'DELETE', `/catalogue/${builtin}`)).status).toBe(403);
    expect((await api.call('demo:inspector', 'GET', `/catalogue/${builtin}`)).body.massKg).toBe(BUILTIN_ITEMS[0].massKg);
  });
});

describe('organisation items', () => {
  it('are seen only by their own organisation', async () => {
    const demoNames = (await api.call('demo:inspector', 'GET', '/catalogue?builtIn=false&limit=200')).body.items.map((i: { id: string }) => i.id);
    expect(demoNames).toContain(demoItem);
    expect(demoNames).not.toContain(otherItem);
    expect((await api.call('demo:inspector', 'GET', `/catalogue/${otherItem}`)).status).toBe(404);
  });

  it('filters by category and by part of the name, and sorts by mass', async () => {
    const couplers = await api.call('demo:inspector', 'GET', '/catalogue?q=COUPLER&limit=200');
    expect(couplers.body.items.map((i: { name: string }) => i.name).sort()).toEqual(['Putlog coupler', 'Right-angle coupler', 'Sleeve coupler', 'Swivel coupler']);
    const boards = await api.call('demo:inspector', 'GET', '/catalogue?category=board&sort=massKg&order=desc');
    expect(boards.body.items.map((i: { name: string }) => i.name)).toEqual(['Scaffold board (3.9 m)', 'Board offcut (1 m)']);
    expect((await api.call('demo:inspector', 'GET', '/catalogue?q=%25')).body.items).toEqual([]);
  });

  it('can be deleted while findings keep their copy of the name, mass and shape', async () => {
    const item = await created<{ id: string; name: string; massKg: number }>(api, 'demo:admin', 'POST', '/catalogue', catalogueBody({ massKg: 2.5 }));
    const finding = await created<{ id: string }>(api, 'demo:inspector', 'POST', '/findings', findingBody(DEMO.foremansScaffold, { item: { catalogueItemId: item.id } }));
    expect((await api.call('demo:admin', 'DELETE', `/catalogue/${item.id}`)).status).toBe(204);
    const after = await api.call('demo:inspector', 'GET', `/findings/${finding.id}`);
    expect(after.body.item).toMatchObject({ catalogueItemId: null, name: item.name, massKg: 2.5 });
  });

  it('refuses a mass of zero, a shape without its dimensions and an empty source', async () => {
    const res = await api.call('demo:admin', 'POST', '/catalogue', catalogueBody({ massKg: 0, shape: { kind: 'cylinder', lengthM: 0.2 }, source: ' ' }));
    expect(res.status).toBe(400);
    expect(res.body.issues.map((i: { path: unknown[] }) => i.path.join('.')).sort()).toEqual(['massKg', 'shape.diameterM', 'source']);
  });
});
