import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  catalogueBody,
  created,
  DEMO,
  type DataApi,
  dataTablesDigest,
  findingBody,
  finishBody,
  inspectionBody,
  scaffoldBody,
  siteBody,
  startDataApi,
  type Who,
} from '../../test/data-api.js';

/**
 * Every write route of the inspection data, sent broken bodies by a caller who may use it:
 * malformed JSON, wrong types, missing fields, values outside sane ranges and bodies over the
 * JSON limit. Each answers 400 (413 over the limit) with a code, and no row of the inspection
 * data (nor the audit trail) changes.
 */
let api: DataApi;
const ids: Record<string, string> = {};
beforeAll(async () => {
  api = await startDataApi();
  ids.site = (await created(api, 'demo:admin', 'POST', '/sites', siteBody())).id;
  ids.scaffold = DEMO.foremansScaffold;
  ids.inspection = (await created(api, 'demo:inspector', 'POST', '/inspections', inspectionBody(DEMO.foremansScaffold))).id;
  ids.finding = (await created(api, 'demo:inspector', 'POST', '/findings', findingBody(DEMO.foremansScaffold))).id;
  ids.item = (await created(api, 'demo:admin', 'POST', '/catalogue', catalogueBody())).id;
});
afterAll(async () => {
  await api?.t.close();
});

interface WriteRoute {
  name: string;
  who: Who;
  method: string;
  path: () => string;
  /** A body of the right shape with wrong types in it. */
  wrongTypes: unknown;
  /** A body with one value outside its sane range, and the field it names. */
  outOfRange: [unknown, string];
}

const HUGE_NOTE = 'x'.repeat(1_100_000);
const LONG_NOTE = 'x'.repeat(4001);

const ROUTES: WriteRoute[] = [
  { name: 'POST /sites', who: 'demo:admin', method: 'POST', path: () => '/sites', wrongTypes: { name: 42, address: [], clientName: true }, outOfRange: [siteBody({ name: 'n'.repeat(201) }), 'name'] },
  { name: 'PATCH /sites/:id', who: 'demo:admin', method: 'PATCH', path: () => `/sites/${ids.site}`, wrongTypes: { regime: 7, reportRecipients: 'a@b.test' }, outOfRange: [{ address: 'a'.repeat(501) }, 'address'] },
  {
    name: 'POST /scaffolds',
    who: 'demo:admin',
    method: 'POST',
    path: () => '/scaffolds',
    wrongTypes: { siteId: 12, reference: {}, elevations: 'North', lifts: '5', liftHeightM: '2', baysPerElevation: null },
    outOfRange: [scaffoldBody(DEMO.quaysideSite, { lifts: 101 }), 'lifts'],
  },
  { name: 'PATCH /scaffolds/:id', who: 'demo:admin', method: 'PATCH', path: () => `/scaffolds/${ids.scaffold}`, wrongTypes: { lifts: 'six' }, outOfRange: [{ liftHeightM: 0 }, 'liftHeightM'] },
  { name: 'POST /scaffolds/:id/status', who: 'demo:manager', method: 'POST', path: () => `/scaffolds/${ids.scaffold}/status`, wrongTypes: { status: 1 }, outOfRange: [{ status: 'cleared', note: LONG_NOTE }, 'note'] },
  {
    name: 'POST /inspections',
    who: 'demo:inspector',
    method: 'POST',
    path: () => '/inspections',
    wrongTypes: { id: 5, scaffoldId: true, reason: ['scheduled'], windSpeedMps: '3' },
    outOfRange: [inspectionBody(DEMO.foremansScaffold, { windSpeedMps: 61 }), 'windSpeedMps'],
  },
  { name: 'PATCH /inspections/:id', who: 'demo:inspector', method: 'PATCH', path: () => `/inspections/${ids.inspection}`, wrongTypes: { location: 3, windSpeedMps: 'calm' }, outOfRange: [{ windSpeedMps: -1 }, 'windSpeedMps'] },
  {
    name: 'POST /inspections/:id/finish',
    who: 'demo:inspector',
    method: 'POST',
    path: () => `/inspections/${ids.inspection}/finish`,
    wrongTypes: { ...finishBody(), reporterName: 7, signature: 1 },
    outOfRange: [finishBody({ mattersGivingRisk: LONG_NOTE }), 'mattersGivingRisk'],
  },
  {
    name: 'PUT /inspections/:id/control-checks/:control',
    who: 'demo:inspector',
    method: 'PUT',
    path: () => `/inspections/${ids.inspection}/control-checks/toe-boards`,
    wrongTypes: { result: true, note: 4 },
    outOfRange: [{ result: 'pass', note: LONG_NOTE }, 'note'],
  },
  {
    name: 'POST /findings',
    who: 'demo:inspector',
    method: 'POST',
    path: () => '/findings',
    wrongTypes: { ...findingBody(DEMO.foremansScaffold), heightM: '6', lift: 2.5, item: 'coupler' },
    outOfRange: [findingBody(DEMO.foremansScaffold, { heightM: 1001 }), 'heightM'],
  },
  {
    name: 'PATCH /findings/:id',
    who: 'demo:inspector',
    method: 'PATCH',
    path: () => `/findings/${ids.finding}`,
    wrongTypes: { heightM: 'high', exposure: 3 },
    outOfRange: [{ item: { name: 'Anvil', massKg: 5000.1 } }, 'item.massKg'],
  },
  { name: 'POST /findings/:id/state', who: 'demo:manager', method: 'POST', path: () => `/findings/${ids.finding}/state`, wrongTypes: { to: 3 }, outOfRange: [{ to: 'fixed', note: LONG_NOTE }, 'note'] },
  {
    name: 'POST /findings/:id/assign',
    who: 'demo:manager',
    method: 'POST',
    path: () => `/findings/${ids.finding}/assign`,
    wrongTypes: { assigneeId: 12, dueAt: 'tomorrow' },
    outOfRange: [{ assigneeId: null, dueAt: '2099-13-45T00:00:00Z' }, 'dueAt'],
  },
  {
    name: 'POST /findings/:id/hand-back',
    who: 'demo:foreman',
    method: 'POST',
    path: () => `/findings/${ids.finding}/hand-back`,
    wrongTypes: { reason: 3 },
    outOfRange: [{ reason: 'needs-scaffolders', note: LONG_NOTE }, 'note'],
  },
  {
    name: 'POST /catalogue',
    who: 'demo:admin',
    method: 'POST',
    path: () => '/catalogue',
    wrongTypes: { ...catalogueBody(), massKg: '1', shape: 'box' },
    outOfRange: [catalogueBody({ shape: { kind: 'rod', lengthM: 26, diameterM: 0.05 } }), 'shape.lengthM'],
  },
  { name: 'PATCH /catalogue/:id', who: 'demo:admin', method: 'PATCH', path: () => `/catalogue/${ids.item}`, wrongTypes: { category: 'spaceship' }, outOfRange: [{ massKg: -0.1 }, 'massKg'] },
  { name: 'POST /scaffolds/:id/trigger', who: 'demo:foreman', method: 'POST', path: () => `/scaffolds/${ids.scaffold}/trigger`, wrongTypes: { kind: 3, note: [] }, outOfRange: [{ kind: 'altered', note: LONG_NOTE }, 'note'] },
  {
    name: 'PUT /scaffolds/:id/exclusion-zones/:elevation',
    who: 'demo:manager',
    method: 'PUT',
    path: () => `/scaffolds/${ids.scaffold}/exclusion-zones/North`,
    wrongTypes: { heaviestItemId: 5, limitingWindMps: '12', barrieredWidthM: true },
    outOfRange: [{ heaviestItemId: null, limitingWindMps: 61, barrieredWidthM: 3 }, 'limitingWindMps'],
  },
];

async function unchanged(send: () => Promise<{ status: number; body: { code?: string } }>) {
  const before = await dataTablesDigest(api.t.drizzle);
  const res = await send();
  expect(await dataTablesDigest(api.t.drizzle)).toEqual(before);
  return res;
}

describe.each(ROUTES.map((r) => [r.name, r] as const))(
  '%s with a broken body',
  (_name, route) => {
    const send = (body: unknown, headers?: Record<string, string>) =>
      unchanged(async () => {
        const res = await fetch(`${api.t.baseUrl}/api${route.path()}`, {
          method: route.method,
          headers: { authorization: `Bearer ${api.tokens[route.who]}`, 'content-type': 'application/json', ...headers },
          body: typeof body === 'string' ? body : JSON.stringify(body),
        });
        return { status: res.status, body: (await res.json()) as { code?: string } };
      });

    it('answers malformed JSON with 400 INVALID_JSON', async () => {
      const res = await send('{"name": "Quayside", ');
      expect([res.status, res.body.code]).toEqual([400, 'INVALID_JSON']);
    });

    it('answers wrong types with 400 VALIDATION_FAILED naming fields', async () => {
      const res = await send(route.wrongTypes);
      expect([res.status, res.body.code]).toEqual([400, 'VALIDATION_FAILED']);
      expect((res.body as { issues: unknown[] }).issues.length).toBeGreaterThan(0);
    });

    it('answers an empty body with 400 VALIDATION_FAILED', async () => {
      const res = await send({});
      expect([res.status, res.body.code]).toEqual([400, 'VALIDATION_FAILED']);
    });

    it('answers a JSON array, and a body that is not JSON at all, with 400', async () => {
      expect((await send([route.wrongTypes])).status).toBe(400);
      expect((await send('name=x', { 'content-type': 'text/plain' })).status).toBe(400);
    });

    it('answers a value outside its sane range with 400 naming the field', async () => {
      const [body, field] = route.outOfRange;
      const res = await send(body);
      expect([res.status, res.body.code]).toEqual([400, 'VALIDATION_FAILED']);
      expect((res.body as { issues: { path: unknown[] }[] }).issues.map((i) => i.path.join('.'))).toContain(field);
    });

    it('answers a body over the JSON limit (a 1.1 MB note) with 413 PAYLOAD_TOO_LARGE', async () => {
      const res = await send({ ...(route.wrongTypes as object), note: HUGE_NOTE, notes: HUGE_NOTE });
      expect([res.status, res.body.code]).toEqual([413, 'PAYLOAD_TOO_LARGE']);
    });
  },
);
