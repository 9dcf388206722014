import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, type DataApi, findingBody, startDataApi, type Who } from '../../test/data-api.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

interface Page {
  changes: { type: string; record: { id: string; notes?: string } & Record<string, unknown> }[];
  cursor: string;
  hasMore: boolean;
}

async function pull(who: Who, cursor?: string, limit = 500): Promise<Page> {
  const res = await api.call(who, 'GET', `/sync/pull?limit=${limit}${cursor ? `&cursor=${cursor}` : ''}`);
  expect(res.status).toBe(200);
  return res.body as Page;
}

/**
 * Every change after `cursor`, page by page; with `awaited`, pulls on until those ids arrived (the
 * feed holds back rows while an older transaction anywhere on the cluster is still open, and the
 * test cluster is shared with other test files).
 */
async function pullAll(who: Who, cursor?: string, limit = 500, awaited: string[] = []) {
  const ids: string[] = [];
  let pages = 0;
  const deadline = Date.now() + 10_000;
  for (;;) {
    const page = await pull(who, cursor, limit);
    ids.push(...page.changes.map((c) => c.record.id));
    cursor = page.cursor;
    pages += 1;
    if (page.hasMore) continue;
    if (awaited.every((id) => ids.includes(id)) || Date.now() > deadline) return { ids, cursor, pages };
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

async function pushCreates(count: number, scaffoldId = DEMO.unmannedScaffold): Promise<string[]> {
  const position = scaffoldId === DEMO.unmannedScaffold ? { elevation: 'South', bay: 1 } : {};
  const bodies = Array.from({ length: count }, () => findingBody(scaffoldId, position));
  const res = await api.call('demo:inspector', 'POST', '/sync/push', {
    clientId: randomUUID(),
    mutations: bodies.map((b, i) => ({ id: i + 1, entity: 'finding', entityId: b.id, action: 'create', payload: b })),
  });
  expect(res.status).toBe(200);
  expect(res.body.results.every((r: { outcome: string }) => r.outcome === 'applied')).toBe(true);
  return bodies.map((b) => b.id);
}

describe('pulling changes', () => {
  it('pages through every finding of the organisation once, and an unchanged feed answers nothing new', async () => {
    const created = await pushCreates(7);
    const all = await pullAll('demo:manager', undefined, 3, [...created, ...DEMO.demoFindings]);
    expect(all.pages).toBeGreaterThan(2);
    expect(new Set(all.ids).size).toBe(all.ids.length);
    for (const id of [...created, ...DEMO.demoFindings]) expect(all.ids).toContain(id);
    for (const id of DEMO.otherFindings) expect(all.ids).not.toContain(id);
    const again = await pull('demo:manager', all.cursor);
    expect(again).toEqual({ changes: [], cursor: all.cursor, hasMore: false });
  });

  it('answers only what changed after the cursor', async () => {
    const { cursor } = await pullAll('demo:manager');
    const [id] = await pushCreates(1);
    const next = await pullAll('demo:manager', cursor, 500, [id!]);
    expect(next.ids).toEqual([id]);
  });

  it('gives a foreman only findings on their scaffolds or assigned to them, and no conflicts', async () => {
    const [unmanned] = await pushCreates(1, DEMO.unmannedScaffold);
    const [theirs] = await pushCreates(1, DEMO.foremansScaffold);
    const [assigned] = await pushCreates(1, DEMO.unmannedScaffold);
    await api.call('demo:manager', 'POST', `/findings/${assigned}/assign`, { assigneeId: api.userIds['demo:foreman'] });
    const { ids } = await pullAll('demo:foreman', undefined, 500, [theirs!, assigned!]);
    expect(ids).toContain(theirs);
    expect(ids).toContain(assigned);
    expect(ids).not.toContain(unmanned);
    const types = (await pull('demo:foreman')).changes.map((c) => c.type);
    expect(types).toContain('finding');
    expect(types).not.toContain('conflict');
  });

  it('never skips a change whose transaction commits after a later one', async () => {
    const [early, late] = await pushCreates(2);
    const { cursor } = await pullAll('demo:manager', undefined, 500, [early!, late!]);
    const client = new pg.Client({ connectionString: api.t.db.url });
    await client.connect();
    try {
      // The slow transaction stamps first and commits last.
      await client.query('begin');
      await client.query(`update findings set notes = 'slow writer', sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq') where id = $1`, [early]);
      const quick = await api.call('demo:inspector', 'PATCH', `/findings/${late}`, { notes: 'quick writer' });
      expect(quick.status).toBe(200);
      const whileOpen = await pullAll('demo:manager', cursor);
      expect(whileOpen.ids).not.toContain(early);
      await client.query('commit');
      const afterCommit = await pullAll('demo:manager', whileOpen.cursor, 500, [early!, late!].filter((id) => !whileOpen.ids.includes(id)));
      const seen = [...whileOpen.ids, ...afterCommit.ids];
      expect(seen).toContain(early);
      expect(seen).toContain(late);
    } finally {
      await client.end();
    }
  });

  it('interleaves conflicts with findings in feed order, the same in small pages as in one', async () => {
    const { cursor } = await pullAll('demo:manager');
    const ids = await pushCreates(3);
    const [a, b] = [randomUUID(), randomUUID()];
    const edit = async (clientId: string, first: number, notes: string) => {
      const res = await api.call('demo:inspector', 'POST', '/sync/push', {
        clientId,
        mutations: ids.map((id, i) => ({ id: first + i, entity: 'finding', entityId: id, action: 'update', baseVersion: 1, payload: { notes: `${notes} ${i}` } })),
      });
      expect(res.status).toBe(200);
      return res.body.results as { outcome: string; conflictIds: string[] }[];
    };
    await edit(a, 1, 'A');
    const conflictIds = (await edit(b, 1, 'B')).flatMap((r) => r.conflictIds);
    expect(conflictIds).toHaveLength(3);
    const [later] = await pushCreates(1);
    const awaited = [...ids, ...conflictIds, later!];
    const whole = await pullAll('demo:manager', cursor, 500, awaited);
    const paged = await pullAll('demo:manager', cursor, 2, awaited);
    expect(paged.ids).toEqual(whole.ids);
    expect(new Set(paged.ids).size).toBe(paged.ids.length);
    // Each conflict comes after the findings' last writes (same transaction, stamped later) and before a later push.
    for (const id of conflictIds) expect(paged.ids).toContain(id);
    const conflictAt = conflictIds.map((c) => paged.ids.indexOf(c));
    for (const id of ids) expect(paged.ids.indexOf(id)).toBeLessThan(Math.min(...conflictAt));
    expect(paged.ids.indexOf(later!)).toBeGreaterThan(Math.max(...conflictAt));
    expect(paged.cursor).toBe(whole.cursor);
    // A pulled record reads as the findings API answers the same finding.
    const pulled = (await pull('demo:manager', cursor)).changes.find((c) => c.record.id === ids[0]);
    const rest = await api.call('demo:manager', 'GET', `/findings/${ids[0]}`);
    expect(rest.status).toBe(200);
    expect(pulled?.record).toEqual({ ...rest.body, organisationId: expect.any(String), siteId: expect.any(String) });
  });

  it('refuses a malformed cursor', async () => {
    expect((await api.call('demo:manager', 'GET', '/sync/pull?cursor=yesterday')).status).toBe(400);
  });
});
