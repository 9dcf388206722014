/**
 * "Make a site available offline": the site's first pull. The change feed scoped to that one site,
 * from its start (its scaffolds, inspections and control checks, findings with their fixes,
 * verifications and photo metadata, the organisation's catalogue items), applied exactly as every
 * pull is (sync-apply.ts), plus the built-in catalogue the app carries. Records with changes still
 * waiting in the outbox keep the phone's copy, as in every pull; records of the site the server no
 * longer has for this user leave the phone as a tombstone would take them. The scoped pull has a
 * cursor of its own: the phone's feed cursor does not move, so the next sync misses nothing.
 */
import { BUILTIN_ITEMS, type Site, type SyncChange, type SyncPullResponse, type SyncTombstone } from '@plummet/shared';
import { catalogueRecordOf } from '../features/catalogue/catalogue-search';
import type { PlummetDb } from '../local-db/db';
import { idsWithWaitingChanges } from '../local-db/outbox';
import { applyPulledPage, syncedTables } from './sync-apply';
import { clientIdOf } from './sync-state';
import type { SyncTransport } from './sync-transport';

export interface SiteDownloadResult {
  scaffolds: number;
  findings: number;
  catalogueItems: number;
  /** Findings left as they are because the phone has changes to them that wait to be sent. */
  keptLocal: number;
}

/** Built-in items have fixed ids and no dates of their own on the phone. */
const BUILT_IN_AT = '2026-01-01T00:00:00.000Z';
const PAGE = 500;

export async function downloadSite(
  database: PlummetDb,
  site: Site,
  organisationId: string,
  transport: Pick<SyncTransport, 'pull'>,
  now = new Date(),
  signal?: AbortSignal,
): Promise<SiteDownloadResult> {
  // Network first, every page, so a failure half way leaves the phone as it was.
  const clientId = await clientIdOf(database);
  const pages: SyncPullResponse[] = [];
  let cursor: string | undefined;
  for (;;) {
    signal?.throwIfAborted();
    const page = await transport.pull(cursor, PAGE, clientId, site.id);
    pages.push(page);
    cursor = page.cursor;
    if (!page.hasMore) break;
  }
  const changes = pages.flatMap((page) => page.changes);
  const pulled = (type: SyncChange['type']) => new Set(changes.filter((c) => c.type === type).map((c) => (c.record as { id: string }).id));
  const [scaffoldIds, findingIds] = [pulled('scaffold'), pulled('finding')];

  return database.transaction('rw', syncedTables(database), async () => {
    const waiting = await idsWithWaitingChanges(database, 'finding');
    for (const page of pages) await applyPulledPage(database, page, organisationId, { feedCursor: false });
    // What the phone holds of this site that the server no longer has for this user goes, as a tombstone would take it.
    const staleScaffolds = await database.scaffolds.where('siteId').equals(site.id).filter((s) => !scaffoldIds.has(s.id)).primaryKeys();
    const staleFindings = await database.findings.where('siteId').equals(site.id).filter((f) => !findingIds.has(f.id)).primaryKeys();
    const tombstones: SyncTombstone[] = [
      ...staleScaffolds.map((id) => ({ recordType: 'scaffold' as const, id, reason: 'out-of-scope' as const })),
      ...staleFindings.map((id) => ({ recordType: 'finding' as const, id, reason: 'out-of-scope' as const })),
    ];
    if (tombstones.length) {
      await applyPulledPage(database, { changes: tombstones.map((record) => ({ type: 'tombstone', record })), cursor: cursor ?? '0.0', hasMore: false }, organisationId, { feedCursor: false });
    }
    const local = await database.sites.get(site.id);
    await database.sites.put({ ...site, ...local, organisationId, offline: true, downloadedAt: now.toISOString() });
    await database.catalogue.bulkPut(BUILTIN_ITEMS.map((item) => catalogueRecordOf({ ...item, builtIn: true, createdAt: BUILT_IN_AT, updatedAt: BUILT_IN_AT, version: 1 })));

    const kept = [...findingIds].filter((id) => waiting.has(id)).length;
    return { scaffolds: scaffoldIds.size, findings: findingIds.size - kept, catalogueItems: BUILTIN_ITEMS.length + pulled('catalogue-item').size, keptLocal: kept };
  });
}
