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

const handover = {
  loadClass: 'class-3',
  designReference: 'Design sheet 12 rev B',
  erectingContractor: 'Northgate Access Ltd',
  handedOverOn: '2026-03-02',
};

const freshScaffold = async (a: DataApi) => (await created(a, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite))).id;

/** Field path → message of a refused request. */
const messages = (body: { issues?: { path: unknown[]; message: string }[] }) =>
  Object.fromEntries((body.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describeAccessMatrix('setting up sites and scaffolds: the new fields by every role of both organisations', () => api, [
  {
    route: 'POST /sites',
    request: async () => ({ path: '/sites', body: siteBody({ jurisdiction: 'us', regime: 'pre-shift', timeZone: 'America/New_York' }) }),
    expect: [201, 201, 403, 403, 201, 201, 403, 403],
  },
  {
    route: 'PATCH /sites/:id',
    request: async () => ({ path: `/sites/${DEMO.fennelSite}`, body: { jurisdiction: 'us' } }),
    expect: [200, 200, 403, 403, 404, 404, 403, 403],
  },
  {
    route: 'POST /scaffolds',
    request: async () => ({ path: '/scaffolds', body: scaffoldBody(DEMO.quaysideSite, { lifts: 3, liftHeightsM: [2.5, 2, 1.8], regime: 'pre-shift', ...handover }) }),
    expect: [201, 201, 403, 403, 404, 404, 403, 403],
  },
  {
    route: 'PATCH /scaffolds/:id',
    request: async () => ({ path: `/scaffolds/${DEMO.unmannedScaffold}`, body: { regime: null, ...handover } }),
    expect: [200, 200, 403, 403, 404, 404, 403, 403],
  },
  {
    route: 'POST /scaffolds/:id/archive',
    request: async (a) => ({ path: `/scaffolds/${await freshScaffold(a)}/archive` }),
    expect: [200, 200, 403, 403, 404, 404, 403, 403],
  },
]);

describe('sites: jurisdiction', () => {
  it('starts a site under UK rules and keeps US rules when chosen', async () => {
    const uk = await created<{ id: string; jurisdiction: string }>(api, 'demo:manager', 'POST', '/sites', siteBody());
    expect(uk.jurisdiction).toBe('uk');
    const us = await created(api, 'demo:manager', 'PATCH', `/sites/${uk.id}`, { jurisdiction: 'us' });
    expect(us).toMatchObject({ jurisdiction: 'us', version: 2 });
    const listed = await api.call('demo:inspector', 'GET', '/sites?jurisdiction=us&limit=200');
    expect(listed.body.items.map((s: { id: string }) => s.id)).toContain(uk.id);
  });

  it('answers each bad value with a message on its field', async () => {
    const res = await api.call(
      'demo:admin',
      'POST',
      '/sites',
      siteBody({ name: ' ', jurisdiction: 'fr', regime: 'monthly', clientContactEmail: 'not-an-address', timeZone: 'Mars/Olympus' }),
    );
    expect(res.status).toBe(400);
    expect(messages(res.body)).toEqual({
      name: 'Give the site a name',
      jurisdiction: 'UK or US',
      regime: 'Every 7 days or before each shift',
      clientContactEmail: 'An e-mail address, e.g. name@example.com',
      timeZone: 'Unknown time zone',
    });
  });
});

describe('scaffolds: lift heights, own regime and handover record', () => {
  it('keeps one height per lift, its own regime and the handover record', async () => {
    const scaffold = await created<{ id: string; liftHeightsM: number[] }>(
      api,
      'demo:manager',
      'POST',
      '/scaffolds',
      scaffoldBody(DEMO.quaysideSite, { lifts: 3, liftHeightM: 2, liftHeightsM: [2.5, 2, 1.8], regime: 'pre-shift', ...handover }),
    );
    expect(scaffold).toMatchObject({ lifts: 3, liftHeightM: 2, regime: 'pre-shift', ...handover, status: 'closed', archivedAt: null });
    expect(scaffold.liftHeightsM.map((h: number) => Math.round(h * 100) / 100)).toEqual([2.5, 2, 1.8]);
    const got = await api.call('demo:inspector', 'GET', `/scaffolds/${scaffold.id}`);
    expect(got.body).toMatchObject({ regime: 'pre-shift', loadClass: 'class-3', handedOverOn: '2026-03-02' });
  });

  it('defaults to the site’s regime, uniform lifts and an empty handover record', async () => {
    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite));
    expect(scaffold).toMatchObject({ regime: null, liftHeightsM: [], loadClass: null, designReference: '', erectingContractor: '', handedOverOn: null });
  });

  it('answers each bad value with a message on its field', async () => {
    const res = await api.call(
      'demo:admin',
      'POST',
      '/scaffolds',
      scaffoldBody(DEMO.quaysideSite, { reference: '', regime: 'monthly', loadClass: 'class-9', handedOverOn: '2026-13-01', liftHeightsM: [2, 0], lifts: 2.5 }),
    );
    expect(res.status).toBe(400);
    expect(messages(res.body)).toEqual({
      reference: 'Give the scaffold a reference, e.g. A1',
      regime: "Every 7 days, before each shift, or the site's",
      loadClass: 'A load class from the list',
      handedOverOn: 'A date as YYYY-MM-DD, e.g. 2026-03-04',
      'liftHeightsM.1': 'More than 0 m',
      lifts: 'A whole number of lifts',
    });
  });

  it('refuses a list of lift heights that does not match the lifts, on create and after a change of lifts', async () => {
    const res = await api.call('demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite, { lifts: 3, liftHeightsM: [2, 2] }));
    expect(res.status).toBe(400);
    expect(messages(res.body)).toEqual({ liftHeightsM: 'Give one height for each of the 3 lifts, or none to use the usual height for all' });

    const scaffold = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite, { lifts: 2, liftHeightsM: [2.2, 2] }));
    const grown = await api.call('demo:admin', 'PATCH', `/scaffolds/${scaffold.id}`, { lifts: 3 });
    expect(grown.status).toBe(400);
    expect(messages(grown.body)).toEqual({ liftHeightsM: 'Give one height for each of the 3 lifts, or none to use the usual height for all' });
    const both = await api.call('demo:admin', 'PATCH', `/scaffolds/${scaffold.id}`, { lifts: 3, liftHeightsM: [2.2, 2, 2] });
    expect(both.status).toBe(200);
    const uniform = await api.call('demo:admin', 'PATCH', `/scaffolds/${scaffold.id}`, { lifts: 4, liftHeightsM: [] });
    expect(uniform.body).toMatchObject({ lifts: 4, liftHeightsM: [] });
  });

  it('dates the next inspection by the scaffold’s own regime over its site’s', async () => {
    // The site inspects every 7 days (UK WAHR 2005 reg. 12(4)(a)); this scaffold before each shift
    // (US OSHA 29 CFR 1926.451(f)(3)): due at the start of the next local day, not a week later.
    const site = await created(api, 'demo:admin', 'POST', '/sites', siteBody({ regime: '7-day', timeZone: 'Europe/London' }));
    const own = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id, { regime: 'pre-shift' }));
    const follows = await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(site.id));
    const finishedAt = '2026-03-03T10:00:00.000Z';
    for (const scaffold of [own, follows]) {
      const inspection = await created(api, 'demo:inspector', 'POST', '/inspections', inspectionBody(scaffold.id, { startedAt: '2026-03-03T09:00:00.000Z' }));
      await created(api, 'demo:inspector', 'POST', `/inspections/${inspection.id}/finish`, finishBody({ finishedAt }));
    }
    const due = async (id: string) => (await api.call('demo:manager', 'GET', `/scaffolds/${id}`)).body.nextDueAt;
    expect(await due(own.id)).toBe('2026-03-04T00:00:00.000Z');
    expect(await due(follows.id)).toBe('2026-03-10T10:00:00.000Z');
  });
});
