import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { PlummetDb, readMeta, writeMeta } from './db';
import type { FindingRecord } from './records';

const openDbs: PlummetDb[] = [];

function freshDb(): PlummetDb {
  const database = new PlummetDb(`plummet-test-${crypto.randomUUID()}`);
  openDbs.push(database);
  return database;
}

afterEach(async () => {
  await Promise.all(openDbs.splice(0).map((database) => database.delete()));
});

const finding: FindingRecord = {
  id: 'f-1',
  organisationId: 'org-1',
  siteId: 'site-1',
  scaffoldId: 'scaffold-1',
  inspectionId: 'inspection-1',
  state: 'open',
  riskScore: 12,
  updatedAt: '2026-03-01T08:30:00.000Z',
};

describe('PlummetDb', () => {
  it('opens at version 1 with every table the app needs', async () => {
    const database = freshDb();
    await database.open();
    expect(database.verno).toBe(1);
    expect(database.tables.map((table) => table.name).sort()).toEqual([
      'catalogue',
      'controlChecks',
      'findings',
      'inspections',
      'meta',
      'outbox',
      'photos',
      'scaffolds',
      'sites',
    ]);
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
      await database.outbox.add({ entity: 'finding', entityId: 'f-1', op: 'put', createdAt: finding.updatedAt, attempts: 0 });
      await database.outbox.add({ entity: 'finding', entityId: 'f-1', op: 'put', createdAt: finding.updatedAt, attempts: 0 });
    });

    const entries = await database.outbox.orderBy('id').toArray();
    expect(entries.map((entry) => entry.id)).toEqual([1, 2]);
    expect(await database.findings.count()).toBe(1);
  });

  it('keeps neither the record nor the outbox entry when the transaction fails', async () => {
    const database = freshDb();
    const failing = database.transaction('rw', database.findings, database.outbox, async () => {
      await database.findings.put(finding);
      await database.outbox.add({ entity: 'finding', entityId: 'f-1', op: 'put', createdAt: finding.updatedAt, attempts: 0 });
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
      { id: 'c-1', name: 'Scaffold clip (double coupler)', category: 'fittings', words: ['scaffold', 'clip', 'double', 'coupler'] },
      { id: 'c-2', name: 'Claw hammer', category: 'tools', words: ['claw', 'hammer'] },
    ]);
    const hits = await database.catalogue.where('words').startsWith('coup').toArray();
    expect(hits.map((item) => item.id)).toEqual(['c-1']);
  });
});
