import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { PlummetDb, readMeta, writeMeta } from './db';
import type { OutboxEntry } from './records';
import { openVersion1Database, sampleFinding } from './testing';

const openDbs: PlummetDb[] = [];

function freshDb(): PlummetDb {
  const database = new PlummetDb(`plummet-test-${crypto.randomUUID()}`);
  openDbs.push(database);
  return database;
}

afterEach(async () => {
  await Promise.all(openDbs.splice(0).map((database) => database.delete()));
});

const finding = sampleFinding({ id: 'f-1', scaffoldId: 'scaffold-1', state: 'open' });

const outboxEntry = (): OutboxEntry => ({
  entity: 'finding',
  action: 'state',
  entityId: 'f-1',
  op: 'put',
  payload: { to: 'made-safe', note: '' },
  createdAt: finding.updatedAt,
  attempts: 0,
});

function catalogueItem(id: string, name: string) {
  return {
    id,
    name,
    massKg: 1,
    shape: { kind: 'sphere' as const, diameterM: 0.1 },
    source: 'test',
    builtIn: true,
    createdAt: finding.createdAt,
    updatedAt: finding.createdAt,
    version: 1,
  };
}

describe('PlummetDb', () => {
  it('opens at version 3 with every table the app needs', async () => {
    const database = freshDb();
    await database.open();
    expect(database.verno).toBe(3);
    expect(database.tables.map((table) => table.name).sort()).toEqual([
      'catalogue',
      'controlChecks',
      'findings',
      'fixes',
      'inspections',
      'meta',
      'outbox',
      'photoMeta',
      'photos',
      'scaffolds',
      'signedReports',
      'sites',
      'verifications',
    ]);
  });

  it('upgrades a phone still on version 1 without losing its findings or waiting changes', async () => {
    const name = `plummet-test-${crypto.randomUUID()}`;
    const old = openVersion1Database(name);
    await old.table('findings').put({ ...finding, assigneeId: 'foreman-1' });
    await old.table('outbox').add(outboxEntry());
    old.close();

    const upgraded = new PlummetDb(name);
    openDbs.push(upgraded);
    expect(await upgraded.findings.where('assigneeId').equals('foreman-1').count()).toBe(1);
    expect(await upgraded.outbox.count()).toBe(1);
    expect(await upgraded.fixes.count()).toBe(0);
  });

  it('reads back a finding written to it, also after closing and reopening', async () => {
    const database = freshDb();
    await database.findings.put(finding);
    expect(await database.findings.get('f-1')).toEqual(finding);

    database.close();
    const reopened = new PlummetDb(database.name);
    openDbs.push(reopened);
    expect(await reopened.findings.where({ scaffoldId: 'scaffold-1', state: 'open' }).toArray()).toEqual([finding]);
  });

  it('writes a record and its outbox entry in one transaction, numbering entries in order', async () => {
    const database = freshDb();
    await database.transaction('rw', database.findings, database.outbox, async () => {
      await database.findings.put(finding);
      await database.outbox.add(outboxEntry());
      await database.outbox.add(outboxEntry());
    });

    const entries = await database.outbox.orderBy('id').toArray();
    expect(entries.map((entry) => entry.id)).toEqual([1, 2]);
    expect(await database.findings.count()).toBe(1);
  });

  it('keeps neither the record nor the outbox entry when the transaction fails', async () => {
    const database = freshDb();
    const failing = database.transaction('rw', database.findings, database.outbox, async () => {
      await database.findings.put(finding);
      await database.outbox.add(outboxEntry());
      throw new Error('disk full');
    });

    await expect(failing).rejects.toThrow('disk full');
    expect(await database.findings.count()).toBe(0);
    expect(await database.outbox.count()).toBe(0);
  });

  it('stores key-value settings in the meta table', async () => {
    const database = freshDb();
    expect(await readMeta(database, 'units')).toBeUndefined();
    await writeMeta(database, 'units', 'imperial');
    expect(await readMeta<string>(database, 'units')).toBe('imperial');
  });

  it('finds catalogue items by any word of their name', async () => {
    const database = freshDb();
    await database.catalogue.bulkPut([
      { ...catalogueItem('c-1', 'Scaffold clip (double coupler)'), category: 'fitting', words: ['scaffold', 'clip', 'double', 'coupler'] },
      { ...catalogueItem('c-2', 'Claw hammer'), category: 'hand-tool', words: ['claw', 'hammer'] },
    ]);
    const hits = await database.catalogue.where('words').startsWith('coup').toArray();
    expect(hits.map((item) => item.id)).toEqual(['c-1']);
  });
});
