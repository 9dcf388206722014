import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { created, DEMO, type DataApi, EVERYONE, findingBody, startDataApi, type Who } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

type Body = Record<string, unknown>;
type Finding = { id: string; state: string; assigneeId: string | null; notes: string; version: number; handBack: { reason: string } | null; dueAt: string | null; createdAt: string; riskBand: string };

/** Pushes one mutation from a fresh phone of `who`. */
async function push(who: Who, mutation: Body) {
  const res = await api.call(who, 'POST', '/sync/push', { clientId: randomUUID(), mutations: [{ id: 1, entity: 'finding', baseVersion: 0, ...mutation }] });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.results[0] as { outcome: string; reason: string | null; conflictIds: string[] };
}

const get = async (id: string) => (await api.call('demo:manager', 'GET', `/findings/${id}`)).body as Finding;
const open = async () => (await created<Finding>(api, 'demo:inspector', 'POST', '/findings', findingBody(DEMO.foremansScaffold))).id;
const fixedByInspector = async () => {
  const id = await open();
  await created(api, 'demo:inspector', 'POST', `/findings/${id}/state`, { to: 'fixed', note: 'Removed', photoIds: [randomUUID()] });
  return id;
};

/** What two runs of a command must agree on (times differ, so the due time is compared from the creation time). */
const outcome = (f: Finding) => ({
  state: f.state,
  assigneeId: f.assigneeId,
  notes: f.notes,
  version: f.version,
  handBack: f.handBack?.reason ?? null,
  riskBand: f.riskBand,
  dueInMs: f.dueAt ? Date.parse(f.dueAt) - Date.parse(f.createdAt) : null,
});

interface CommandCase {
  command: string;
  /** A fresh target finding (none for create). */
  target?: () => Promise<string>;
  rest(id: string): { method: string; path: string; body: Body };
  push(id: string): Body;
  /** In the order of EVERYONE: [demo admin, manager, inspector, foreman, other admin, manager, inspector, foreman]. */
  expect: readonly number[];
}

/** Every finding command, through REST and through push, by every role of both organisations. */
const COMMANDS: CommandCase[] = [
  {
    command: 'create',
    rest: () => ({ method: 'POST', path: '/findings', body: findingBody(DEMO.foremansScaffold) }),
    push: () => {
      const body = findingBody(DEMO.foremansScaffold);
      return { entityId: body.id, action: 'create', payload: body };
    },
    expect: [403, 403, 201, 403, 403, 403, 404, 403],
  },
  {
    command: 'edit',
    target: open,
    rest: (id) => ({ method: 'PATCH', path: `/findings/${id}`, body: { notes: 'Second look: two couplers' } }),
    push: (id) => ({ entityId: id, action: 'update', baseVersion: 1, payload: { notes: 'Second look: two couplers' } }),
    expect: [403, 403, 200, 403, 403, 403, 404, 403],
  },
  {
    command: 'state: fixed',
    target: open,
    rest: (id) => ({ method: 'POST', path: `/findings/${id}/state`, body: { to: 'fixed', note: 'Removed', control: 'remove', photoIds: [randomUUID()] } }),
    push: (id) => ({ entityId: id, action: 'state', payload: { to: 'fixed', note: 'Removed', control: 'remove', photoIds: [randomUUID()] } }),
    expect: [403, 200, 200, 200, 403, 404, 404, 404],
  },
  {
    command: 'state: fixed without the proof photo',
    target: open,
    rest: (id) => ({ method: 'POST', path: `/findings/${id}/state`, body: { to: 'fixed', note: 'Removed' } }),
    push: (id) => ({ entityId: id, action: 'state', payload: { to: 'fixed', note: 'Removed' } }),
    expect: [403, 400, 400, 400, 403, 404, 404, 404],
  },
  {
    command: 'state: verified (fixed by the demo inspector)',
    target: fixedByInspector,
    rest: (id) => ({ method: 'POST', path: `/findings/${id}/state`, body: { to: 'verified', note: 'Checked' } }),
    push: (id) => ({ entityId: id, action: 'state', payload: { to: 'verified', note: 'Checked' } }),
    expect: [403, 200, 403, 403, 403, 404, 404, 404],
  },
  {
    command: 'state: the state it is already in',
    target: open,
    rest: (id) => ({ method: 'POST', path: `/findings/${id}/state`, body: { to: 'open', note: 'Still open' } }),
    push: (id) => ({ entityId: id, action: 'state', payload: { to: 'open', note: 'Still open' } }),
    expect: [403, 200, 200, 403, 403, 404, 404, 404],
  },
  {
    command: 'assign',
    target: open,
    rest: (id) => ({ method: 'POST', path: `/findings/${id}/assign`, body: { assigneeId: api.userIds['demo:foreman'] } }),
    push: (id) => ({ entityId: id, action: 'assign', payload: { assigneeId: api.userIds['demo:foreman'] } }),
    expect: [200, 200, 200, 403, 404, 404, 404, 403],
  },
  {
    command: 'hand back',
    target: open,
    rest: (id) => ({ method: 'POST', path: `/findings/${id}/hand-back`, body: { reason: 'cannot-fix', note: 'Needs a crane' } }),
    push: (id) => ({ entityId: id, action: 'hand-back', payload: { reason: 'cannot-fix', note: 'Needs a crane' } }),
    expect: [403, 403, 403, 200, 403, 403, 403, 404],
  },
];

describe('every finding command gives the same outcome through REST and through push, for every role of both organisations', () => {
  for (const c of COMMANDS) {
    EVERYONE.forEach((who, i) => {
      const status = c.expect[i]!;
      it(`${c.command} as ${who}: ${status} through REST, the same through push`, async () => {
        const [restId, pushId] = c.target ? [await c.target(), await c.target()] : ['', ''];
        const { method, path, body } = c.rest(restId);
        const rest = await api.call(who, method, path, body);
        expect(rest.status, JSON.stringify(rest.body)).toBe(status);
        const mutation = c.push(pushId);
        const pushed = await push(who, mutation);
        if (status < 300) {
          expect(pushed.outcome, pushed.reason ?? '').toBe('applied');
          const restFinding = await get(c.target ? restId : (rest.body as Finding).id);
          const pushFinding = await get(mutation.entityId as string);
          expect(outcome(pushFinding)).toEqual(outcome(restFinding));
        } else {
          expect(pushed.outcome).toBe('rejected');
          // The push's reason starts with the REST error's message: one rejection, two adapters.
          expect(pushed.reason!.startsWith(rest.body.message), `${pushed.reason} / ${rest.body.message}`).toBe(true);
          if (c.target) expect((await get(pushId)).version).toBe((await get(restId)).version);
        }
      });
    });
  }

  it('names separation of duties with its own code through REST and the same reason through push', async () => {
    const [restId, pushId] = [await fixedByInspector(), await fixedByInspector()];
    const rest = await api.call('demo:inspector', 'POST', `/findings/${restId}/state`, { to: 'verified' });
    expect(rest.body.code).toBe('VERIFIER_IS_FIXER');
    const pushed = await push('demo:inspector', { entityId: pushId, action: 'state', payload: { to: 'verified' } });
    expect(pushed).toMatchObject({ outcome: 'rejected', reason: rest.body.message });
  });
});

describe('versions decided by the server', () => {
  it('records a conflict when an offline push replaces a field a REST edit wrote after the phone last saw it', async () => {
    const id = await open();
    expect((await api.call('demo:inspector', 'PATCH', `/findings/${id}`, { notes: 'Office: coupler is wired on' })).status).toBe(200);
    const pushed = await push('demo:inspector', { entityId: id, action: 'update', baseVersion: 1, payload: { notes: 'Phone: coupler loose' } });
    expect(pushed.outcome).toBe('conflict');
    const rows = await api.t.drizzle.execute<{ field: string; replaced_value: unknown; current_value: unknown }>(
      sql`select field, replaced_value, current_value from sync_conflicts where id = ${pushed.conflictIds[0]}::uuid`,
    );
    // Clashing notes keep both texts, the stored one first.
    expect(rows.rows[0]).toEqual({ field: 'notes', replaced_value: 'Office: coupler is wired on', current_value: 'Office: coupler is wired on\n\nPhone: coupler loose' });
    expect((await get(id)).notes).toBe('Office: coupler is wired on\n\nPhone: coupler loose');
    // The conflict names who wrote the replaced value, and when.
    const list = await api.call('demo:manager', 'GET', `/sync/conflicts?entityId=${id}`);
    expect(list.body.items[0]).toMatchObject({ replacedUserId: api.userIds['demo:inspector'], replacedAt: expect.any(String), winnerUserId: api.userIds['demo:inspector'] });
    // By name too, as the organisation knows them, in the list, the pull and the settled answer.
    const named = await api.t.drizzle.execute<{ name: string }>(sql`select name from users where id = ${api.userIds['demo:inspector']}::uuid`);
    const name = named.rows[0]!.name;
    expect(name).toBeTruthy();
    expect(list.body.items[0]).toMatchObject({ winnerName: name, replacedName: name });
    let page = (await api.call('demo:manager', 'GET', '/sync/pull?limit=1000')).body;
    const pulled = [];
    for (;;) {
      pulled.push(...page.changes.filter((c: { type: string; record?: { id: string } }) => c.type === 'conflict' && c.record?.id === pushed.conflictIds[0]));
      if (!page.hasMore) break;
      page = (await api.call('demo:manager', 'GET', `/sync/pull?limit=1000&cursor=${page.cursor}`)).body;
    }
    expect(pulled).toEqual([expect.objectContaining({ record: expect.objectContaining({ winnerName: name, replacedName: name }) })]);
    const settled = await api.call('demo:manager', 'POST', `/sync/conflicts/${pushed.conflictIds[0]}/resolve`, { keep: 'current' });
    expect(settled.body).toMatchObject({ status: 'resolved', winnerName: name, replacedName: name });
  });

  it('keeps the public below when an offline push of hard hats clashes with a REST edit it had not seen', async () => {
    const id = await open();
    expect((await api.call('demo:inspector', 'PATCH', `/findings/${id}`, { exposure: 'hard-hats' })).status).toBe(200);
    expect((await api.call('demo:inspector', 'PATCH', `/findings/${id}`, { exposure: 'public' })).status).toBe(200);
    const pushed = await push('demo:inspector', { entityId: id, action: 'update', baseVersion: 1, payload: { exposure: 'hard-hats' } });
    expect(pushed.outcome).toBe('conflict');
    expect(await api.call('demo:manager', 'GET', `/findings/${id}`)).toMatchObject({ body: { exposure: 'public', version: 3 } });
    const list = await api.call('demo:manager', 'GET', `/sync/conflicts?entityId=${id}`);
    expect(list.body.items[0]).toMatchObject({ field: 'exposure', currentValue: 'public', replacedValue: 'hard-hats', replacedUserId: api.userIds['demo:inspector'] });
  });

  it('records no conflict when the phone had seen the REST edit', async () => {
    const id = await open();
    await api.call('demo:inspector', 'PATCH', `/findings/${id}`, { notes: 'Office note' });
    expect((await push('demo:inspector', { entityId: id, action: 'update', baseVersion: 2, payload: { notes: 'Phone after seeing it' } })).outcome).toBe('applied');
  });

  it('checks a pushed base version against what the server gave that phone: a higher number does not hide a conflict', async () => {
    const id = await open();
    const clientId = randomUUID();
    // The phone pulls the whole feed: it is given the finding at version 1.
    let cursor: string | undefined;
    for (let more = true; more; ) {
      const page = await api.call('demo:inspector', 'GET', `/sync/pull?limit=1000&clientId=${clientId}${cursor ? `&cursor=${cursor}` : ''}`);
      expect(page.status).toBe(200);
      ({ cursor, hasMore: more } = page.body as { cursor: string; hasMore: boolean });
    }
    expect((await api.call('demo:inspector', 'PATCH', `/findings/${id}`, { lift: 5 })).status).toBe(200);
    // It claims to have seen version 2, which it was never given.
    const res = await api.call('demo:inspector', 'POST', '/sync/push', {
      clientId,
      mutations: [{ id: 1, entity: 'finding', entityId: id, action: 'update', baseVersion: 2, payload: { lift: 4 } }],
    });
    expect(res.body.results[0]).toMatchObject({ outcome: 'conflict' });
    // Told version 3 in the answer, its next edit from there is seen.
    expect(res.body.records[0]).toMatchObject({ id, version: 3, lift: 4 });
    const next = await api.call('demo:inspector', 'POST', '/sync/push', {
      clientId,
      mutations: [{ id: 2, entity: 'finding', entityId: id, action: 'update', baseVersion: 3, payload: { lift: 6 } }],
    });
    expect(next.body.results[0]).toMatchObject({ outcome: 'applied', conflictIds: [] });
  });

  it('refuses a REST edit made from a version that is no longer current (409)', async () => {
    const id = await open();
    await api.call('demo:inspector', 'PATCH', `/findings/${id}`, { notes: 'First' });
    expect((await api.call('demo:inspector', 'PATCH', `/findings/${id}`, { notes: 'Second', version: 1 })).status).toBe(409);
  });
});

describe('the fix loop through one pushed batch', () => {
  it('applies the rules within the batch: the fixer’s own verification is refused, an alteration marks the scaffold, a reassignment clears a hand back', async () => {
    const body = findingBody(DEMO.unmannedScaffold, { elevation: 'South' });
    const fixId = randomUUID();
    const res = await api.call('demo:inspector', 'POST', '/sync/push', {
      clientId: randomUUID(),
      mutations: [
        { id: 1, entity: 'finding', entityId: body.id, action: 'create', baseVersion: 0, payload: body },
        { id: 2, entity: 'finding', entityId: body.id, action: 'state', baseVersion: 1, payload: { to: 'fixed', control: 'fit-netting', photoIds: [randomUUID()], recordId: fixId } },
        { id: 3, entity: 'finding', entityId: body.id, action: 'state', baseVersion: 2, payload: { to: 'verified' } },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.results.map((r: { outcome: string }) => r.outcome)).toEqual(['applied', 'applied', 'rejected']);
    expect(res.body.results[2].reason).toMatch(/cannot verify/);
    const scaffold = await api.t.drizzle.execute<{ altered_at: string | null; next_due_at: string | null; fixed_at: string }>(
      sql`select s.altered_at::text, s.next_due_at::text, f.fixed_at::text from scaffolds s, fixes f where s.id = ${DEMO.unmannedScaffold}::uuid and f.id = ${fixId}::uuid`,
    );
    expect(scaffold.rows[0]!.altered_at).toBe(scaffold.rows[0]!.fixed_at);
    expect(scaffold.rows[0]!.next_due_at).toBe(scaffold.rows[0]!.fixed_at);

    const other = await open();
    await push('demo:inspector', { entityId: other, action: 'assign', payload: { assigneeId: api.userIds['demo:foreman'] } });
    expect((await push('demo:foreman', { entityId: other, action: 'hand-back', payload: { reason: 'needs-scaffolders' } })).outcome).toBe('applied');
    expect((await get(other)).handBack).toMatchObject({ reason: 'needs-scaffolders' });
    expect((await push('demo:manager', { entityId: other, action: 'assign', payload: { assigneeId: api.userIds['demo:foreman'] } })).outcome).toBe('applied');
    expect((await get(other)).handBack).toBeNull();
    const notForeman = await push('demo:manager', { entityId: other, action: 'assign', payload: { assigneeId: api.userIds['demo:inspector'] } });
    expect(notForeman).toMatchObject({ outcome: 'rejected' });
    expect(notForeman.reason).toMatch(/Not a foreman/);
  });
});
