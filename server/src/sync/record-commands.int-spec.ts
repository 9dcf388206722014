import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { created, DEMO, type DataApi, EVERYONE, finishBody, inspectionBody, scaffoldBody, startDataApi, type Who } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

type Body = Record<string, unknown>;
type Result = { outcome: string; reason: string | null; conflictIds: string[] };
type Inspection = { id: string; location: string; actionTaken: string; windSpeedMps: number | null; finishedAt: string | null; version: number; controlChecks: { control: string; result: string; note: string; version: number }[] };

/** Pushes mutations from one phone of `who` (a fresh phone unless a client id is given). */
async function pushAll(who: Who, mutations: Body[], clientId: string = randomUUID()): Promise<Result[]> {
  const res = await api.call(who, 'POST', '/sync/push', { clientId, mutations: mutations.map((m, i) => ({ id: i + 1, baseVersion: 0, ...m })) });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.results as Result[];
}
const push = async (who: Who, mutation: Body) => (await pushAll(who, [mutation]))[0]!;

const get = async (id: string) => (await api.call('demo:manager', 'GET', `/inspections/${id}`)).body as Inspection;
const started = async () => (await created(api, 'demo:inspector', 'POST', '/inspections', inspectionBody(DEMO.unmannedScaffold))).id;
const finished = async () => {
  const id = await started();
  await created(api, 'demo:inspector', 'POST', `/inspections/${id}/finish`, finishBody());
  return id;
};

/** What two runs of one command must agree on. */
const outcome = (i: Inspection) => ({
  location: i.location,
  windSpeedMps: i.windSpeedMps,
  finished: i.finishedAt !== null,
  version: i.version,
  checks: i.controlChecks.map((c) => ({ control: c.control, result: c.result, note: c.note, version: c.version })),
});

/** A fresh scaffold (closed, version 1) on the demo's quayside site. */
const newScaffold = async () => (await created(api, 'demo:admin', 'POST', '/scaffolds', scaffoldBody(DEMO.quaysideSite))).id;
type Scaffold = { status: string; version: number };
const scaffoldOutcome = async (id: string) => {
  const s = (await api.call('demo:manager', 'GET', `/scaffolds/${id}`)).body as Scaffold;
  return { status: s.status, version: s.version };
};

interface CommandCase {
  command: string;
  target?: () => Promise<string>;
  rest(id: string): { method: string; path: string; body: Body };
  push(id: string): Body & { entityId: string };
  /** The record to compare afterwards (the inspection's id, or the target's when `read` is given). */
  inspectionOf(id: string, mutation: Body & { entityId: string }): string;
  /** What two runs must agree on, for a record that is not an inspection. */
  read?: (id: string) => Promise<unknown>;
  /** In the order of EVERYONE: [demo admin, manager, inspector, foreman, other admin, manager, inspector, foreman]. */
  expect: readonly number[];
}

const INSPECTOR_ONLY = [403, 403, 200, 403, 403, 403, 404, 403] as const;

/** Every inspection and control-check command, through REST and push, by every role of both organisations. */
const COMMANDS: CommandCase[] = [
  {
    command: 'start an inspection',
    rest: () => ({ method: 'POST', path: '/inspections', body: inspectionBody(DEMO.unmannedScaffold) }),
    push: () => {
      const body = inspectionBody(DEMO.unmannedScaffold);
      return { entityId: body.id, entity: 'inspection', action: 'create', payload: body };
    },
    inspectionOf: (_id, m) => m.entityId,
    expect: [403, 403, 201, 403, 403, 403, 404, 403],
  },
  {
    command: 'edit the report drafts',
    target: started,
    rest: (id) => ({ method: 'PATCH', path: `/inspections/${id}`, body: { location: 'North elevation, lifts 1–5', windSpeedMps: 6 } }),
    push: (id) => ({ entityId: id, entity: 'inspection', action: 'update', baseVersion: 1, payload: { location: 'North elevation, lifts 1–5', windSpeedMps: 6 } }),
    inspectionOf: (id) => id,
    expect: INSPECTOR_ONLY,
  },
  {
    command: 'edit a signed inspection',
    target: finished,
    rest: (id) => ({ method: 'PATCH', path: `/inspections/${id}`, body: { location: 'Changed afterwards' } }),
    push: (id) => ({ entityId: id, entity: 'inspection', action: 'update', baseVersion: 2, payload: { location: 'Changed afterwards' } }),
    inspectionOf: (id) => id,
    expect: [403, 403, 409, 403, 403, 403, 404, 403],
  },
  {
    command: 'finish and sign',
    target: started,
    rest: (id) => ({ method: 'POST', path: `/inspections/${id}/finish`, body: finishBody() }),
    push: (id) => ({ entityId: id, entity: 'inspection', action: 'finish', baseVersion: 1, payload: finishBody() }),
    inspectionOf: (id) => id,
    expect: INSPECTOR_ONLY,
  },
  {
    command: 'finish again with another report',
    target: finished,
    rest: (id) => ({ method: 'POST', path: `/inspections/${id}/finish`, body: finishBody({ actionTaken: 'Something else' }) }),
    push: (id) => ({ entityId: id, entity: 'inspection', action: 'finish', baseVersion: 2, payload: finishBody({ actionTaken: 'Something else' }) }),
    inspectionOf: (id) => id,
    expect: [403, 403, 409, 403, 403, 403, 404, 403],
  },
  {
    command: 'answer a control check',
    target: started,
    rest: (id) => ({ method: 'PUT', path: `/inspections/${id}/control-checks/toe-boards`, body: { result: 'fail', note: 'Missing on lift 3' } }),
    push: (id) => ({ entityId: randomUUID(), entity: 'control-check', action: 'put', payload: { inspectionId: id, control: 'toe-boards', result: 'fail', note: 'Missing on lift 3' } }),
    inspectionOf: (id) => id,
    expect: INSPECTOR_ONLY,
  },
  {
    command: 'answer a control check of a signed inspection',
    target: finished,
    rest: (id) => ({ method: 'PUT', path: `/inspections/${id}/control-checks/toe-boards`, body: { result: 'pass' } }),
    push: (id) => ({ entityId: randomUUID(), entity: 'control-check', action: 'put', payload: { inspectionId: id, control: 'toe-boards', result: 'pass' } }),
    inspectionOf: (id) => id,
    expect: [403, 403, 409, 403, 403, 403, 404, 403],
  },
  {
    command: 'set a scaffold’s tag',
    target: newScaffold,
    rest: (id) => ({ method: 'POST', path: `/scaffolds/${id}/status`, body: { status: 'limited', note: 'Top lift boarded out only' } }),
    push: (id) => ({ entityId: id, entity: 'scaffold', action: 'status', baseVersion: 1, payload: { status: 'limited', note: 'Top lift boarded out only' } }),
    inspectionOf: (id) => id,
    read: scaffoldOutcome,
    expect: [200, 200, 200, 403, 404, 404, 404, 403],
  },
  {
    command: 'confirm a scaffold’s tag it already has',
    target: newScaffold,
    rest: (id) => ({ method: 'POST', path: `/scaffolds/${id}/status`, body: { status: 'closed', note: 'Ties removed on lift 3' } }),
    push: (id) => ({ entityId: id, entity: 'scaffold', action: 'status', baseVersion: 1, payload: { status: 'closed', note: 'Ties removed on lift 3' } }),
    inspectionOf: (id) => id,
    read: scaffoldOutcome,
    expect: [200, 200, 200, 403, 404, 404, 404, 403],
  },
];

describe('every inspection and scaffold-tag command gives the same outcome through REST and through push, for every role of both organisations', () => {
  for (const c of COMMANDS) {
    const read = c.read ?? (async (id: string) => outcome(await get(id)));
    EVERYONE.forEach((who, i) => {
      const status = c.expect[i]!;
      it(`${c.command} as ${who}: ${status} through REST, the same through push`, async () => {
        const [restId, pushId] = c.target ? [await c.target(), await c.target()] : ['', ''];
        const { method, path, body } = c.rest(restId);
        const rest = await api.call(who, method, path, body);
        expect(rest.status, JSON.stringify(rest.body)).toBe(status);
        const mutation = c.push(pushId);
        const pushed = await push(who, mutation);
        const restInspection = c.target ? restId : ((rest.body as { id?: string }).id ?? '');
        if (status < 300) {
          expect(pushed.outcome, pushed.reason ?? '').toBe('applied');
          expect(await read(c.inspectionOf(pushId, mutation))).toEqual(await read(restInspection));
        } else {
          expect(pushed.outcome).toBe('rejected');
          // The push's reason starts with the REST error's message: one rejection, two adapters.
          expect(pushed.reason!.startsWith(rest.body.message), `${pushed.reason} / ${rest.body.message}`).toBe(true);
          if (c.target) expect(await read(pushId)).toEqual(await read(restId));
        }
      });
    });
  }

  it('names a signed inspection with its own code through REST', async () => {
    const id = await finished();
    const rest = await api.call('demo:inspector', 'PATCH', `/inspections/${id}`, { location: 'Later' });
    expect(rest.body).toMatchObject({ code: 'INSPECTION_SIGNED' });
  });

  it('changes the user’s own settings through REST and push alike, and refuses another user’s', async () => {
    for (const who of EVERYONE) {
      const rest = await api.call(who, 'PATCH', '/users/me', { units: 'imperial' });
      expect(rest.status).toBe(200);
      const pushed = await push(who, { entity: 'user', action: 'update', entityId: api.userIds[who], baseVersion: rest.body.version, payload: { units: 'si', windUnits: 'kmh' } });
      expect(pushed.outcome, pushed.reason ?? '').toBe('applied');
      expect((await api.call(who, 'GET', '/users/me')).body).toMatchObject({ units: 'si', windUnits: 'kmh' });
    }
    const other = await push('demo:inspector', { entity: 'user', action: 'update', entityId: api.userIds['demo:manager'], payload: { units: 'imperial' } });
    expect(other).toMatchObject({ outcome: 'rejected', reason: 'Only the user changes their own settings' });
  });
});

describe('finishing queues the report e-mail in the same transaction, through either path', () => {
  const jobsOf = async (id: string) =>
    (await api.t.drizzle.execute<{ n: number }>(sql`select count(*)::int as n from pgboss.job where name = 'mail-inspection-report' and singleton_key = ${id}`)).rows[0]!.n;

  it('queues one report when a phone pushes the finish, none when the finish is refused', async () => {
    const id = await started();
    expect(await push('demo:inspector', { entityId: id, entity: 'inspection', action: 'finish', baseVersion: 1, payload: finishBody() })).toMatchObject({ outcome: 'applied' });
    expect(await jobsOf(id)).toBe(1);
    const refused = await started();
    expect(await push('demo:manager', { entityId: refused, entity: 'inspection', action: 'finish', payload: finishBody() })).toMatchObject({ outcome: 'rejected' });
    expect(await jobsOf(refused)).toBe(0);
  });
});

describe('per-field merge of inspections and control checks', () => {
  it('merges two phones’ edits of different report fields and keeps both texts of the same one, naming the replaced writer', async () => {
    const id = await started();
    const a = randomUUID();
    await pushAll('demo:inspector', [{ entityId: id, entity: 'inspection', action: 'update', baseVersion: 1, payload: { location: 'North face', actionTaken: 'Removed a coupler' } }], a);
    const [second] = await pushAll('demo:inspector', [{ entityId: id, entity: 'inspection', action: 'update', baseVersion: 1, payload: { equipment: 'Tube and fitting', actionTaken: 'Tied back a board' } }]);
    expect(second!.outcome).toBe('conflict');
    const stored = await get(id);
    expect(stored).toMatchObject({ location: 'North face', actionTaken: 'Removed a coupler\n\nTied back a board' });
    const list = await api.call('demo:manager', 'GET', `/sync/conflicts?entityId=${id}`);
    expect(list.body.items).toEqual([expect.objectContaining({ entity: 'inspection', field: 'actionTaken', replacedUserId: api.userIds['demo:inspector'], replacedAt: expect.any(String) })]);
  });

  it('keeps a failed control check when an unseen pass arrives later, until someone settles it', async () => {
    const id = await started();
    const checkId = randomUUID();
    await push('demo:inspector', { entityId: checkId, entity: 'control-check', action: 'put', payload: { inspectionId: id, control: 'brick-guards', result: 'pass', note: '' } });
    expect((await api.call('demo:inspector', 'PUT', `/inspections/${id}/control-checks/brick-guards`, { result: 'fail', note: 'Guard missing at bay 4' })).status).toBe(200);
    const late = await push('demo:inspector', { entityId: checkId, entity: 'control-check', action: 'put', baseVersion: 1, payload: { inspectionId: id, control: 'brick-guards', result: 'pass' } });
    expect(late.outcome).toBe('conflict');
    expect((await get(id)).controlChecks[0]).toMatchObject({ control: 'brick-guards', result: 'fail', note: 'Guard missing at bay 4' });
    // Settled by the inspector: the pass that waited in the conflict is written.
    const settled = await api.call('demo:inspector', 'POST', `/sync/conflicts/${late.conflictIds[0]}/resolve`, { keep: 'replaced' });
    expect(settled.status, JSON.stringify(settled.body)).toBe(200);
    expect((await get(id)).controlChecks[0]).toMatchObject({ control: 'brick-guards', result: 'pass' });
  });

  it('records a conflict when an offline push replaces an inspection field a REST edit wrote after the phone last saw it', async () => {
    const id = await started();
    expect((await api.call('demo:inspector', 'PATCH', `/inspections/${id}`, { reporterPosition: 'Lead inspector' })).status).toBe(200);
    const pushed = await push('demo:inspector', { entityId: id, entity: 'inspection', action: 'update', baseVersion: 1, payload: { reporterPosition: 'Inspector' } });
    expect(pushed.outcome).toBe('conflict');
  });
});

describe('a scaffold’s tag through push: the more restrictive tag stands', () => {
  const tag = (id: string, status: string, baseVersion: number) => ({ entityId: id, entity: 'scaffold', action: 'status', baseVersion, payload: { status, note: `Tagged ${status}` } });
  const conflictsOf = async (id: string) => (await api.call('demo:manager', 'GET', `/sync/conflicts?entityId=${id}`)).body.items as Body[];

  it('keeps the safer tag whichever of two unseen edits arrives last, and names who wrote the tag that did not stand', async () => {
    for (const [first, second] of [['limited', 'cleared'], ['cleared', 'limited']] as const) {
      // A new scaffold is closed (version 1); two phones that both saw it so tag it apart.
      const id = await newScaffold();
      expect(await push('demo:inspector', tag(id, first, 1))).toMatchObject({ outcome: 'applied' });
      const late = await push('demo:manager', tag(id, second, 1));
      expect(late.outcome, late.reason ?? '').toBe('conflict');
      expect(await scaffoldOutcome(id)).toEqual({ status: 'limited', version: 3 });
      const replacedWriter = first === 'limited' ? 'demo:manager' : 'demo:inspector';
      expect(await conflictsOf(id)).toEqual([
        expect.objectContaining({ id: late.conflictIds[0], entity: 'scaffold', field: 'status', currentValue: 'limited', replacedValue: 'cleared', replacedUserId: api.userIds[replacedWriter], replacedAt: expect.any(String) }),
      ]);
    }
  });

  it('records a conflict when an offline push replaces a tag a REST change set after the phone last saw it, and settles it', async () => {
    const id = await newScaffold();
    const before = Date.now();
    expect((await api.call('demo:manager', 'POST', `/scaffolds/${id}/status`, { status: 'cleared', note: 'Handover' })).status).toBe(200);
    // The scaffold says when its tag was set.
    const setAt = Date.parse((await api.call('demo:manager', 'GET', `/scaffolds/${id}`)).body.statusSetAt);
    expect(setAt).toBeGreaterThanOrEqual(before - 1000);
    expect(setAt).toBeLessThanOrEqual(Date.now() + 1000);
    // The phone last saw version 1 (closed) and limits the tag offline: the safer tag is written over the unseen one.
    const pushed = await push('demo:inspector', tag(id, 'limited', 1));
    expect(pushed.outcome).toBe('conflict');
    expect(await scaffoldOutcome(id)).toEqual({ status: 'limited', version: 3 });
    expect(await conflictsOf(id)).toEqual([expect.objectContaining({ currentValue: 'limited', replacedValue: 'cleared', replacedUserId: api.userIds['demo:manager'] })]);
    const settled = await api.call('demo:manager', 'POST', `/sync/conflicts/${pushed.conflictIds[0]}/resolve`, { keep: 'replaced' });
    expect(settled.status, JSON.stringify(settled.body)).toBe(200);
    expect((await scaffoldOutcome(id)).status).toBe('cleared');
  });

  it('treats the tag a finished inspection recorded as a write a later unseen push clashes with', async () => {
    const scaffoldId = await newScaffold();
    expect((await api.call('demo:manager', 'POST', `/scaffolds/${scaffoldId}/status`, { status: 'cleared', note: 'Handover' })).status).toBe(200);
    const id = (await created(api, 'demo:inspector', 'POST', '/inspections', inspectionBody(scaffoldId))).id;
    // A phone last saw the scaffold cleared (version 2); the inspection then closes it.
    expect(await push('demo:inspector', { entityId: id, entity: 'inspection', action: 'finish', baseVersion: 1, payload: finishBody({ tagStatus: 'closed', accessTagsChanged: true }) })).toMatchObject({ outcome: 'applied', reason: null });
    const late = await push('demo:manager', tag(scaffoldId, 'limited', 2));
    expect(late.outcome).toBe('conflict');
    expect((await scaffoldOutcome(scaffoldId)).status).toBe('closed');
  });

  it('keeps a scaffold closed by a recorded alteration against an offline tag that had not seen it', async () => {
    const id = await newScaffold();
    expect((await api.call('demo:manager', 'POST', `/scaffolds/${id}/status`, { status: 'cleared', note: 'Handover' })).status).toBe(200);
    expect((await api.call('demo:manager', 'POST', `/scaffolds/${id}/trigger`, { kind: 'altered', note: 'Bay 3 ties moved' })).status).toBe(201);
    // The phone last saw it cleared (version 2) and limits it offline: the closure stands.
    const late = await push('demo:inspector', tag(id, 'limited', 2));
    expect(late.outcome).toBe('conflict');
    expect((await scaffoldOutcome(id)).status).toBe('closed');
  });

  it('brings the stamped tag and its conflict back through the pull', async () => {
    const id = await newScaffold();
    const clientId = randomUUID();
    expect((await api.call('demo:manager', 'POST', `/scaffolds/${id}/status`, { status: 'limited', note: 'Top lift only' })).status).toBe(200);
    const [late] = await pushAll('demo:inspector', [tag(id, 'cleared', 1)], clientId);
    expect(late!.outcome).toBe('conflict');
    const changes: { type: string; record: Body }[] = [];
    let cursor = '';
    for (;;) {
      const page = await api.call('demo:inspector', 'GET', `/sync/pull?limit=1000&clientId=${clientId}${cursor ? `&cursor=${cursor}` : ''}`);
      expect(page.status).toBe(200);
      changes.push(...page.body.changes);
      cursor = page.body.cursor;
      if (!page.body.hasMore) break;
    }
    expect(changes.filter((c) => c.type === 'scaffold' && c.record.id === id).at(-1)!.record).toMatchObject({ status: 'limited', version: 3 });
    expect(changes.find((c) => c.type === 'conflict' && c.record.entityId === id)!.record).toMatchObject({ entity: 'scaffold', field: 'status', currentValue: 'limited', replacedValue: 'cleared' });
  });
});
