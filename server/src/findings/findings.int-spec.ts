import { randomUUID } from 'node:crypto';
import { assessDrop, BUILTIN_ITEMS, estimateFinding, FindingListItemSchema, NOTE_PREVIEW_MAX } from '@plummet/shared';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { created, DEMO, type DataApi, findingBody, finishBody, inspectionBody, LOOSE_AT_EDGE, startDataApi } from '../../test/data-api.js';
import { findings, fixes, verifications } from '../db/schema/index.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

/** A new open finding recorded by the demo inspector (on the foreman's scaffold unless told). */
const newFinding = async (a: DataApi, overrides: Record<string, unknown> = {}) =>
  created<{ id: string; state: string }>(a, 'demo:inspector', 'POST', '/findings', findingBody(DEMO.foremansScaffold, overrides));

describeAccessMatrix('findings: every route by every role of both organisations', () => api, [
  { route: 'GET /findings', request: async () => ({ path: '/findings' }), expect: [200, 200, 200, 200, 200, 200, 200, 200], listOf: 'findings' },
  { route: 'GET /findings/:id', request: async () => ({ path: `/findings/${DEMO.demoFindings[0]}` }), expect: [200, 200, 200, 200, 404, 404, 404, 404] },
  {
    route: 'POST /findings',
    request: async () => ({ path: '/findings', body: findingBody(DEMO.foremansScaffold) }),
    expect: [403, 403, 201, 403, 403, 403, 404, 403],
  },
  {
    route: 'PATCH /findings/:id',
    request: async () => ({ path: `/findings/${DEMO.demoFindings[1]}`, body: { notes: 'Coupler still there on the second walk' } }),
    expect: [403, 403, 200, 403, 403, 403, 404, 403],
  },
  {
    route: 'POST /findings/:id/state',
    request: async (a) => ({ path: `/findings/${(await newFinding(a)).id}/state`, body: { to: 'fixed', note: 'Removed', photoIds: [randomUUID()] } }),
    expect: [403, 200, 200, 200, 403, 404, 404, 404],
  },
  {
    route: 'POST /findings/:id/assign',
    request: async (a) => ({ path: `/findings/${(await newFinding(a)).id}/assign`, body: { assigneeId: a.userIds['demo:foreman'], dueAt: '2099-01-01T12:00:00Z' } }),
    expect: [200, 200, 200, 403, 404, 404, 404, 403],
  },
]);

describe('the estimate of a finding', () => {
  it('is recomputed on the server: 1 kg from 20 m carries the shared physics energy, whatever the client sent', async () => {
    const body = findingBody(DEMO.foremansScaffold, {
      heightM: 20,
      item: { name: 'Test mass', massKg: 1 },
      estimate: { impactEnergyJ: 1, impactVelocityMps: 1 },
      severity: 1,
      riskScore: 1,
      riskBand: 'Low',
      likelihood: 1,
    });
    const res = await api.call('demo:inspector', 'POST', '/findings', body);
    expect(res.status).toBe(201);
    const physics = assessDrop({ massKg: 1, heightM: 20, exposure: 'bare-head' });
    // No shape, so no drag: the vacuum worst case, m g h = 1 × 9.80665 × 20 = 196.133 J
    // (standard gravity g_n = 9.80665 m/s², 3rd CGPM 1901; ISO 80000-3:2019).
    expect(physics.impactEnergyJ).toBeCloseTo(196.133, 3);
    expect(res.body.estimate.impactEnergyJ).toBe(physics.impactEnergyJ);
    expect(res.body.severity).toBe(physics.severity.level);
    const expected = estimateFinding({ massKg: 1, heightM: 20, shape: null, exposure: 'public', likelihoodAnswers: LOOSE_AT_EDGE });
    expect(res.body).toMatchObject({ riskScore: expected.riskScore, riskBand: expected.riskBand, likelihood: expected.likelihood });
    const [row] = await api.t.drizzle.select().from(findings).where(eq(findings.id, body.id));
    expect((row.estimate as { impactEnergyJ: number }).impactEnergyJ).toBe(physics.impactEnergyJ);
    expect(row.riskScore).toBe(expected.riskScore);
  });

  it('copies a catalogue item’s mass and shape and uses the inspection’s wind for the drift', async () => {
    const board = BUILTIN_ITEMS.find((i) => i.name === 'Board offcut (1 m)')!;
    const inspection = await created(api, 'demo:inspector', 'POST', '/inspections', inspectionBody(DEMO.foremansScaffold, { windSpeedMps: 9 }));
    const res = await api.call(
      'demo:inspector',
      'POST',
      '/findings',
      findingBody(DEMO.foremansScaffold, { inspectionId: inspection.id, heightM: 12, exposure: 'hard-hats', item: { catalogueItemId: board.id } }),
    );
    expect(res.status).toBe(201);
    expect(res.body.item).toEqual({ catalogueItemId: board.id, name: board.name, massKg: board.massKg, shape: board.shape });
    const expected = estimateFinding({ massKg: board.massKg, heightM: 12, shape: board.shape, exposure: 'hard-hats', likelihoodAnswers: LOOSE_AT_EDGE, windSpeedMps: 9 });
    expect(res.body.estimate.impactEnergyJ).toBeCloseTo(expected.estimate.impactEnergyJ, 9);
    expect(res.body.estimate.driftM).toBeGreaterThan(0);
    expect(res.body.estimate.driftM).toBeCloseTo(expected.estimate.driftM, 9);
  });

  it('is recomputed when an edit changes the height, ignoring estimate fields in the edit', async () => {
    const finding = await newFinding(api, { heightM: 4, item: { name: 'Test mass', massKg: 1 } });
    const res = await api.call('demo:inspector', 'PATCH', `/findings/${finding.id}`, { heightM: 20, estimate: { impactEnergyJ: 0 }, riskScore: 1 });
    expect(res.status).toBe(200);
    expect(res.body.estimate.impactEnergyJ).toBe(assessDrop({ massKg: 1, heightM: 20, exposure: 'bare-head' }).impactEnergyJ);
    expect(res.body.version).toBe(2);
  });

  it('refuses masses and heights outside physical ranges, naming the field', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ item: { name: 'Negative', massKg: -1 } }, 'item.massKg'],
      [{ item: { name: 'Huge', massKg: 5001 } }, 'item.massKg'],
      [{ heightM: 0 }, 'heightM'],
      [{ heightM: 1000.5 }, 'heightM'],
      [{ item: { name: 'Flat', massKg: 1, shape: { kind: 'plate', lengthM: 1, widthM: -1, thicknessM: 0.01 } } }, 'item.shape.widthM'],
      [{ item: { catalogueItemId: BUILTIN_ITEMS[0].id, massKg: 2 } }, 'item.massKg'],
      [{ likelihoodAnswers: { ...LOOSE_AT_EDGE, wind: 'gale' } }, 'likelihoodAnswers.wind'],
      [{ notes: 'x'.repeat(4001) }, 'notes'],
      [{ elevation: 'West' }, 'elevation'],
      [{ lift: 7 }, 'lift'],
      [{ bay: 13 }, 'bay'],
    ];
    for (const [overrides, field] of cases) {
      const res = await api.call('demo:inspector', 'POST', '/findings', findingBody(DEMO.foremansScaffold, overrides));
      expect(res.status, field).toBe(400);
      expect(res.body.issues.map((i: { path: unknown[] }) => i.path.join('.')), field).toContain(field);
    }
  });
});

describe('recording a finding with the phone’s id', () => {
  it('answers 200 with the stored finding when the same body comes again, 409 for another body', async () => {
    const body = findingBody(DEMO.foremansScaffold, { item: { name: 'Offcut', massKg: 0.7 }, heightM: 9.3 });
    const first = await api.call('demo:inspector', 'POST', '/findings', body);
    const again = await api.call('demo:inspector', 'POST', '/findings', body);
    expect([first.status, again.status]).toEqual([201, 200]);
    expect(again.body).toEqual(first.body);
    expect((await api.call('demo:inspector', 'POST', '/findings', { ...body, heightM: 9.4 })).status).toBe(409);
  });

  it('answers 404 when another organisation holds the id', async () => {
    const body = findingBody(DEMO.otherScaffold, { elevation: 'Front' });
    await created(api, 'other:inspector', 'POST', '/findings', body);
    expect((await api.call('demo:inspector', 'POST', '/findings', { ...body, scaffoldId: DEMO.foremansScaffold, elevation: 'North' })).status).toBe(404);
  });

  it('refuses an inspection of another scaffold (400) or one already signed (409)', async () => {
    const other = await api.call('demo:inspector', 'POST', '/findings', findingBody(DEMO.foremansScaffold, { inspectionId: DEMO.openInspection }));
    expect(other.status).toBe(400);
    expect(other.body.issues[0].path).toEqual(['inspectionId']);
    const signed = await api.call('demo:inspector', 'POST', '/findings', findingBody(DEMO.foremansScaffold, { inspectionId: DEMO.finishedInspection }));
    expect(signed.status).toBe(409);
  });
});

describe('the state of a finding', () => {
  /** A state change with a proof photo (the demo findings are High) and a note (a reopen needs one). */
  const move = (who: Parameters<DataApi['call']>[0], id: string, to: string, note = 'Seen on the walk') =>
    api.call(who, 'POST', `/findings/${id}/state`, { to, note, photoIds: [randomUUID()] });

  it('goes open → made safe → fixed → verified, writing a fix and a verification', async () => {
    const { id } = await newFinding(api);
    expect((await move('demo:inspector', id, 'made-safe', 'Bagged')).body).toMatchObject({ state: 'made-safe', madeSafeNote: 'Bagged' });
    expect((await move('demo:foreman', id, 'fixed', 'Toe board refitted')).body.state).toBe('fixed');
    expect((await move('demo:manager', id, 'verified', 'Seen on walk')).body).toMatchObject({ state: 'verified', version: 4 });
    const fixRows = await api.t.drizzle.select().from(fixes).where(eq(fixes.findingId, id));
    expect(fixRows).toMatchObject([{ fixedBy: api.userIds['demo:foreman'], note: 'Toe board refitted' }]);
    const checks = await api.t.drizzle.select().from(verifications).where(eq(verifications.findingId, id));
    expect(checks).toMatchObject([{ verifiedBy: api.userIds['demo:manager'], outcome: 'verified' }]);
  });

  it('can be reopened from fixed or verified by an inspector or manager, never by a foreman', async () => {
    const { id } = await newFinding(api);
    await move('demo:foreman', id, 'fixed');
    expect((await move('demo:foreman', id, 'open')).status).toBe(403);
    expect((await move('demo:inspector', id, 'open', 'Coupler back on the boards')).body.state).toBe('open');
    await move('demo:foreman', id, 'fixed');
    await move('demo:inspector', id, 'verified');
    expect((await move('demo:manager', id, 'open')).body.state).toBe('open');
    const checks = await api.t.drizzle.select().from(verifications).where(eq(verifications.findingId, id));
    expect(checks.map((c) => c.outcome).sort()).toEqual(['reopened', 'reopened', 'verified']);
  });

  it('refuses moves that are not in the table with 409 and changes nothing', async () => {
    const { id } = await newFinding(api);
    const res = await move('demo:manager', id, 'verified');
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('CONFLICT');
    // The state it is already in: nothing to change, answered like a push answers it (applied, no new version).
    const same = await move('demo:manager', id, 'open');
    expect(same.status).toBe(200);
    expect(same.body).toMatchObject({ state: 'open', version: 1 });
    await move('demo:manager', id, 'fixed');
    expect((await move('demo:manager', id, 'made-safe')).status).toBe(409);
    const [row] = await api.t.drizzle.select().from(findings).where(eq(findings.id, id));
    expect(row).toMatchObject({ state: 'fixed', version: 2 });
  });

  it('lets a foreman see and fix only findings on their scaffolds or assigned to them', async () => {
    const elsewhere = await newFinding(api, { scaffoldId: DEMO.unmannedScaffold, elevation: 'South' });
    expect((await api.call('demo:foreman', 'GET', `/findings/${elsewhere.id}`)).status).toBe(404);
    expect((await move('demo:foreman', elsewhere.id, 'fixed')).status).toBe(404);
    const list = await api.call('demo:foreman', 'GET', '/findings?limit=200');
    expect(list.body.items.map((f: { id: string }) => f.id)).not.toContain(elsewhere.id);

    await created(api, 'demo:manager', 'POST', `/findings/${elsewhere.id}/assign`, { assigneeId: api.userIds['demo:foreman'] });
    expect((await api.call('demo:foreman', 'GET', `/findings/${elsewhere.id}`)).status).toBe(200);
    expect((await move('demo:foreman', elsewhere.id, 'fixed', 'Cleared')).body.state).toBe('fixed');
    expect((await move('demo:foreman', elsewhere.id, 'verified')).status).toBe(403);
  });

  it('shows every foreman-visible finding to the foreman and no other', async () => {
    const list = await api.call('demo:foreman', 'GET', '/findings?limit=200');
    const scaffolds = new Set([DEMO.foremansScaffold, DEMO.preShiftScaffold]);
    for (const f of list.body.items) expect(scaffolds.has(f.scaffoldId) || f.assigneeId === api.userIds['demo:foreman']).toBe(true);
    const all = await api.call('demo:manager', 'GET', '/findings?limit=200');
    const expected = all.body.items.filter((f: { scaffoldId: string; assigneeId: string }) => scaffolds.has(f.scaffoldId) || f.assigneeId === api.userIds['demo:foreman']);
    expect(list.body.items.length).toBe(expected.length);
  });
});

describe('assigning a finding', () => {
  it('only hands a finding to a foreman of the organisation', async () => {
    const { id } = await newFinding(api);
    for (const who of ['demo:inspector', 'other:foreman'] as const) {
      const res = await api.call('demo:manager', 'POST', `/findings/${id}/assign`, { assigneeId: api.userIds[who] });
      expect(res.status).toBe(400);
      expect(res.body.issues[0].path).toEqual(['assigneeId']);
    }
  });

  it('marks an open finding past its due time as overdue, and a fixed one not', async () => {
    const { id } = await newFinding(api);
    const res = await api.call('demo:manager', 'POST', `/findings/${id}/assign`, { assigneeId: api.userIds['demo:foreman'], dueAt: '2020-01-01T00:00:00Z' });
    expect(res.body).toMatchObject({ overdue: true, assigneeId: api.userIds['demo:foreman'] });
    const fixed = await api.call('demo:manager', 'POST', `/findings/${id}/state`, { to: 'fixed', photoIds: [randomUUID()] });
    expect(fixed.body.overdue).toBe(false);
  });
});

describe('listing findings', () => {
  it('filters by site, scaffold, state, risk band, assignee and overdue', async () => {
    const ids = async (q: string) => new Set((await api.call('demo:manager', 'GET', `/findings?limit=200&${q}`)).body.items.map((f: { id: string }) => f.id));
    const all = (await api.call('demo:manager', 'GET', '/findings?limit=200')).body.items as {
      id: string; scaffoldId: string; state: string; riskBand: string; assigneeId: string | null; overdue: boolean;
    }[];
    const expectSet = (pick: (f: (typeof all)[number]) => boolean) => new Set(all.filter(pick).map((f) => f.id));
    const foreman = api.userIds['demo:foreman'];
    expect(await ids(`siteId=${DEMO.fennelSite}`)).toEqual(expectSet((f) => f.scaffoldId === DEMO.preShiftScaffold || f.scaffoldId === DEMO.loadingBayScaffold));
    expect(await ids(`scaffoldId=${DEMO.unmannedScaffold}`)).toEqual(expectSet((f) => f.scaffoldId === DEMO.unmannedScaffold));
    expect(await ids('state=open,made-safe')).toEqual(expectSet((f) => f.state === 'open' || f.state === 'made-safe'));
    expect(await ids('riskBand=Low&riskBand=Medium')).toEqual(expectSet((f) => f.riskBand !== 'High'));
    expect(await ids(`assigneeId=${foreman}`)).toEqual(expectSet((f) => f.assigneeId === foreman));
    const overdue = await ids('overdue=true');
    expect(overdue).toEqual(expectSet((f) => f.overdue));
    expect(overdue.size).toBeGreaterThan(0);
    expect(await ids('overdue=false')).toEqual(expectSet((f) => !f.overdue));
  });

  it('pages the whole list, highest risk first, with no repeats or gaps', async () => {
    const all = (await api.call('demo:manager', 'GET', '/findings?limit=200')).body.items.map((f: { id: string }) => f.id);
    const seen: string[] = [];
    const scores: number[] = [];
    let cursor: string | null = null;
    do {
      const res = await api.call('demo:manager', 'GET', `/findings?limit=3${cursor ? `&cursor=${cursor}` : ''}`);
      seen.push(...res.body.items.map((f: { id: string }) => f.id));
      scores.push(...res.body.items.map((f: { riskScore: number }) => f.riskScore));
      cursor = res.body.nextCursor;
    } while (cursor);
    expect(seen).toEqual(all);
    expect([...scores].sort((a, b) => b - a)).toEqual(scores);
  });

  it('sorts by due time with findings that have none last, across pages', async () => {
    const seen: (string | null)[] = [];
    let cursor: string | null = null;
    do {
      const res = await api.call('demo:manager', 'GET', `/findings?sort=dueAt&order=asc&limit=4${cursor ? `&cursor=${cursor}` : ''}`);
      seen.push(...res.body.items.map((f: { dueAt: string | null }) => f.dueAt));
      cursor = res.body.nextCursor;
    } while (cursor);
    const dated = seen.filter((d): d is string => d !== null);
    expect(seen.slice(0, dated.length)).toEqual([...dated].sort());
    expect(seen.slice(dated.length).every((d) => d === null)).toBe(true);
  });

  it('lists rows without the estimate, each matching its detail, and whole findings with estimate=full', async () => {
    const preview = (notes: string) => (notes.length > NOTE_PREVIEW_MAX ? `${notes.slice(0, NOTE_PREVIEW_MAX - 1)}…` : notes);
    const list = await api.call('demo:manager', 'GET', '/findings?limit=5');
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(5);
    for (const item of list.body.items) {
      expect(FindingListItemSchema.strict().safeParse(item).success).toBe(true);
      const detail = (await api.call('demo:manager', 'GET', `/findings/${item.id}`)).body;
      expect(item).toEqual({
        id: detail.id, scaffoldId: detail.scaffoldId, elevation: detail.elevation, lift: detail.lift, bay: detail.bay, heightM: detail.heightM,
        itemName: detail.item.name, riskScore: detail.riskScore, riskBand: detail.riskBand, state: detail.state, assigneeId: detail.assigneeId,
        dueAt: detail.dueAt, overdue: detail.overdue, notePreview: preview(detail.notes), createdAt: detail.createdAt,
      });
    }
    const full = await api.call('demo:manager', 'GET', '/findings?limit=1&estimate=full');
    expect(full.body.items[0]).toEqual((await api.call('demo:manager', 'GET', `/findings/${full.body.items[0].id}`)).body);
  });

  it('cuts a long note short in the list and keeps it whole in the detail', async () => {
    const notes = `${'Loose fittings along the whole lift, '.repeat(4)}end`;
    const { id } = await newFinding(api, { notes });
    const row = (await api.call('demo:manager', 'GET', `/findings?limit=200&q=${encodeURIComponent('whole lift')}`)).body.items.find((f: { id: string }) => f.id === id);
    expect(row.notePreview).toBe(`${notes.slice(0, NOTE_PREVIEW_MAX - 1)}…`);
    expect(row.notePreview).toHaveLength(NOTE_PREVIEW_MAX);
    expect((await api.call('demo:manager', 'GET', `/findings/${id}`)).body.notes).toBe(notes);
  });

  it('refuses unknown filters values and sorts with 400', async () => {
    for (const q of ['state=closed', 'riskBand=Extreme', 'sort=notes', 'overdue=maybe', 'limit=0', 'siteId=nope']) {
      expect((await api.call('demo:manager', 'GET', `/findings?${q}`)).status, q).toBe(400);
    }
  });
});

describe('a finished inspection', () => {
  it('keeps its findings readable by the whole organisation', async () => {
    const inspection = await created(api, 'demo:inspector', 'POST', '/inspections', inspectionBody(DEMO.foremansScaffold));
    const finding = await newFinding(api, { inspectionId: inspection.id });
    await created(api, 'demo:inspector', 'POST', `/inspections/${inspection.id}/finish`, finishBody());
    const list = await api.call('demo:foreman', 'GET', `/findings?inspectionId=${inspection.id}`);
    expect(list.body.items.map((f: { id: string }) => f.id)).toEqual([finding.id]);
  });
});
