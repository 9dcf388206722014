import { randomUUID } from 'node:crypto';
import { unpackPullPage, type ShapeSpec } from '@plummet/shared';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, type DataApi, findingBody, startDataApi } from '../../test/data-api.js';

/**
 * Findings pulled as rows (GET /sync/pull?format=rows, shared/src/sync/finding-rows.ts): each row,
 * unpacked as the phone unpacks it, is the record the same pull answers without the parameter,
 * whichever way the finding was written.
 */
let api: DataApi;
let client: pg.Client;
beforeAll(async () => {
  api = await startDataApi();
  client = new pg.Client({ connectionString: api.t.db.url });
  await client.connect();
});
afterAll(async () => {
  await client?.end();
  await api?.t.close();
});

interface Page {
  changes: { type: string; record?: { id: string } & Record<string, unknown>; row?: unknown[] }[];
  cursor: string;
  hasMore: boolean;
}

async function pullText(format: 'rows' | 'records' | undefined, cursor?: string): Promise<string> {
  const query = new URLSearchParams({ limit: '1000', ...(format ? { format } : {}), ...(cursor ? { cursor } : {}) });
  const res = await fetch(`${api.t.baseUrl}/api/sync/pull?${query}`, { headers: { authorization: `Bearer ${api.tokens['demo:manager']}` } });
  expect(res.status).toBe(200);
  return res.text();
}

/** The findings of one page after `cursor`, by id, as records (rows unpacked as the phone does). */
async function findingsOf(format: 'rows' | 'records' | undefined, cursor: string) {
  const page = JSON.parse(await pullText(format, cursor)) as Page;
  // Each finding's size as it travelled (a row's first value is the id).
  const sizes = new Map(page.changes.filter((c) => c.type === 'finding').map((c) => [c.row ? (c.row[0] as string) : c.record!.id, JSON.stringify(c).length]));
  unpackPullPage(page);
  return { sizes, byId: new Map(page.changes.filter((c) => c.type === 'finding').map((c) => [c.record!.id, c.record!])) };
}

async function cursorNow(): Promise<string> {
  let page = JSON.parse(await pullText('records')) as Page;
  while (page.hasMore) page = JSON.parse(await pullText('records', page.cursor)) as Page;
  return page.cursor;
}

/** Waits until the feed hands out every one of `ids` (other test files share the cluster and can hold back the horizon). */
async function untilPulled(cursor: string, ids: string[]) {
  const deadline = Date.now() + 10_000;
  for (;;) {
    const found = await findingsOf('records', cursor);
    if (ids.every((id) => found.byId.has(id)) || Date.now() > deadline) return;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

const SHAPES: (ShapeSpec | null)[] = [
  null,
  { kind: 'box', lengthM: 0.3, widthM: 0.2, heightM: 0.1 },
  { kind: 'sphere', diameterM: 0.08 },
  { kind: 'cylinder', diameterM: 0.05, lengthM: 1.2 },
];

describe('findings pulled as rows', () => {
  it('unpack to the records a pull without rows answers, with every optional field set or left empty, in far fewer bytes', async () => {
    const cursor = await cursorNow();
    const bodies = [
      ...SHAPES.map((shape, i) =>
        findingBody(DEMO.unmannedScaffold, { elevation: 'South', bay: 1 + (i % 3), exposure: i % 2 ? 'hard-hats' : 'public', item: { name: `Row test item ${i}`, massKg: 0.4 + i, shape } }),
      ),
      // In an inspection with wind: the estimate carries a drift and a wind impact.
      findingBody(DEMO.preShiftScaffold, { elevation: 'Street', bay: 9, inspectionId: DEMO.openInspection, item: { name: 'Sheet of ply', massKg: 9, shape: { kind: 'box', lengthM: 1.2, widthM: 0.6, heightM: 0.018 } } }),
    ];
    const push = await api.call('demo:inspector', 'POST', '/sync/push', {
      clientId: randomUUID(),
      mutations: bodies.map((b, i) => ({ id: i + 1, entity: 'finding', entityId: b.id, action: 'create', payload: b })),
    });
    expect(push.status).toBe(200);
    expect(push.body.results.map((r: { outcome: string }) => r.outcome)).toEqual(bodies.map(() => 'applied'));
    // Through the REST routes too: created, then edited so that its estimate changes.
    const viaRest = await api.call('demo:inspector', 'POST', '/findings', findingBody(DEMO.unmannedScaffold, { elevation: 'South', bay: 2, heightM: 4 }));
    expect(viaRest.status).toBe(201);
    const edited = await api.call('demo:inspector', 'PATCH', `/findings/${viaRest.body.id}`, { heightM: 14, item: { name: 'Brick', massKg: 2.6 } });
    expect(edited.status).toBe(200);
    bodies.push({ ...bodies[0]!, id: viaRest.body.id as ReturnType<typeof randomUUID> });
    const [full, older] = [bodies[1]!.id, bodies[2]!.id];
    await client.query(
      `update findings set state = 'made-safe', due_at = '2021-03-04 05:06:07.891999+00', made_safe_until = '2031-01-02 03:04:05.000001+00',
         made_safe_note = 'Bagged, "tied" and tagged \\ at lift 3', made_safe_control = 'tether', zone_radius_m = 2.7,
         made_safe_photo_ids = array[gen_random_uuid()], assignee_id = $2::uuid,
         hand_back = jsonb_build_object('reason', 'not-my-area', 'note', 'Ask the roofer – twice', 'by', $2::text, 'at', '2026-01-02T03:04:05.678Z'),
         notes = E'Line one\\nline two – with a dash', sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq')
       where id = $1`,
      [full, api.userIds['demo:foreman']],
    );
    // An estimate changed without its row (as by hand here, or a path that forgot it) loses its row
    // (the trigger of migrations 0020 and 0021), so it travels as its object, never as the row of the old one.
    await client.query(`update findings set estimate = (estimate::jsonb - 'windPeakForceN')::json, sync_xid = pg_current_xact_id(), sync_seq = nextval('sync_change_seq') where id = $1`, [older]);
    const stored = await client.query<{ id: string; has_row: boolean }>(`select id, estimate_row is not null as has_row from findings where id = any($1::uuid[])`, [bodies.map((b) => b.id)]);
    expect(Object.fromEntries(stored.rows.map((r) => [r.id, r.has_row]))).toEqual(Object.fromEntries(bodies.map((b) => [b.id, b.id !== older])));

    const ids = bodies.map((b) => b.id);
    await untilPulled(cursor, ids);
    const asRecords = await findingsOf(undefined, cursor);
    const asRows = await findingsOf('rows', cursor);
    expect((await findingsOf('records', cursor)).byId).toEqual(asRecords.byId);
    for (const id of ids) {
      expect(asRecords.byId.get(id)).toBeDefined();
      expect(asRows.byId.get(id)).toEqual(asRecords.byId.get(id));
    }
    expect(asRows.byId.get(full)).toMatchObject({ state: 'made-safe', overdue: true, zoneRadiusM: 2.7, madeSafeControl: 'tether' });
    expect((asRows.byId.get(bodies[4]!.id)!.estimate as { driftM: number }).driftM).toBeGreaterThan(0);
    expect(asRows.byId.get(viaRest.body.id)).toMatchObject({ heightM: 14, item: { name: 'Brick', massKg: 2.6 }, version: edited.body.version });
    expect(asRows.byId.get(older)!.estimate).not.toHaveProperty('windPeakForceN');
    expect(asRows.byId.size).toBe(asRecords.byId.size);
    // Without keys, a finding whose estimate has its row travels in well under two thirds of the bytes.
    const sum = (sizes: Map<string, number>) => ids.filter((id) => id !== older).reduce((n, id) => n + sizes.get(id)!, 0);
    expect(sum(asRows.sizes)).toBeLessThan(sum(asRecords.sizes) * 0.62);
  });

  it('refuses a format it does not know', async () => {
    const res = await api.call('demo:manager', 'GET', '/sync/pull?format=columns');
    expect(res.status).toBe(400);
  });
});
