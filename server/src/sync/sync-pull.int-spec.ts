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

  it('writes each finding as the findings API reads it, with every optional field set or left empty', async () => {
    const { cursor } = await pullAll('demo:manager');
    const shaped = { name: 'Bucket of fixings', massKg: 7.3, shape: { kind: 'box', lengthM: 0.3, widthM: 0.3, heightM: 0.35 } };
    const [bare, full, fixed] = await pushCreates(3);
    const client = new pg.Client({ connectionString: api.t.db.url });
    await client.connect();
    try {
      // Times with microseconds (a Date keeps milliseconds), a due time passed, every nullable column set.
      await client.query(
        `update findings set state = 'made-safe', due_at = '2021-03-04 05:06:07.891999+00', made_safe_until = '2031-01-02 03:04:05.000001+00',
           made_safe_note = 'Bagged, "tied" and tagged \\ at lift 3', made_safe_control = 'tether', zone_radius_m = 2.7,
           made_safe_photo_ids = array[gen_random_uuid(), gen_random_uuid()], assignee_id = $2::uuid, inspection_id = $3,
           hand_back = jsonb_build_object('reason', 'not-my-area', 'note', 'Ask the roofer', 'by', $2::text, 'at', '2026-01-02T03:04:05.678Z'),
           notes = E'Line one\nline two – with a dash', created_at = '2025-12-31 23:59:59.999999+00', updated_at = now(),
           sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq')
         where id = $1`,
        [full, api.userIds['demo:foreman'], DEMO.openInspection],
      );
      // Fixed: a passed due time no longer makes it overdue.
      await client.query(
        `update findings set state = 'fixed', due_at = now() - interval '1 day', updated_at = now(), sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq') where id = $1`,
        [fixed],
      );
    } finally {
      await client.end();
    }
    const withShape = await api.call('demo:inspector', 'POST', '/findings', findingBody(DEMO.unmannedScaffold, { elevation: 'South', bay: 1, item: shaped }));
    expect(withShape.status).toBe(201);
    const ids = [bare!, full!, fixed!, withShape.body.id as string];
    await pullAll('demo:manager', cursor, 500, ids);
    const pulled = (await pull('demo:manager', cursor)).changes.filter((c) => c.type === 'finding' && ids.includes(c.record.id));
    expect(pulled).toHaveLength(4);
    for (const change of pulled) {
      const rest = await api.call('demo:manager', 'GET', `/findings/${change.record.id}`);
      expect(rest.status).toBe(200);
      expect(change.record).toEqual({ ...rest.body, organisationId: expect.any(String), siteId: DEMO.quaysideSite });
    }
    const byId = new Map(pulled.map((c) => [c.record.id, c.record]));
    expect(byId.get(full!)).toMatchObject({ overdue: true, dueAt: '2021-03-04T05:06:07.891Z', madeSafeUntil: '2031-01-02T03:04:05.000Z', createdAt: '2025-12-31T23:59:59.999Z', zoneRadiusM: 2.7 });
    expect(byId.get(fixed!)).toMatchObject({ overdue: false, state: 'fixed' });
    expect(byId.get(bare!)).toMatchObject({ overdue: false, madeSafeUntil: null, madeSafeControl: null, zoneRadiusM: null, handBack: null, madeSafePhotoIds: [] });
  });

  it('refuses a malformed cursor', async () => {
    expect((await api.call('demo:manager', 'GET', '/sync/pull?cursor=yesterday')).status).toBe(400);
  });
});
