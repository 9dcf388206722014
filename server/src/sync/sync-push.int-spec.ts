import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, type DataApi, findingBody, startDataApi, type Who } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

/** A phone: its own client id and mutation counter. */
function phone(who: Who) {
  const clientId = randomUUID();
  let next = 1;
  return {
    clientId,
    who,
    /** Pushes mutations with the next ids (or the given ids), answering status and body. */
    async push(mutations: Record<string, unknown>[], ids?: number[]) {
      const body = { clientId, mutations: mutations.map((m, i) => ({ id: ids?.[i] ?? next + i, ...m })) };
      const res = await api.call(who, 'POST', '/sync/push', body);
      if (res.status === 200 && !ids) next += mutations.length;
      return res;
    },
  };
}

const create = (overrides: Record<string, unknown> = {}) => {
  const body = findingBody(DEMO.foremansScaffold, overrides);
  return { entity: 'finding', entityId: body.id, action: 'create', baseVersion: 0, payload: body };
};
const update = (id: string, baseVersion: number, payload: Record<string, unknown>) => ({ entity: 'finding', entityId: id, action: 'update', baseVersion, payload });
const state = (id: string, to: string, note = '') => ({ entity: 'finding', entityId: id, action: 'state', payload: { to, note, photoIds: [randomUUID()] } });

async function finding(id: string) {
  return (await api.call('demo:manager', 'GET', `/findings/${id}`)).body as { notes: string; heightM: number; lift: number; version: number; state: string; riskScore: number };
}

describe('pushing mutations', () => {
  it('applies a batch in order and reports each mutation applied', async () => {
    const p = phone('demo:inspector');
    const c = create({ notes: 'first' });
    const res = await p.push([c, update(c.entityId, 1, { notes: 'second' })]);
    expect(res.status).toBe(200);
    expect(res.body.lastMutationId).toBe(2);
    expect(res.body.results.map((r: { outcome: string }) => r.outcome)).toEqual(['applied', 'applied']);
    expect(res.body.records[0]).toMatchObject({ id: c.entityId, notes: 'second', version: 2 });
    expect((await finding(c.entityId)).notes).toBe('second');
  });

  it('skips a replayed mutation, answering its first outcome, and writes nothing twice', async () => {
    const p = phone('demo:inspector');
    const c = create({ notes: 'once' });
    await p.push([c, update(c.entityId, 1, { notes: 'twice' })]);
    const again = await p.push([c, update(c.entityId, 1, { notes: 'twice' })], [1, 2]);
    expect(again.status).toBe(200);
    expect(again.body.results).toEqual([
      { id: 1, outcome: 'applied', reason: null, replayed: true, conflictIds: [] },
      { id: 2, outcome: 'applied', reason: null, replayed: true, conflictIds: [] },
    ]);
    expect((await finding(c.entityId)).version).toBe(2);
    const rows = await api.t.drizzle.execute<{ n: number }>(sql`select count(*)::int as n from sync_mutations where client_id = ${p.clientId}`);
    expect(rows.rows[0]!.n).toBe(2);
  });

  it('refuses a batch after a gap with 409 naming the expected id, and applies none of it', async () => {
    const p = phone('demo:inspector');
    const c = create();
    const res = await p.push([c], [3]);
    expect(res.status).toBe(409);
    expect(res.body.issues[0]).toMatchObject({ code: 'mutation_gap', message: 'expected 1' });
    expect((await api.call('demo:manager', 'GET', `/findings/${c.entityId}`)).status).toBe(404);
  });

  it('refuses a batch whose ids do not rise by one', async () => {
    const p = phone('demo:inspector');
    const res = await p.push([create(), create()], [1, 3]);
    expect(res.status).toBe(400);
  });

  it('records a mutation that can never apply as rejected with a reason, and moves the counter on', async () => {
    const p = phone('demo:inspector');
    const c = create();
    const res = await p.push([update(randomUUID(), 1, { notes: 'ghost' }), create({ heightM: -4 }), c]);
    expect(res.status).toBe(200);
    expect(res.body.results.map((r: { outcome: string }) => r.outcome)).toEqual(['rejected', 'rejected', 'applied']);
    expect(res.body.results[0].reason).toMatch(/does not exist/);
    expect(res.body.results[1].reason).toMatch(/heightM/);
    expect(res.body.lastMutationId).toBe(3);
    const next = await p.push([update(c.entityId, 1, { notes: 'after the rejections' })]);
    expect(next.body.results[0]).toMatchObject({ id: 4, outcome: 'applied' });
  });

  it('refuses a client id that belongs to another user', async () => {
    const p = phone('demo:inspector');
    await p.push([create()]);
    const res = await api.call('demo:manager', 'POST', '/sync/push', { clientId: p.clientId, mutations: [{ id: 2, ...create() }] });
    expect(res.status).toBe(403);
  });

  it('rejects a finding create from a role that does not record findings', async () => {
    const p = phone('demo:foreman');
    const res = await p.push([create()]);
    expect(res.body.results[0]).toMatchObject({ outcome: 'rejected', reason: 'Only inspectors record findings' });
  });
});

describe('per-field merge', () => {
  it('merges edits of different fields from two phones and recomputes the estimate', async () => {
    const a = phone('demo:inspector');
    const b = phone('demo:inspector');
    const c = create({ notes: 'start', heightM: 4 });
    await a.push([c]);
    const before = await finding(c.entityId);
    await a.push([update(c.entityId, 1, { notes: 'from A' })]);
    const res = await b.push([update(c.entityId, 1, { heightM: 12 })]);
    expect(res.body.results[0]).toMatchObject({ outcome: 'applied', conflictIds: [] });
    const after = await finding(c.entityId);
    expect(after).toMatchObject({ notes: 'from A', heightM: 12, version: 3 });
    expect(after.riskScore).toBeGreaterThanOrEqual(before.riskScore);
  });

  it('lets the later arrival win a field without a safety rule, keeps the replaced value as a conflict, and settles it', async () => {
    const a = phone('demo:inspector');
    const b = phone('demo:inspector');
    const c = create({ lift: 3 });
    await a.push([c]);
    await a.push([update(c.entityId, 1, { lift: 4 })]);
    const res = await b.push([update(c.entityId, 1, { lift: 5 })]);
    expect(res.body.results[0].outcome).toBe('conflict');
    const [conflictId] = res.body.results[0].conflictIds;
    expect((await finding(c.entityId)).lift).toBe(5);

    const list = await api.call('demo:manager', 'GET', `/sync/conflicts?entityId=${c.entityId}&status=open`);
    expect(list.body.items).toEqual([expect.objectContaining({ id: conflictId, field: 'lift', currentValue: 5, replacedValue: 4, status: 'open' })]);
    expect((await api.call('demo:foreman', 'GET', '/sync/conflicts')).status).toBe(403);
    expect((await api.call('other:manager', 'POST', `/sync/conflicts/${conflictId}/resolve`, { keep: 'current' })).status).toBe(404);

    const settled = await api.call('demo:manager', 'POST', `/sync/conflicts/${conflictId}/resolve`, { keep: 'replaced' });
    expect(settled.status).toBe(200);
    expect(settled.body).toMatchObject({ status: 'resolved', resolution: 'replaced' });
    expect((await finding(c.entityId)).lift).toBe(4);
    expect((await api.call('demo:manager', 'POST', `/sync/conflicts/${conflictId}/resolve`, { keep: 'current' })).status).toBe(409);
  });

  it('keeps both texts when two phones’ notes clash, and settling can keep the earlier text alone', async () => {
    const a = phone('demo:inspector');
    const b = phone('demo:inspector');
    const c = create({ notes: 'start' });
    await a.push([c]);
    await a.push([update(c.entityId, 1, { notes: 'A says bolt it' })]);
    const res = await b.push([update(c.entityId, 1, { notes: 'B says remove it' })]);
    expect(res.body.results[0].outcome).toBe('conflict');
    expect((await finding(c.entityId)).notes).toBe('A says bolt it\n\nB says remove it');
    const [conflictId] = res.body.results[0].conflictIds;
    expect((await api.call('demo:manager', 'POST', `/sync/conflicts/${conflictId}/resolve`, { keep: 'replaced' })).status).toBe(200);
    expect((await finding(c.entityId)).notes).toBe('A says bolt it');
  });

  it('settles a conflict with a typed value, checked like any edit', async () => {
    const a = phone('demo:inspector');
    const b = phone('demo:inspector');
    const c = create({ heightM: 4 });
    await a.push([c, update(c.entityId, 1, { heightM: 5 })]);
    const res = await b.push([update(c.entityId, 1, { heightM: 7 })]);
    const [conflictId] = res.body.results[0].conflictIds;
    expect((await api.call('demo:inspector', 'POST', `/sync/conflicts/${conflictId}/resolve`, { keep: 'custom', value: -1 })).status).toBe(400);
    const ok = await api.call('demo:inspector', 'POST', `/sync/conflicts/${conflictId}/resolve`, { keep: 'custom', value: 6 });
    expect(ok.status).toBe(200);
    expect((await finding(c.entityId)).heightM).toBe(6);
  });
});

describe('a batch the database refuses part of', () => {
  it('rejects only the mutation PostgreSQL refuses, applies the others, and audits each applied one once', async () => {
    const p = phone('demo:inspector');
    const good = create({ notes: 'kept' });
    const bad = create({ notes: 'nul \u0000 inside' });
    const res = await p.push([good, bad, update(good.entityId, 1, { notes: 'kept and edited' })]);
    expect(res.status).toBe(200);
    expect(res.body.lastMutationId).toBe(3);
    expect(res.body.results.map((r: { outcome: string }) => r.outcome)).toEqual(['applied', 'rejected', 'applied']);
    expect(res.body.results[1].reason).toMatch(/breaks a rule of the data/);
    expect((await finding(good.entityId)).notes).toBe('kept and edited');
    expect((await api.call('demo:manager', 'GET', `/findings/${bad.entityId}`)).status).toBe(404);
    const audit = await api.t.drizzle.execute<{ action: string }>(sql`select action from audit_events where entity_id = ${good.entityId} order by id`);
    expect(audit.rows.map((r) => r.action)).toEqual(['create', 'update']);
    const log = await api.t.drizzle.execute<{ n: number }>(sql`select count(*)::int as n from sync_mutations where client_id = ${p.clientId}`);
    expect(log.rows[0]!.n).toBe(3);
  });
});

describe('state changes as commands', () => {
  it('makes two phones marking the same finding fixed one fix and a no-op', async () => {
    const a = phone('demo:inspector');
    const foreman = phone('demo:foreman');
    const c = create();
    await a.push([c]);
    const first = await foreman.push([state(c.entityId, 'fixed', 'Removed')]);
    const second = await a.push([state(c.entityId, 'fixed', 'Removed too')]);
    expect(first.body.results[0]).toMatchObject({ outcome: 'applied', reason: null });
    expect(second.body.results[0]).toMatchObject({ outcome: 'applied', reason: 'Already fixed: nothing to change' });
    const fixes = await api.t.drizzle.execute<{ n: number }>(sql`select count(*)::int as n from fixes where finding_id = ${c.entityId}`);
    expect(fixes.rows[0]!.n).toBe(1);
  });

  it('rejects an illegal move with the state machine reason', async () => {
    const a = phone('demo:inspector');
    const c = create();
    const res = await a.push([c, state(c.entityId, 'verified')]);
    expect(res.body.results[1]).toMatchObject({ outcome: 'rejected', reason: 'A finding cannot move from open to verified' });
    expect((await finding(c.entityId)).state).toBe('open');
  });
});
