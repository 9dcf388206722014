/**
 * Sync converges: five phones (four devices of the inspector, one of the foreman) run the
 * real client sync engine over fake-indexeddb against two server instances on one PostgreSQL
 * database, with random offline periods, dropped requests (server killed before commit), dropped
 * answers (killed after commit), duplicated and late (reordered) deliveries, and device clocks
 * ±24 h. After a full sync, every phone's findings equal the server's, every mutation a phone was
 * told about is applied, conflicted or rejected on the server exactly once, and the counts reconcile.
 * SYNC_SCHEDULES=n runs n schedules (default 200).
 */
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import type { SyncMutationResult } from '@plummet/shared';
import { inArray, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../../server/test/data-api.js';
import { startTestApp, type TestApp } from '../../server/test/test-app.js';
import { createApp } from '../../server/src/bootstrap.js';
import { loadConfig } from '../../server/src/config/config.js';
import { findings, syncConflicts, syncMutations } from '../../server/src/db/schema/index.js';
import { deliverLate, loadMobile, type Network, Phone, type PhoneFinding, prng } from './sync-harness.js';

/** How many random schedules to run: a positive whole number; 0 or anything else is an error, not a pass. */
function schedulesFrom(value: string | undefined): number {
  if (value === undefined) return 200;
  const n = Number(value);
  if (!/^\s*\d+\s*$/.test(value) || !Number.isSafeInteger(n) || n < 1) throw new Error(`SYNC_SCHEDULES must be a positive whole number, not "${value}"`);
  return n;
}

const SCHEDULES = schedulesFrom(process.env.SYNC_SCHEDULES);
const DAY_MS = 24 * 60 * 60 * 1000;

let t: TestApp;
let second: Awaited<ReturnType<typeof createApp>>;
let servers: string[];
let inspectorToken: string;
let foremanToken: string;
let orgId: string;
let siteId: string;
let m: Awaited<ReturnType<typeof loadMobile>>;

beforeAll(async () => {
  m = await loadMobile();
  t = await startTestApp();
  second = await createApp(loadConfig({ ...process.env, ...t.db.serverEnv, PORT: '0', LOG_LEVEL: 'warn' }));
  await second.listen(0, '127.0.0.1');
  servers = [t.baseUrl, `http://127.0.0.1:${(second.getHttpServer().address() as { port: number }).port}`];
  inspectorToken = await t.tokenFor('inspector@demo.test');
  foremanToken = await t.tokenFor('foreman@demo.test');
  const [row] = (await t.drizzle.execute<{ org: string; site: string }>(sql`select organisation_id as org, site_id as site from scaffolds where id = ${DEMO.foremansScaffold}`)).rows;
  orgId = row!.org;
  siteId = row!.site;
});

afterAll(async () => {
  await second?.close();
  await t?.close();
});

type Step =
  | { kind: 'edit'; phone: number; finding: number; field: 'notes' | 'heightM' | 'lift'; value: number }
  | { kind: 'state'; phone: number; finding: number; to: 'made-safe' | 'fixed' | 'verified' | 'open' }
  | { kind: 'sync'; phone: number }
  | { kind: 'offline' | 'online'; phone: number }
  | { kind: 'late' };

const PHONES = 5;
const FINDINGS = 2;
const phoneIx = fc.integer({ min: 0, max: PHONES - 1 });
const stepArb: fc.Arbitrary<Step> = fc.oneof(
  { weight: 4, arbitrary: fc.record({ kind: fc.constant('edit' as const), phone: phoneIx, finding: fc.integer({ min: 0, max: FINDINGS - 1 }), field: fc.constantFrom('notes' as const, 'heightM' as const, 'lift' as const), value: fc.integer({ min: 1, max: 5 }) }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('state' as const), phone: phoneIx, finding: fc.integer({ min: 0, max: FINDINGS - 1 }), to: fc.constantFrom('made-safe' as const, 'fixed' as const, 'verified' as const, 'open' as const) }) },
  { weight: 4, arbitrary: fc.record({ kind: fc.constant('sync' as const), phone: phoneIx }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constantFrom('offline' as const, 'online' as const), phone: phoneIx }) },
  { weight: 1, arbitrary: fc.constant({ kind: 'late' as const }) },
);
const scheduleArb = fc.record({
  seed: fc.integer(),
  skews: fc.array(fc.constantFrom(-DAY_MS, 0, DAY_MS), { minLength: PHONES, maxLength: PHONES }),
  steps: fc.array(stepArb, { minLength: 2, maxLength: 7 }),
});

const fieldValue = (field: 'notes' | 'heightM' | 'lift', value: number, phone: number) =>
  field === 'notes' ? `note ${value} from phone ${phone}` : field === 'heightM' ? value + 2 : value;

async function runSchedule(schedule: { seed: number; skews: number[]; steps: Step[] }): Promise<void> {
  const random = prng(schedule.seed);
  const network: Network = { servers, late: [], requests: 0 };
  const told: { clientId: string; result: SyncMutationResult }[] = [];
  const phones = Array.from(
    { length: PHONES },
    (_, i) =>
      new Phone(m, {
        name: `convergence-${randomUUID()}`,
        token: i === PHONES - 1 ? foremanToken : inspectorToken,
        network,
        random,
        clockSkewMs: schedule.skews[i],
        onResult: (clientId: string, result: SyncMutationResult) => told.push({ clientId, result }),
      }),
  );
  try {
    // The phones have synced before: they start at the end of the feed (earlier schedules' records are not theirs to hold).
    const cursor = await feedEnd();
    for (const phone of phones) await phone.db.meta.put({ key: m.SYNC_META.cursor, value: cursor });
    // Phone 0 records the findings; everyone gets them.
    const ids = Array.from({ length: FINDINGS }, () => randomUUID());
    for (const [n, id] of ids.entries()) {
      await m.saveFinding(
        phones[0]!.db,
        m.sampleFinding({ id, organisationId: orgId, siteId, scaffoldId: DEMO.foremansScaffold, inspectionId: null, elevation: 'North', lift: 2, bay: n + 1, notes: 'start', version: 0 }),
      );
    }
    for (const phone of phones) expect(await phone.engine.sync()).toBe('done');
    for (const phone of phones) phone.flaky = true;

    for (const step of schedule.steps) {
      if (step.kind === 'late') {
        await deliverLate(network, random);
        continue;
      }
      const phone = phones[step.phone]!;
      if (step.kind === 'offline') phone.online = false;
      if (step.kind === 'online') phone.online = true;
      if (step.kind === 'sync') await phone.engine.sync();
      const id = 'finding' in step ? ids[step.finding]! : '';
      if (step.kind === 'edit' && (await phone.db.findings.get(id))) {
        const value = fieldValue(step.field, step.value, step.phone);
        await phone.change(id, { [step.field]: value }, { entity: 'finding', action: 'update', payload: { [step.field]: value } });
      }
      if (step.kind === 'state' && (await phone.db.findings.get(id))) {
        await phone.change(id, { state: step.to }, { entity: 'finding', action: 'state', payload: { to: step.to, note: 'Seen on the walk', photoIds: [randomUUID()] } });
      }
    }

    // Everyone back online on a good connection; the late copies arrive; sync until quiet.
    await deliverLate(network, random);
    for (const phone of phones) Object.assign(phone, { online: true, flaky: false });
    const deadline = Date.now() + 20_000;
    let converged = false;
    while (!converged && Date.now() < deadline) {
      for (const phone of phones) expect(await phone.engine.sync()).toBe('done');
      converged = await sameAsServer(phones, ids);
    }
    expect(await Promise.all(phones.map((p) => p.db.outbox.count()))).toEqual(phones.map(() => 0));
    expect(await phoneViews(phones, ids)).toEqual(await serverViewFor(phones, ids));

    // Every mutation a phone sent was answered, and its outcome is the server's, exactly once.
    const clientIds = [...new Set(told.map((x) => x.clientId))];
    const logged = clientIds.length ? await t.drizzle.select().from(syncMutations).where(inArray(syncMutations.clientId, clientIds)) : [];
    const answered = new Map(told.map((x) => [`${x.clientId}:${x.result.id}`, x.result]));
    expect(answered.size).toBe(logged.length);
    for (const row of logged) expect(answered.get(`${row.clientId}:${row.mutationId}`)?.outcome).toBe(row.outcome);
    for (const clientId of clientIds) {
      const mine = logged.filter((r) => r.clientId === clientId).map((r) => r.mutationId).sort((a, b) => a - b);
      expect(mine).toEqual(mine.map((_, i) => i + 1));
    }
    const conflictIds = new Set([...answered.values()].flatMap((r) => r.conflictIds));
    const conflicts = await t.drizzle.select({ id: syncConflicts.id }).from(syncConflicts).where(inArray(syncConflicts.entityId, ids));
    expect(conflicts.map((c) => c.id).sort()).toEqual([...conflictIds].sort());
    expect(logged.filter((r) => r.outcome === 'conflict').length).toBe([...answered.values()].filter((r) => r.outcome === 'conflict').length);
  } finally {
    for (const phone of phones) phone.close();
  }
}

/** The end of the feed now (nothing of this database is in flight between schedules). */
async function feedEnd(): Promise<string> {
  const rows = await t.drizzle.execute<{ xid: string; seq: string }>(sql`
    select xid::text as xid, seq from (
      select sync_xid as xid, sync_seq as seq from findings union all select sync_xid, sync_seq from sync_conflicts
    ) feed order by xid desc, seq desc limit 1`);
  const last = rows.rows[0];
  return last ? `${last.xid}.${last.seq}` : '0.0';
}

const VIEW = (f: Pick<PhoneFinding, 'id' | 'notes' | 'heightM' | 'lift' | 'state' | 'version'>) => ({
  id: f.id,
  notes: f.notes,
  heightM: f.heightM,
  lift: f.lift,
  state: f.state,
  version: f.version,
});

async function serverViewFor(phones: Phone[], ids: string[]) {
  const rows = await t.drizzle.select().from(findings).where(inArray(findings.id, ids));
  const view = rows.map(VIEW).sort((a, b) => a.id.localeCompare(b.id));
  return phones.map(() => view);
}

async function phoneViews(phones: Phone[], ids: string[]) {
  return Promise.all(
    phones.map(async (p) => (await p.db.findings.bulkGet(ids)).filter((f): f is PhoneFinding => f !== undefined).map(VIEW).sort((a, b) => a.id.localeCompare(b.id))),
  );
}

async function sameAsServer(phones: Phone[], ids: string[]): Promise<boolean> {
  return JSON.stringify(await phoneViews(phones, ids)) === JSON.stringify(await serverViewFor(phones, ids));
}

describe('the schedule count', () => {
  it('is an error when SYNC_SCHEDULES is 0, negative or not a number, never a pass', () => {
    for (const bad of ['0', '-3', 'abc', '', '2.5', 'NaN']) expect(() => schedulesFrom(bad)).toThrow(/SYNC_SCHEDULES/);
    expect(schedulesFrom('7')).toBe(7);
    expect(schedulesFrom(undefined)).toBe(200);
  });
});

describe('sync convergence', () => {
  it(`brings ${PHONES} phones and the server to the same findings over ${SCHEDULES} random schedules`, async () => {
    await fc.assert(fc.asyncProperty(scheduleArb, runSchedule), { numRuns: SCHEDULES, endOnFailure: true });
  }, 600_000);
});
