import 'fake-indexeddb/auto';
import type { SyncChange, SyncPullResponse } from '@plummet/shared';
import { afterEach, describe, expect, it } from 'vitest';
import { readMeta, writeMeta } from '../local-db/db';
import { enqueueChange } from '../local-db/outbox';
import { dropTestDatabases, freshDb, ORG_ID, sampleFinding, scaffold, site, SITE_ID } from '../local-db/testing';
import { downloadSite } from './download-site';
import { SYNC_META } from './sync-state';

afterEach(dropTestDatabases);

const T = '2026-02-01T00:00:00.000Z';
const ORG_ITEM = '14000000-0000-4000-8000-000000000001';

/** A finding as the scoped feed carries it. */
function finding(n: number, notes: string): SyncChange {
  const { organisationId: _organisation, ...rest } = sampleFinding({ id: `0f000000-0000-4000-8000-00000000000${n}`, inspectionId: null, bay: n, notes, updatedAt: T });
  return { type: 'finding', record: { ...rest, organisationId: ORG_ID, siteId: SITE_ID } } as SyncChange;
}

const orgItem: SyncChange = {
  type: 'catalogue-item',
  record: { id: ORG_ITEM, name: 'Spirit level', category: 'hand-tool', massKg: 0.6, shape: { kind: 'box', lengthM: 0.6, widthM: 0.05, heightM: 0.03 }, source: 'Weighed', builtIn: false, createdAt: T, updatedAt: T, version: 1 },
} as SyncChange;

/** A server whose scoped pull answers these changes in pages of two, and remembers what it was asked. */
function scopedFeed(changes: SyncChange[], fail?: number) {
  const asked: { cursor?: string; clientId?: string; siteId?: string }[] = [];
  return {
    asked,
    async pull(cursor: string | undefined, _limit: number, clientId?: string, siteId?: string): Promise<SyncPullResponse> {
      asked.push({ cursor, clientId, siteId });
      const from = cursor ? Number(cursor.split('.')[1]) : 0;
      if (fail !== undefined && from >= fail) throw new Error('No connection');
      const page = changes.slice(from, from + 2);
      return { changes: page, cursor: `9.${from + page.length}`, hasMore: from + 2 < changes.length };
    },
  };
}

describe('making a site available offline: the site’s first pull', () => {
  it('pulls the site’s records page by page under its own cursor, and stores them with the built-in and the organisation’s catalogue', async () => {
    const database = freshDb();
    await writeMeta(database, SYNC_META.cursor, '5.5');
    const feed = scopedFeed([{ type: 'site', record: site }, { type: 'scaffold', record: scaffold }, finding(1, 'a'), finding(2, 'b'), orgItem] as SyncChange[]);
    const result = await downloadSite(database, site, ORG_ID, feed, new Date('2026-03-01T07:00:00Z'));

    expect(feed.asked.map((a) => a.cursor)).toEqual([undefined, '9.2', '9.4']);
    expect(feed.asked.every((a) => a.siteId === SITE_ID && typeof a.clientId === 'string')).toBe(true);
    expect(result).toMatchObject({ scaffolds: 1, findings: 2, keptLocal: 0 });
    expect(result.catalogueItems).toBeGreaterThan(20);
    expect(await database.sites.get(SITE_ID)).toMatchObject({ offline: true, downloadedAt: '2026-03-01T07:00:00.000Z', organisationId: ORG_ID });
    expect(await database.scaffolds.get(scaffold.id)).toBeDefined();
    expect((await database.findings.get((finding(1, '').record as { id: string }).id))?.siteId).toBe(SITE_ID);
    const hammer = await database.catalogue.where('words').startsWith('hamm').toArray();
    expect(hammer.map((item) => item.name)).toEqual(['Scaffold hammer']);
    expect(await database.catalogue.get(ORG_ITEM)).toBeDefined();
    // The phone's own feed cursor has not moved.
    expect(await readMeta(database, SYNC_META.cursor)).toBe('5.5');
  });

  it('keeps a finding the phone has changed and not yet sent, and drops one of the site the server no longer has', async () => {
    const database = freshDb();
    const [one, two] = [finding(1, 'server'), finding(2, 'server')];
    const id = (c: SyncChange) => (c.record as { id: string }).id;
    await downloadSite(database, site, ORG_ID, scopedFeed([{ type: 'site', record: site }, { type: 'scaffold', record: scaffold }, one, two] as SyncChange[]));
    await database.findings.update(id(one), { notes: 'edited offline' });
    await enqueueChange(database, id(one), { entity: 'finding', action: 'update', payload: { notes: 'edited offline' } });

    const again = { ...one, record: { ...one.record, notes: 'server again', version: 9 } } as SyncChange;
    const result = await downloadSite(database, site, ORG_ID, scopedFeed([{ type: 'site', record: site }, { type: 'scaffold', record: scaffold }, again] as SyncChange[]));

    expect(result.keptLocal).toBe(1);
    expect((await database.findings.get(id(one)))?.notes).toBe('edited offline');
    expect(await database.findings.get(id(two))).toBeUndefined();
  });

  it('leaves the phone as it was when a page fails', async () => {
    const database = freshDb();
    const feed = scopedFeed([{ type: 'site', record: site }, { type: 'scaffold', record: scaffold }, finding(1, 'a')] as SyncChange[], 2);
    await expect(downloadSite(database, site, ORG_ID, feed)).rejects.toThrow('No connection');
    expect(await database.sites.count()).toBe(0);
    expect(await database.scaffolds.count()).toBe(0);
    expect(await database.catalogue.count()).toBe(0);
  });
});
