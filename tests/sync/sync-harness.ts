/**
 * Simulated phones for the sync tests: each runs the real client sync engine
 * (mobile-web/src/sync) over its own fake-indexeddb database, through a fetch that can be offline,
 * drop a request (the server never saw it: "killed before commit"), drop a response (the server
 * committed but the phone heard nothing: "killed after commit"), deliver twice, or deliver a copy
 * late (after newer requests), against one or more server instances.
 */
import 'fake-indexeddb/auto';
import { fileURLToPath } from 'node:url';
import type { Finding, SyncMutationResult } from '@plummet/shared';

/*
 * The phone's code is bundler-resolved (extensionless imports), which `tsc -p tests` (NodeNext)
 * cannot follow; it is loaded at run time through Vite, with the parts these tests use typed here.
 */
export type PhoneFinding = Finding & { organisationId: string; siteId: string };
type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;
interface Table<T, K> {
  get(key: K): Promise<T | undefined>;
  bulkGet(keys: K[]): Promise<(T | undefined)[]>;
  put(value: T): Promise<unknown>;
  count(): Promise<number>;
  where(index: string): { equals(key: unknown): { first(): Promise<T | undefined>; toArray(): Promise<T[]> } };
}
/** An inspection or control check as the phone keeps it (only the fields the tests read are typed). */
export type PhoneRecord = Record<string, unknown> & { id: string; version: number };
export interface MobileDb {
  findings: Table<PhoneFinding, string>;
  sites: Table<PhoneRecord, string>;
  scaffolds: Table<PhoneRecord, string>;
  inspections: Table<PhoneRecord, string>;
  controlChecks: Table<PhoneRecord, string>;
  outbox: Table<unknown, number>;
  meta: Table<{ key: string; value: unknown }, string>;
  transaction<R>(mode: 'rw', ...args: [...unknown[], () => Promise<R>]): Promise<R>;
  close(): void;
  /** Deletes the whole browser database (a wiped phone). */
  delete(): Promise<void>;
}
export type OutboxChange = { entity: 'finding' | 'inspection' | 'control-check'; action: 'update' | 'state' | 'create' | 'put'; payload: Record<string, unknown> };
interface Engine {
  sync(): Promise<'done' | 'offline' | 'error'>;
}
interface MobileModules {
  PlummetDb: new (name: string) => MobileDb;
  enqueueChange(db: MobileDb, entityId: string, change: OutboxChange, now?: Date): Promise<number>;
  SyncEngine: new (db: MobileDb, transport: unknown, options: Record<string, unknown>) => Engine;
  httpSyncTransport(fetchImpl: FetchLike): unknown;
  saveFinding(db: MobileDb, finding: PhoneFinding): Promise<void>;
  sampleFinding(overrides: Partial<PhoneFinding>): PhoneFinding;
  /** The scaffold store: the tag set on the phone with its outbox entry. */
  changeScaffoldStatus(db: MobileDb, scaffoldId: string, change: { status: string; note: string }): Promise<PhoneRecord>;
  SYNC_META: { cursor: string; clientId: string; conflicts: string };
}

const load = (path: string) =>
  import(/* @vite-ignore */ fileURLToPath(new URL(`../../mobile-web/src/${path}.ts`, import.meta.url))) as Promise<Record<string, unknown>>;

let mobile: MobileModules | undefined;

/** The real phone modules (local database, outbox, stores, sync engine). */
export async function loadMobile(): Promise<MobileModules> {
  if (!mobile) {
    const modules = await Promise.all(
      ['local-db/db', 'local-db/outbox', 'sync/sync-engine', 'sync/sync-transport', 'features/findings/findings.store', 'features/scaffolds/scaffolds.store', 'local-db/testing', 'sync/sync-state'].map(load),
    );
    mobile = Object.assign({}, ...modules) as MobileModules;
  }
  return mobile;
}

export type Delivery = 'ok' | 'drop-request' | 'drop-response' | 'duplicate' | 'late-copy';

/** A small deterministic PRNG (mulberry32), so a failing schedule replays exactly. */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface Network {
  servers: string[];
  /** Requests held back to be delivered after newer ones. */
  late: (() => Promise<void>)[];
  requests: number;
}

/** One mutation as a phone sent it. */
export interface SentMutation {
  id: number;
  entity: string;
  entityId: string;
  action: string;
  baseVersion: number;
  payload: Record<string, unknown>;
}

export interface PhoneOptions {
  name: string;
  token: string;
  network: Network;
  random: () => number;
  /** Changes per pull page (10 by default: many pages in a short test). */
  pullLimit?: number;
  /** Device clock offset, ms (±24 h in the tests: the server must not care). */
  clockSkewMs?: number;
  /** Every push the phone sends (before the network decides its fate), as sent. */
  onPush?: (body: { clientId: string; mutations: SentMutation[] }) => void;
  /** Every push answer, with the outbox entry (what enqueueChange returned) it answers. */
  onResult: (clientId: string, result: SyncMutationResult, entryId?: number) => void;
}

export class Phone {
  readonly db: MobileDb;
  readonly engine: Engine;
  online = true;
  flaky = false;
  clientId = '';

  constructor(
    private readonly m: MobileModules,
    private readonly options: PhoneOptions,
  ) {
    this.db = new m.PlummetDb(options.name);
    const now = () => new Date(Date.now() + (options.clockSkewMs ?? 0));
    this.engine = new m.SyncEngine(this.db, m.httpSyncTransport((path, init) => this.fetch(path, init)), {
      now,
      random: options.random,
      batchSize: 3,
      pullLimit: options.pullLimit ?? 10,
      onResult: (clientId: string, result: SyncMutationResult, entryId?: number) => {
        this.clientId = clientId;
        options.onResult(clientId, result, entryId);
      },
    });
  }

  private pickDelivery(): Delivery {
    if (!this.flaky) return 'ok';
    const r = this.options.random();
    return r < 0.55 ? 'ok' : r < 0.67 ? 'drop-request' : r < 0.79 ? 'drop-response' : r < 0.9 ? 'duplicate' : 'late-copy';
  }

  private async fetch(path: string, init?: RequestInit): Promise<Response> {
    if (!this.online) throw new TypeError('fetch failed: offline');
    if (path.includes('/sync/push') && typeof init?.body === 'string') this.options.onPush?.(JSON.parse(init.body));
    const { network } = this.options;
    const server = network.servers[network.requests++ % network.servers.length]!;
    const send = () =>
      fetch(`${server}${path}`, { ...init, headers: { ...(init?.headers as Record<string, string>), Authorization: `Bearer ${this.options.token}` } });
    const delivery = this.pickDelivery();
    switch (delivery) {
      case 'drop-request':
        throw new TypeError('fetch failed: connection reset before the request was sent');
      case 'drop-response': {
        await (await send()).text();
        throw new TypeError('fetch failed: connection reset before the answer');
      }
      case 'duplicate':
        await (await send()).text();
        return send();
      case 'late-copy':
        network.late.push(async () => void (await (await send()).text()));
        return send();
      case 'ok':
        return send();
    }
  }

  private now(): Date {
    return new Date(Date.now() + (this.options.clockSkewMs ?? 0));
  }

  /**
   * A local change the way the phone's stores make one: the record and its outbox entry in one
   * transaction. Answers the outbox entry the change went into (new, or folded into a waiting one).
   */
  async change(id: string, recordChange: Record<string, unknown>, outbox: OutboxChange, table: 'findings' | 'inspections' = 'findings'): Promise<number> {
    const db = this.db;
    const now = this.now();
    const records = db[table] as Table<PhoneRecord, string>;
    return db.transaction('rw', records, db.outbox, async () => {
      const current = await records.get(id);
      if (current) await records.put({ ...current, ...recordChange, updatedAt: now.toISOString() });
      return this.m.enqueueChange(db, id, outbox, now);
    });
  }

  /** A record made on this phone with its create entry (offline or not), as the stores make one. */
  async create(table: 'findings' | 'inspections', record: PhoneRecord, outbox: OutboxChange): Promise<number> {
    const db = this.db;
    const records = db[table] as Table<PhoneRecord, string>;
    return db.transaction('rw', records, db.outbox, async () => {
      await records.put(record);
      return this.m.enqueueChange(db, record.id, outbox, this.now());
    });
  }

  /** Answers one control of an inspection as the inspection store does: a second answer keeps the check's id. */
  async answerControl(answer: { inspectionId: string; organisationId: string; control: string; result: string; note: string }): Promise<number> {
    const db = this.db;
    const now = this.now().toISOString();
    return db.transaction('rw', db.controlChecks, db.outbox, async () => {
      const existing = await db.controlChecks.where('[inspectionId+control]').equals([answer.inspectionId, answer.control]).first();
      const check: PhoneRecord = { ...answer, id: existing?.id ?? crypto.randomUUID(), createdAt: existing?.createdAt ?? now, updatedAt: now, version: existing?.version ?? 0 };
      await db.controlChecks.put(check);
      const { organisationId: _org, ...payload } = answer;
      return this.m.enqueueChange(db, check.id, { entity: 'control-check', action: 'put', payload }, this.now());
    });
  }

  /** Closes the database (fake-indexeddb keeps it in memory until the process ends). */
  close(): void {
    this.db.close();
  }
}

/** Delivers the held-back copies, in random order. */
export async function deliverLate(network: Network, random: () => number): Promise<void> {
  const held = network.late.splice(0);
  held.sort(() => random() - 0.5);
  for (const deliver of held) await deliver().catch(() => undefined);
}
