import { randomUUID } from 'node:crypto';
import { BUILTIN_ITEMS, suggestExclusionZone } from '@plummet/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { catalogueBody, created, DEMO, type DataApi, findingBody, scaffoldBody, startDataApi } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

const brick = BUILTIN_ITEMS.find((i) => i.name === 'Brick')!;
const body = { heaviestItemId: brick.id, limitingWindMps: 18, barrieredWidthM: 4 };

describeAccessMatrix('exclusion zones: every route by every role of both organisations', () => api, [
  {
    route: 'GET /scaffolds/:id/exclusion-zones',
    request: async () => ({ path: `/scaffolds/${DEMO.foremansScaffold}/exclusion-zones` }),
    expect: [200, 200, 200, 200, 404, 404, 404, 404],
  },
  {
    route: 'PUT /scaffolds/:id/exclusion-zones/:elevation',
    request: async () => ({ path: `/scaffolds/${DEMO.foremansScaffold}/exclusion-zones/North`, body }),
    expect: [200, 200, 200, 403, 404, 404, 404, 403],
  },
]);

describe('exclusion zones', () => {
  it('suggests a width per elevation from the top working height, the heaviest item and the limiting wind, and keeps the width barriered', async () => {
    const scaffold = await created<{ id: string }>(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite, { lifts: 5, liftHeightM: 2, elevations: ['North', 'South'] }));
    const put = await api.call('demo:inspector', 'PUT', `/scaffolds/${scaffold.id}/exclusion-zones/North`, body);
    expect(put.status).toBe(200);
    const expected = suggestExclusionZone({ topWorkingHeightM: 10, item: brick, limitingWindMps: 18 });
    expect(put.body).toMatchObject({ elevation: 'North', topWorkingHeightM: 10, barrieredWidthM: 4, heaviestItem: { id: brick.id, name: 'Brick' } });
    expect(put.body.suggestion.suggestedWidthM).toBeCloseTo(expected.suggestedWidthM, 9);
    expect(put.body.suggestion.rulesOfThumb.map((r: { source: string }) => r.source).join(' ')).toMatch(/IBC 2021 Table 3306\.1[\s\S]*UK WAHR 2005 reg\. 11/);

    const list = await api.call('demo:manager', 'GET', `/scaffolds/${scaffold.id}/exclusion-zones`);
    expect(list.body.items.map((z: { elevation: string; suggestion: unknown }) => [z.elevation, z.suggestion !== null])).toEqual([
      ['North', true],
      ['South', false],
    ]);
  });

  it('does not shrink the zone as findings are fixed: findings play no part in it', async () => {
    const scaffold = await created<{ id: string }>(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite));
    await created(api, 'demo:manager', 'PUT', `/scaffolds/${scaffold.id}/exclusion-zones/North`, body);
    const before = (await api.call('demo:manager', 'GET', `/scaffolds/${scaffold.id}/exclusion-zones`)).body.items[0].suggestion;
    const finding = await created(api, 'demo:inspector', 'POST', '/findings', findingBody(scaffold.id));
    await api.call('demo:foreman', 'POST', `/findings/${finding.id}/state`, { to: 'fixed', note: 'Removed', photoIds: [randomUUID()] });
    const after = (await api.call('demo:manager', 'GET', `/scaffolds/${scaffold.id}/exclusion-zones`)).body.items[0].suggestion;
    expect(after).toEqual(before);
  });

  it('refuses an unknown elevation, another organisation’s catalogue item and bad numbers, naming the field', async () => {
    expect((await api.call('demo:manager', 'PUT', `/scaffolds/${DEMO.foremansScaffold}/exclusion-zones/Nowhere`, body)).status).toBe(404);
    const foreign = await created(api, 'other:admin', 'POST', '/catalogue', catalogueBody());
    const res = await api.call('demo:manager', 'PUT', `/scaffolds/${DEMO.foremansScaffold}/exclusion-zones/North`, { ...body, heaviestItemId: foreign.id });
    expect(res.status).toBe(400);
    expect(res.body.issues[0].path).toEqual(['heaviestItemId']);
    const bad = await api.call('demo:manager', 'PUT', `/scaffolds/${DEMO.foremansScaffold}/exclusion-zones/North`, { ...body, limitingWindMps: -1, barrieredWidthM: 1000 });
    expect(bad.body.issues.map((i: { path: string[] }) => i.path.join('.')).sort()).toEqual(['barrieredWidthM', 'limitingWindMps']);
  });
});
