/**
 * Sync across real server processes: the BUILT server, run as separate processes on one
 * PostgreSQL database, and phones running the real client sync code (tests/sync/sync-harness.ts).
 * Two processes taking turns; a process killed in the middle of a push (before and after its
 * commit, by the fault hook in server/src/sync/fault-injection.ts) and the phone retrying against
 * the restarted process; device clocks a day ahead and behind; a phone whose browser storage was
 * wiped signing in again.
 */
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import type { SyncMutationResult } from '@plummet/shared';
import { and, count, eq, inArray, sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../../server/test/data-api.js';
import { createTestDatabase, type TestDatabase } from '../../server/test/test-db.js';
import { auditEvents, findings, syncConflicts, syncMutations } from '../../server/src/db/schema/index.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';
import { loadMobile, type Network, Phone, type PhoneFinding, prng } from './sync-harness.js';

const DAY_MS = 24 * 60 * 60 * 1000;
const PHONES = 5;

let m: Awaited<ReturnType<typeof loadMobile>>;
let database: TestDatabase;
let pool: pg.Pool;
let sqlDb: ReturnType<typeof drizzle>;
let first: RunningServer;
let second: RunningServer;
const tokens = { inspector: '', foreman: '' };
let orgId: string;
let siteId: string;
const opened: Phone[] = [];

beforeAll(async () => {
  m = await loadMobile();
  database = await createTestDatabase();
  // Two processes, two ports, one database (the first seeds the demo scenario).
  first = await startBuiltServer({ database, seed: true, env: { LOG_LEVEL: 'warn' } });
  second = await startBuiltServer({ database, env: { LOG_LEVEL: 'warn' } });
  pool = new pg.Pool({ connectionString: database.url, max: 2 });
  sqlDb = drizzle(pool);
  tokens.inspector = await signIn('inspector@demo.test');
  tokens.foreman = await signIn('foreman@demo.test');
  const [row] = (await sqlDb.execute<{ org: string; site: string }>(sql`select organisation_id as org, site_id as site from scaffolds where id = ${DEMO.foremansScaffold}`)).rows;
  orgId = row!.org;
  siteId = row!.site;
});

afterAll(async () => {
  for (const phone of opened) phone.close();
  await first?.dispose();
  await second?.dispose();
  await pool?.end();
  await database?.drop();
});

async function signIn(email: string): Promise<string> {
  const res = await fetch(`${first.url}/api/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email, password: 'plummet-demo' }) });
  expect(res.status).toBe(200);
  return ((await res.json()) as { accessToken: string }).accessToken;
}

type Told = { clientId: string; result: SyncMutationResult }[];

function phone(options: { servers: string[]; told: Told; role?: keyof typeof tokens; clockSkewMs?: number; name?: string }): Phone {
  const network: Network = { servers: options.servers, late: [], requests: 0 };
  const p = new Phone(m, {
    name: options.name ?? `processes-${randomUUID()}`,
    token: tokens[options.role ?? 'inspector'],
    network,
    random: prng(7),
    clockSkewMs: options.clockSkewMs,
    onResult: (clientId, result) => options.told.push({ clientId, result }),
  });
  opened.push(p);
  return p;
}

const newFinding = (id: string, bay: number) =>
  m.sampleFinding({ id, organisationId: orgId, siteId, scaffoldId: DEMO.foremansScaffold, inspectionId: null, elevation: 'East', lift: 3, bay, notes: 'start', version: 0 });

const VIEW = (f: Pick<PhoneFinding, 'id' | 'notes' | 'heightM' | 'lift' | 'state' | 'version'>) => ({ id: f.id, notes: f.notes, heightM: f.heightM, lift: f.lift, state: f.state, version: f.version });
const byId = (a: { id: string }, b: { id: string }) => a.id.localeCompare(b.id);

async function serverView(ids: string[]) {
  return (await sqlDb.select().from(findings).where(inArray(findings.id, ids))).map(VIEW).sort(byId);
}

async function phoneView(p: Phone, ids: string[]) {
  return (await p.db.findings.bulkGet(ids)).filter((f): f is PhoneFinding => f !== undefined).map(VIEW).sort(byId);
}

/** Syncs every phone until each holds the server's findings; then the outcomes must reconcile. */
async function settleAndReconcile(phones: Phone[], ids: string[], told: Told): Promise<void> {
  const deadline = Date.now() + 20_000;
  for (let same = false; !same && Date.now() < deadline; ) {
    for (const p of phones) expect(await p.engine.sync()).toBe('done');
    const server = JSON.stringify(await serverView(ids));
    same = (await Promise.all(phones.map((p) => phoneView(p, ids)))).every((v) => JSON.stringify(v) === server);
  }
  expect(await Promise.all(phones.map((p) => p.db.outbox.count()))).toEqual(phones.map(() => 0));
  for (const p of phones) expect(await phoneView(p, ids)).toEqual(await serverView(ids));

  // Every mutation sent was answered once, with the outcome the server logged, ids 1..n per phone.
  const clientIds = [...new Set(told.map((x) => x.clientId))];
  const logged = await sqlDb.select().from(syncMutations).where(inArray(syncMutations.clientId, clientIds));
  const answered = new Map(told.map((x) => [`${x.clientId}:${x.result.id}`, x.result]));
  expect(answered.size).toBe(logged.length);
  for (const row of logged) expect(answered.get(`${row.clientId}:${row.mutationId}`)?.outcome).toBe(row.outcome);
  for (const clientId of clientIds) {
    const mine = logged.filter((r) => r.clientId === clientId).map((r) => r.mutationId).sort((a, b) => a - b);
    expect(mine).toEqual(mine.map((_, i) => i + 1));
  }
  const conflictIds = new Set([...answered.values()].flatMap((r) => r.conflictIds));
  const conflicts = await sqlDb.select({ id: syncConflicts.id }).from(syncConflicts).where(inArray(syncConflicts.entityId, ids));
  expect(conflicts.map((c) => c.id).sort()).toEqual([...conflictIds].sort());
  expect(logged.filter((r) => r.outcome === 'conflict').length).toBe([...answered.values()].filter((r) => r.outcome === 'conflict').length);
  expect(conflicts.length).toBeGreaterThan(0);
}

/**
 * Five phones (four of the inspector, the foreman's) take turns between both processes: phone 0
 * records two findings, then three rounds in which every phone writes the same field of the first
 * (conflicts) and its own field of the second, and syncs. Clashing notes keep both texts: after the
 * first write (which had seen the recorded note), every inspector's note arrives over one its phone
 * had not seen, so the notes end as every inspector's note in the order they reached the server.
 * The foreman's edits are refused (only inspectors edit findings).
 */
async function roundsAcrossProcesses(skews: number[]): Promise<void> {
  const told: Told = [];
  const phones = skews.map((clockSkewMs, i) => phone({ servers: [first.url, second.url], told, clockSkewMs, role: i === PHONES - 1 ? 'foreman' : 'inspector' }));
  const ids = [randomUUID(), randomUUID()];
  for (const [n, id] of ids.entries()) await m.saveFinding(phones[0]!.db, newFinding(id, n + 1));
  for (const p of phones) expect(await p.engine.sync()).toBe('done');
  const fields = ['notes', 'heightM', 'lift'] as const;
  const arrived: string[] = [];
  for (let round = 1; round <= 3; round++) {
    for (const [i, p] of phones.entries()) {
      const notes = `round ${round}, phone ${i}`;
      await p.change(ids[0]!, { notes }, { entity: 'finding', action: 'update', payload: { notes } });
      const field = fields[i % fields.length]!;
      const value = field === 'notes' ? `second, round ${round}, phone ${i}` : round + i + 1;
      await p.change(ids[1]!, { [field]: value }, { entity: 'finding', action: 'update', payload: { [field]: value } });
    }
    // A different order each round, always ending with an inspector's phone.
    const order = [4, ...[0, 1, 2, 3].map((k) => (k + round) % 4)];
    for (const i of order) expect(await phones[i]!.engine.sync()).toBe('done');
    arrived.push(...order.slice(1).map((i) => `round ${round}, phone ${i}`));
  }
  await settleAndReconcile(phones, ids, told);
  const [stored] = await sqlDb.select().from(findings).where(eq(findings.id, ids[0]!));
  expect(stored!.notes.split('\n\n')).toEqual(arrived);
  // The server stamps its own time, whatever the phones' clocks say.
  expect(Math.abs(stored!.updatedAt.getTime() - Date.now())).toBeLessThan(60_000);
}

describe('sync across server processes', () => {
  it('converges five phones taking turns between two server processes on one database', async () => {
    await roundsAcrossProcesses(Array.from({ length: PHONES }, () => 0));
  });

  it('converges the same way with device clocks a day ahead and a day behind', async () => {
    await roundsAcrossProcesses([DAY_MS, -DAY_MS, DAY_MS, -DAY_MS, -DAY_MS]);
  });

  for (const point of ['sync-push:before-commit', 'sync-push:after-commit'] as const) {
    it(`applies each mutation exactly once when the process is killed ${point.split(':')[1]!.replace('-', ' ')} and the phone retries after a restart`, async () => {
      const faulty = await startBuiltServer({ database, env: { LOG_LEVEL: 'warn', PLUMMET_FAULT: point } });
      try {
        const told: Told = [];
        const p = phone({ servers: [faulty.url], told });
        expect(await p.engine.sync()).toBe('done'); // a pull only: the fault waits for a push
        const demoId = DEMO.demoFindings[0]!;
        const ids = [randomUUID(), randomUUID()];
        for (const [n, id] of ids.entries()) await m.saveFinding(p.db, newFinding(id, 3 + n));
        const notes = `checked after ${point}`;
        await p.change(demoId, { notes }, { entity: 'finding', action: 'update', payload: { notes } });
        const auditBefore = await auditCount(demoId);
        const findingsBefore = await orgFindingCount();

        // One batch of three mutations; the process dies on it and the phone hears nothing.
        expect(await p.engine.sync()).toBe('offline');
        expect(await faulty.exited()).toBe('SIGKILL');
        expect(told).toEqual([]);
        expect(await p.db.outbox.count()).toBe(3);
        const clientId = (await p.db.meta.get(m.SYNC_META.clientId))!.value as string;
        const committed = point === 'sync-push:after-commit';
        expect(await mutationIds(clientId)).toEqual(committed ? [1, 2, 3] : []);
        expect(await orgFindingCount()).toBe(findingsBefore + (committed ? 2 : 0));

        await faulty.start({ PLUMMET_FAULT: undefined });
        expect(await p.engine.sync()).toBe('done');
        expect(told.map((x) => [x.result.id, x.result.outcome, x.result.replayed])).toEqual([1, 2, 3].map((id) => [id, 'applied', committed]));
        expect(await p.db.outbox.count()).toBe(0);
        expect(await mutationIds(clientId)).toEqual([1, 2, 3]);
        expect(await orgFindingCount()).toBe(findingsBefore + 2);
        for (const id of ids) expect(await auditCount(id)).toBe(1);
        expect(await auditCount(demoId)).toBe(auditBefore + 1);
        expect(await phoneView(p, [...ids, demoId])).toEqual(await serverView([...ids, demoId]));
        expect((await serverView([demoId]))[0]!.notes).toBe(notes);
      } finally {
        await faulty.dispose();
      }
    });
  }

  it('restores everything the server acknowledged to a phone whose browser storage was wiped', async () => {
    const told: Told = [];
    const name = `wiped-${randomUUID()}`;
    const before = phone({ servers: [first.url, second.url], told, name });
    const ids = [randomUUID(), randomUUID()];
    for (const [n, id] of ids.entries()) await m.saveFinding(before.db, newFinding(id, 5 + n));
    expect(await before.engine.sync()).toBe('done');
    await before.change(ids[0]!, { notes: 'edited before the wipe' }, { entity: 'finding', action: 'update', payload: { notes: 'edited before the wipe' } });
    expect(await before.engine.sync()).toBe('done');
    expect(told.map((x) => x.result.outcome)).toEqual(['applied', 'applied', 'applied']);
    const oldClient = told[0]!.clientId;

    // The browser deletes the database; the user signs in again: a new engine on an empty database.
    before.close();
    await before.db.delete();
    const after = phone({ servers: [second.url, first.url], told, name });
    expect(await after.db.findings.count()).toBe(0);
    expect(await after.engine.sync()).toBe('done');

    const all = (await sqlDb.select({ id: findings.id }).from(findings).where(eq(findings.organisationId, orgId))).map((r) => r.id);
    expect(await phoneView(after, all)).toEqual(await serverView(all));
    expect((await phoneView(after, ids)).map((f) => f.notes)).toEqual((await serverView(ids)).map((f) => f.notes));
    expect(all.length).toBeGreaterThan(ids.length);
    // It comes back as a new client; what the old one sent stays logged once.
    await after.change(ids[1]!, { notes: 'after the wipe' }, { entity: 'finding', action: 'update', payload: { notes: 'after the wipe' } });
    expect(await after.engine.sync()).toBe('done');
    const newClient = told.at(-1)!.clientId;
    expect(newClient).not.toBe(oldClient);
    expect(await mutationIds(oldClient)).toEqual([1, 2, 3]);
    expect(await mutationIds(newClient)).toEqual([1]);
    expect((await serverView([ids[1]!]))[0]!.notes).toBe('after the wipe');
  });
});

async function mutationIds(clientId: string): Promise<number[]> {
  const rows = await sqlDb.select({ id: syncMutations.mutationId }).from(syncMutations).where(eq(syncMutations.clientId, clientId));
  return rows.map((r) => r.id).sort((a, b) => a - b);
}

async function auditCount(entityId: string): Promise<number> {
  const [row] = await sqlDb.select({ n: count() }).from(auditEvents).where(and(eq(auditEvents.entityType, 'finding'), eq(auditEvents.entityId, entityId)));
  return row!.n;
}

async function orgFindingCount(): Promise<number> {
  const [row] = await sqlDb.select({ n: count() }).from(findings).where(eq(findings.organisationId, orgId));
  return row!.n;
}
