import 'fake-indexeddb/auto';
import { BUILTIN_ITEMS, type CatalogueItem, type Finding } from '@plummet/shared';
import { afterEach, describe, expect, it } from 'vitest';
import { enqueueChange } from '../local-db/outbox';
import { dropTestDatabases, freshDb, ORG_ID, sampleFinding, scaffold, site } from '../local-db/testing';
import { downloadSite, type SiteDownloadSources } from './download-site';

afterEach(dropTestDatabases);

const catalogue: CatalogueItem[] = BUILTIN_ITEMS.slice(0, 3).map((item) => ({
  ...item,
  builtIn: true,
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
  version: 1,
}));

/** A finding as the server sends it: the shared sample without the phone's own fields. */
function finding(n: number, notes: string): Finding {
  const { organisationId: _organisation, siteId: _site, ...server } = sampleFinding({
    id: `0f000000-0000-4000-8000-00000000000${n}`,
    inspectionId: null,
    bay: n,
    notes,
    updatedAt: '2026-02-01T00:00:00.000Z',
  });
  return server;
}

function sources(findings: Finding[]): SiteDownloadSources {
  return { scaffolds: async () => [scaffold], openFindings: async () => findings, catalogue: async () => catalogue };
}

describe('making a site available offline', () => {
  it('stores the site, its scaffolds, its open findings and the catalogue with search words', async () => {
    const database = freshDb();
    const result = await downloadSite(database, site, ORG_ID, sources([finding(1, 'a'), finding(2, 'b')]), new Date('2026-03-01T07:00:00Z'));

    expect(result).toEqual({ scaffolds: 1, findings: 2, catalogueItems: 3, keptLocal: 0 });
    expect(await database.sites.get(site.id)).toMatchObject({ offline: true, downloadedAt: '2026-03-01T07:00:00.000Z', organisationId: ORG_ID });
    expect((await database.findings.get(finding(1, '').id))?.siteId).toBe(site.id);
    const hammer = await database.catalogue.where('words').startsWith('hamm').toArray();
    expect(hammer.map((item) => item.name)).toEqual(['Scaffold hammer']);
  });

  it('keeps a finding the phone has changed and not yet sent, and drops findings fixed meanwhile', async () => {
    const database = freshDb();
    await downloadSite(database, site, ORG_ID, sources([finding(1, 'server'), finding(2, 'server')]));
    await database.findings.update(finding(1, '').id, { notes: 'edited offline' });
    await enqueueChange(database, finding(1, '').id, { entity: 'finding', action: 'update', payload: { notes: 'edited offline' } });

    const result = await downloadSite(database, site, ORG_ID, sources([finding(1, 'server again')]));

    expect(result.keptLocal).toBe(1);
    expect((await database.findings.get(finding(1, '').id))?.notes).toBe('edited offline');
    expect(await database.findings.get(finding(2, '').id)).toBeUndefined();
  });

  it('leaves the phone as it was when a download fails', async () => {
    const database = freshDb();
    const failing: SiteDownloadSources = { ...sources([]), openFindings: async () => Promise.reject(new Error('No connection')) };
    await expect(downloadSite(database, site, ORG_ID, failing)).rejects.toThrow('No connection');
    expect(await database.sites.count()).toBe(0);
    expect(await database.scaffolds.count()).toBe(0);
  });
});
