/**
 * "Make a site available offline": downloads the site's scaffolds, the findings that still need a
 * fix and the item catalogue into the phone's database, so the walk works with no signal.
 * Records with changes still waiting in the outbox are kept as they are on the phone.
 */
import type { CatalogueItem, Finding, Scaffold, Site } from '@plummet/shared';
import type { PlummetDb } from '../local-db/db';
import { idsWithWaitingChanges } from '../local-db/outbox';
import type { FindingRecord, ScaffoldRecord, SiteRecord } from '../local-db/records';
import { catalogueRecordOf } from '../features/catalogue/catalogue-search';

export interface SiteDownloadSources {
  scaffolds(siteId: string, signal?: AbortSignal): Promise<Scaffold[]>;
  openFindings(siteId: string, signal?: AbortSignal): Promise<Finding[]>;
  catalogue(signal?: AbortSignal): Promise<CatalogueItem[]>;
}

export interface SiteDownloadResult {
  scaffolds: number;
  findings: number;
  catalogueItems: number;
  /** Findings left as they are because the phone has changes to them that wait to be sent. */
  keptLocal: number;
}

const later = (a: string | null, b: string | null): string | null => (a && b ? (a > b ? a : b) : (a ?? b));

export async function downloadSite(
  database: PlummetDb,
  site: Site,
  organisationId: string,
  sources: SiteDownloadSources,
  now = new Date(),
  signal?: AbortSignal,
): Promise<SiteDownloadResult> {
  // Network first, all of it, so a failure half way leaves the phone as it was.
  const [scaffolds, findings, catalogue] = await Promise.all([
    sources.scaffolds(site.id, signal),
    sources.openFindings(site.id, signal),
    sources.catalogue(signal),
  ]);
  const scaffoldIds = new Set(scaffolds.map((scaffold) => scaffold.id));

  return database.transaction('rw', [database.sites, database.scaffolds, database.findings, database.catalogue, database.outbox], async () => {
    const waiting = await idsWithWaitingChanges(database, 'finding');
    const siteRecord: SiteRecord = { ...site, organisationId, offline: true, downloadedAt: now.toISOString() };
    await database.sites.put(siteRecord);

    // A walk finished on the phone but not yet sent has moved the dates on; keep the later ones.
    const localScaffolds = new Map((await database.scaffolds.where('siteId').equals(site.id).toArray()).map((s) => [s.id, s]));
    const scaffoldRecords: ScaffoldRecord[] = scaffolds.map((scaffold) => {
      const local = localScaffolds.get(scaffold.id);
      return {
        ...scaffold,
        organisationId,
        lastInspectedAt: later(scaffold.lastInspectedAt, local?.lastInspectedAt ?? null),
        nextDueAt: local?.lastInspectedAt && local.lastInspectedAt > (scaffold.lastInspectedAt ?? '') ? local.nextDueAt : scaffold.nextDueAt,
      };
    });
    await database.scaffolds.bulkPut(scaffoldRecords);

    const fresh = findings.filter((finding) => scaffoldIds.has(finding.scaffoldId) && !waiting.has(finding.id));
    const findingRecords: FindingRecord[] = fresh.map((finding) => ({ ...finding, organisationId, siteId: site.id }));
    // A copy on the phone at least as new stays (it may carry local fields the server's copy lacks).
    const local = await database.findings.bulkGet(findingRecords.map((finding) => finding.id));
    await database.findings.bulkPut(findingRecords.filter((finding, i) => !local[i] || local[i]!.version < finding.version));
    // Findings of this site that are no longer open on the server (fixed meanwhile) and have no
    // waiting change leave the phone; a walk's own new findings wait in the outbox and stay.
    const open = new Set(findings.map((finding) => finding.id));
    const stale = await database.findings
      .where('siteId')
      .equals(site.id)
      .filter((finding) => !open.has(finding.id) && !waiting.has(finding.id))
      .primaryKeys();
    await database.findings.bulkDelete(stale);

    await database.catalogue.clear();
    await database.catalogue.bulkPut(catalogue.map(catalogueRecordOf));

    return { scaffolds: scaffolds.length, findings: findingRecords.length, catalogueItems: catalogue.length, keptLocal: findings.length - fresh.length };
  });
}
