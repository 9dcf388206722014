import { randomUUID } from 'node:crypto';
import { madeSafeLapsesAt, readOrganisationSettings } from '@plummet/shared';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeAccessMatrix } from '../../test/access-matrix.js';
import { created, DEMO, type DataApi, findingBody, startDataApi, type Who } from '../../test/data-api.js';
import { findings, fixes, scaffolds } from '../db/schema/index.js';

let api: DataApi;
beforeAll(async () => {
  api = await startDataApi();
});
afterAll(async () => {
  await api?.t.close();
});

type Body = Record<string, unknown>;
const HOUR = 3_600_000;
/** Away from the edge, secured, no traffic: a Low band for a light item. */
const LOW_ANSWERS = { securing: 'secured', edgeDistance: 'away', activity: 'none', wind: 'calm', footTraffic: 'none' };

const newFinding = async (overrides: Body = {}) =>
  created<{ id: string; riskBand: string; dueAt: string | null; createdAt: string }>(api, 'demo:inspector', 'POST', '/findings', findingBody(DEMO.foremansScaffold, overrides));
const move = (who: Who, id: string, body: Body) => api.call(who, 'POST', `/findings/${id}/state`, { note: 'Done', photoIds: [randomUUID()], ...body });
const setSettings = (settings: Body) => api.t.drizzle.execute(sql`update organisations set settings = ${JSON.stringify(settings)}::jsonb where slug = 'harrow-span'`);

describeAccessMatrix('fix loop routes by every role of both organisations', () => api, [
  {
    route: 'POST /findings/:id/hand-back',
    request: async () => ({ path: `/findings/${(await newFinding()).id}/hand-back`, body: { reason: 'needs-scaffolders', note: 'Needs a boarded lift' } }),
    expect: [403, 403, 403, 200, 403, 403, 403, 404],
  },
  {
    route: 'GET /findings/:id/history',
    request: async () => ({ path: `/findings/${DEMO.demoFindings[0]}/history` }),
    expect: [200, 200, 200, 200, 404, 404, 404, 404],
  },
]);

describe('the due time of a fix', () => {
  it('follows the band and the organisation setting: High 24 h, Medium 72 h by default, Low the next inspection', async () => {
    const high = await newFinding();
    expect(high.riskBand).toBe('High');
    expect(Date.parse(high.dueAt!) - Date.parse(high.createdAt)).toBe(24 * HOUR);

    await setSettings({ fixDueHours: { High: 6, Medium: 48 } });
    try {
      const sooner = await newFinding();
      expect(Date.parse(sooner.dueAt!) - Date.parse(sooner.createdAt)).toBe(6 * HOUR);
      const low = await newFinding({ likelihoodAnswers: LOW_ANSWERS, item: { name: 'Washer', massKg: 0.01 }, exposure: 'zone-closed', heightM: 1 });
      expect(low.riskBand).toBe('Low');
      const [scaffold] = await api.t.drizzle.select().from(scaffolds).where(eq(scaffolds.id, DEMO.foremansScaffold));
      expect(low.dueAt).toBe(scaffold!.nextDueAt?.toISOString() ?? null);
      // An edit that raises the band moves the due time (from when the finding was raised).
      const raised = await api.call('demo:inspector', 'PATCH', `/findings/${low.id}`, { likelihoodAnswers: findingBody(DEMO.foremansScaffold).likelihoodAnswers, exposure: 'public', heightM: 20, item: { name: 'Coupler', massKg: 1.1 } });
      expect(raised.body.riskBand).toBe('High');
      expect(Date.parse(raised.body.dueAt) - Date.parse(low.createdAt)).toBe(6 * HOUR);
    } finally {
      await setSettings({});
    }
  });

  it('keeps the computed due time when an assignment gives none, and takes a given one', async () => {
    const f = await newFinding();
    const kept = await created<{ dueAt: string }>(api, 'demo:manager', 'POST', `/findings/${f.id}/assign`, { assigneeId: api.userIds['demo:foreman'] });
    expect(kept.dueAt).toBe(f.dueAt);
    const given = await created<{ dueAt: string }>(api, 'demo:manager', 'POST', `/findings/${f.id}/assign`, { assigneeId: api.userIds['demo:foreman'], dueAt: '2099-01-01T12:00:00.000Z' });
    expect(given.dueAt).toBe('2099-01-01T12:00:00.000Z');
  });
});

describe('making safe and fixing', () => {
  it('keeps the made-safe measure with its control, zone radius, photo and the end of the shift it lapses at', async () => {
    const f = await newFinding();
    const photo = randomUUID();
    const res = await move('demo:inspector', f.id, { to: 'made-safe', note: 'Zone taped off', control: 'close-zone', zoneRadiusM: 4.5, photoIds: [photo] });
    expect(res.status).toBe(200);
    const [row] = await api.t.drizzle.select().from(findings).where(eq(findings.id, f.id));
    const lapses = madeSafeLapsesAt(row!.updatedAt, readOrganisationSettings({}));
    expect(res.body).toMatchObject({ state: 'made-safe', madeSafeNote: 'Zone taped off', madeSafeControl: 'close-zone', zoneRadiusM: 4.5, madeSafePhotoIds: [photo], madeSafeUntil: lapses.toISOString() });
  });

  it('needs a proof photo for a High finding unless the organisation says otherwise', async () => {
    const f = await newFinding();
    const res = await move('demo:foreman', f.id, { to: 'fixed', photoIds: [] });
    expect(res.status).toBe(400);
    expect(res.body.issues[0]).toMatchObject({ path: ['photoIds'], code: 'proof_photo_required' });
    expect((await api.call('demo:manager', 'GET', `/findings/${f.id}`)).body).toMatchObject({ state: 'open', version: 1 });
    await setSettings({ proofPhotoRequiredForHigh: false });
    try {
      expect((await move('demo:foreman', f.id, { to: 'fixed', photoIds: [] })).status).toBe(200);
    } finally {
      await setSettings({});
    }
  });

  it('stores a fix with its control and photos, and an alteration marks the scaffold altered and due for inspection now', async () => {
    const f = await newFinding({ scaffoldId: DEMO.unmannedScaffold, elevation: 'South' });
    const recordId = randomUUID();
    const photo = randomUUID();
    const res = await move('demo:manager', f.id, { to: 'fixed', control: 'fit-toe-board', photoIds: [photo], recordId, note: 'Toe board fitted' });
    expect(res.status).toBe(200);
    const [fix] = await api.t.drizzle.select().from(fixes).where(eq(fixes.id, recordId));
    expect(fix).toMatchObject({ findingId: f.id, control: 'fit-toe-board', photoIds: [photo], note: 'Toe board fitted' });
    const [finding] = await api.t.drizzle.select().from(findings).where(eq(findings.id, f.id));
    const [scaffold] = await api.t.drizzle.select().from(scaffolds).where(eq(scaffolds.id, finding!.scaffoldId));
    expect(scaffold!.alteredAt?.getTime()).toBe(fix!.fixedAt.getTime());
    expect(scaffold!.nextDueAt?.getTime()).toBe(fix!.fixedAt.getTime());
  });

  it('refuses an unknown control, a photo owned by another record, a reopen without a reason and a forbidden move, writing nothing', async () => {
    const f = await newFinding();
    const unknown = await move('demo:manager', f.id, { to: 'fixed', control: 'glue-it' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.issues[0].path).toEqual(['control']);

    const other = await newFinding();
    const photo = randomUUID();
    await api.t.drizzle.execute(sql`insert into photos (id, organisation_id, owner_type, owner_id, content_hash, size_bytes, media_type, storage_key, thumbnail_key, uploaded_by)
      select ${photo}::uuid, organisation_id, 'finding', id, 'h', 1, 'image/jpeg', 'k', 't', created_by from findings where id = ${other.id}::uuid`);
    const owned = await move('demo:manager', f.id, { to: 'fixed', photoIds: [photo] });
    expect(owned.status).toBe(400);
    expect(owned.body.issues[0]).toMatchObject({ path: ['photoIds'], code: 'photo_owned_elsewhere' });

    expect((await move('demo:manager', f.id, { to: 'verified' })).status).toBe(409);
    expect((await move('demo:manager', f.id, { to: 'fixed' })).status).toBe(200);
    const reopen = await move('demo:manager', f.id, { to: 'open', note: '  ' });
    expect(reopen.status).toBe(400);
    expect(reopen.body.issues[0]).toMatchObject({ path: ['note'], code: 'reason_required' });
    expect((await api.call('demo:manager', 'GET', `/findings/${f.id}`)).body).toMatchObject({ state: 'fixed', version: 2 });
  });
});

describe('separation of duties', () => {
  it('refuses the fixer’s own verification with 403 VERIFIER_IS_FIXER, and lets another verify', async () => {
    const f = await newFinding();
    expect((await move('demo:inspector', f.id, { to: 'fixed' })).status).toBe(200);
    const own = await move('demo:inspector', f.id, { to: 'verified' });
    expect(own.status).toBe(403);
    expect(own.body.code).toBe('VERIFIER_IS_FIXER');
    expect((await move('demo:manager', f.id, { to: 'verified' })).body.state).toBe('verified');
  });

  it('lets the fixer verify when the organisation turns the rule off', async () => {
    const f = await newFinding();
    await move('demo:inspector', f.id, { to: 'fixed' });
    await setSettings({ verifierMustDifferFromFixer: false });
    try {
      expect((await move('demo:inspector', f.id, { to: 'verified' })).status).toBe(200);
    } finally {
      await setSettings({});
    }
  });
});

describe('handing back and reassigning', () => {
  it('records the hand back for a manager, keeps the assignee, and a new assignment clears it', async () => {
    const f = await newFinding();
    await created(api, 'demo:inspector', 'POST', `/findings/${f.id}/assign`, { assigneeId: api.userIds['demo:foreman'] });
    const back = await api.call('demo:foreman', 'POST', `/findings/${f.id}/hand-back`, { reason: 'not-my-area', note: 'Roof level is the other gang' });
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ assigneeId: api.userIds['demo:foreman'], state: 'open', handBack: { reason: 'not-my-area', note: 'Roof level is the other gang', by: api.userIds['demo:foreman'] } });
    const again = await created<{ handBack: unknown }>(api, 'demo:manager', 'POST', `/findings/${f.id}/assign`, { assigneeId: api.userIds['demo:foreman'] });
    expect(again.handBack).toBeNull();
  });

  it('lets a foreman act only on findings assigned to them, or on their scaffolds while nobody is assigned', async () => {
    const f = await newFinding();
    const otherForeman = randomUUID();
    await api.t.drizzle.execute(sql`insert into users (id, email, name, password_hash) values (${otherForeman}::uuid, ${`f-${otherForeman}@demo.test`}, 'Second foreman', 'x')`);
    await api.t.drizzle.execute(sql`insert into memberships (user_id, organisation_id, role) select ${otherForeman}::uuid, id, 'foreman' from organisations where slug = 'harrow-span'`);
    await created(api, 'demo:manager', 'POST', `/findings/${f.id}/assign`, { assigneeId: otherForeman });
    expect((await move('demo:foreman', f.id, { to: 'fixed' })).status).toBe(403);
    expect((await api.call('demo:foreman', 'POST', `/findings/${f.id}/hand-back`, { reason: 'cannot-fix' })).status).toBe(403);
  });
});

describe('the history of a finding', () => {
  it('lists created, made safe, assignment, hand back, fix, reopen and verification with who, note, control and photos, oldest first', async () => {
    const f = await newFinding({ notes: 'Coupler at the edge' });
    const safePhoto = randomUUID();
    const fixPhoto = randomUUID();
    const fixId = randomUUID();
    await move('demo:inspector', f.id, { to: 'made-safe', control: 'close-zone', photoIds: [safePhoto], note: 'Zone closed' });
    await created(api, 'demo:inspector', 'POST', `/findings/${f.id}/assign`, { assigneeId: api.userIds['demo:foreman'] });
    await created(api, 'demo:foreman', 'POST', `/findings/${f.id}/hand-back`, { reason: 'needs-scaffolders' });
    await move('demo:foreman', f.id, { to: 'fixed', control: 'tether', photoIds: [fixPhoto], recordId: fixId, note: 'Tethered' });
    await move('demo:inspector', f.id, { to: 'open', note: 'Tether too long' });
    await move('demo:foreman', f.id, { to: 'fixed', note: 'Shorter tether' });
    await move('demo:manager', f.id, { to: 'verified', note: 'Good' });

    const res = await api.call('demo:foreman', 'GET', `/findings/${f.id}/history`);
    expect(res.status).toBe(200);
    const lines = res.body.items as { kind: string; to: string | null; by: string; note: string; control: string | null; photoIds: string[]; recordId: string | null; reason: string | null }[];
    expect(lines.map((l) => `${l.kind}${l.to ? `:${l.to}` : ''}`)).toEqual([
      'created:open', 'state:made-safe', 'assign', 'hand-back', 'state:fixed', 'state:open', 'state:fixed', 'state:verified',
    ]);
    expect(lines[0]).toMatchObject({ by: api.userIds['demo:inspector'], note: 'Coupler at the edge' });
    expect(lines[1]).toMatchObject({ control: 'close-zone', photoIds: [safePhoto], note: 'Zone closed' });
    expect(lines[3]).toMatchObject({ reason: 'needs-scaffolders', by: api.userIds['demo:foreman'] });
    expect(lines[4]).toMatchObject({ control: 'tether', photoIds: [fixPhoto], recordId: fixId, by: api.userIds['demo:foreman'] });
    expect(lines[7]).toMatchObject({ by: api.userIds['demo:manager'], note: 'Good' });
    const times = res.body.items.map((l: { at: string }) => Date.parse(l.at));
    expect([...times].sort((a, b) => a - b)).toEqual(times);
  });
});
