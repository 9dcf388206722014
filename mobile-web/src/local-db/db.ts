import Dexie, { type EntityTable } from 'dexie';
import type {
  CatalogueItemRecord,
  ControlCheckRecord,
  FindingRecord,
  FixRecord,
  PhotoMetaRecord,
  InspectionRecord,
  MetaEntry,
  OutboxEntry,
  PhotoRecord,
  ScaffoldRecord,
  SignedReportRecord,
  SiteRecord,
  VerificationRecord,
} from './records';

export const DB_NAME = 'plummet';

/**
 * The phone's database. The UI reads from here (works with no signal); src/sync/ alone moves
 * records to and from the server through the outbox.
 *
 * SCHEMA VERSIONS ARE APPEND-ONLY. Once a version has shipped, never edit it: add
 * `this.version(n + 1).stores({ ...changed tables only }).upgrade(tx => ...)` below the last one.
 * Phones in the field still hold data written under every earlier version.
 */
export class PlummetDb extends Dexie {
  sites!: EntityTable<SiteRecord, 'id'>;
  scaffolds!: EntityTable<ScaffoldRecord, 'id'>;
  inspections!: EntityTable<InspectionRecord, 'id'>;
  findings!: EntityTable<FindingRecord, 'id'>;
  controlChecks!: EntityTable<ControlCheckRecord, 'id'>;
  photos!: EntityTable<PhotoRecord, 'id'>;
  catalogue!: EntityTable<CatalogueItemRecord, 'id'>;
  fixes!: EntityTable<FixRecord, 'id'>;
  verifications!: EntityTable<VerificationRecord, 'id'>;
  photoMeta!: EntityTable<PhotoMetaRecord, 'id'>;
  signedReports!: EntityTable<SignedReportRecord, 'scaffoldId'>;
  outbox!: EntityTable<OutboxEntry, 'id'>;
  meta!: EntityTable<MetaEntry, 'key'>;

  constructor(name: string = DB_NAME) {
    super(name);

    // Version 1 (first release). Only indexed fields are listed; records hold more.
    this.version(1).stores({
      sites: 'id, organisationId, updatedAt',
      scaffolds: 'id, siteId, updatedAt',
      inspections: 'id, scaffoldId, siteId, status, startedAt, updatedAt',
      findings: 'id, siteId, scaffoldId, inspectionId, state, dueAt, updatedAt, [scaffoldId+state]',
      controlChecks: 'id, inspectionId, [inspectionId+control]',
      photos: 'id, [ownerType+ownerId], uploadedAt',
      catalogue: 'id, category, *words',
      outbox: '++id, [entity+entityId], createdAt',
      meta: 'key',
    });

    // Version 2: the fix loop and the change feed. Fixes and verifications of findings (who fixed
    // decides who may verify), the server's photo metadata, and an index to find a foreman's
    // assigned findings. New tables only: nothing to convert; the feed fills them.
    this.version(2)
      .stores({
        fixes: 'id, findingId, fixedAt',
        verifications: 'id, findingId, verifiedAt',
        photoMeta: 'id, [ownerType+ownerId]',
        findings: 'id, siteId, scaffoldId, inspectionId, state, dueAt, updatedAt, [scaffoldId+state], assigneeId',
      })
      .upgrade(() => undefined);

    // ── Version 3: the register (kept as one block; renumber on merge if another version lands first) ──
    // The last signed report of each scaffold, readable at the scaffold offline. A new table only:
    // nothing to convert; the download of a site and the change feed fill it.
    this.version(3)
      .stores({ signedReports: 'scaffoldId, finishedAt' })
      .upgrade(() => undefined);
    // ── end of version 3 ──
  }
}

/** The app's one database instance; Dexie opens it on first use. */
export const db = new PlummetDb();

/** Every table that holds the signed-in user's data (all of them: sign-out clears the phone). */
export function userDataTables(database: PlummetDb) {
  return [
    database.sites,
    database.scaffolds,
    database.inspections,
    database.findings,
    database.controlChecks,
    database.photos,
    database.catalogue,
    database.fixes,
    database.verifications,
    database.photoMeta,
    database.signedReports,
    database.outbox,
    database.meta,
  ];
}

/** Empties every table in one transaction (sign-out). The schema stays, so the app keeps working. */
export async function clearLocalData(database: PlummetDb): Promise<void> {
  const tables = userDataTables(database);
  await database.transaction('rw', tables, async () => {
    await Promise.all(tables.map((table) => table.clear()));
  });
}

/** Reads a key-value setting (e.g. units, last sync time) from the meta table. */
export async function readMeta<T>(database: PlummetDb, key: string): Promise<T | undefined> {
  const entry = await database.meta.get(key);
  return entry?.value as T | undefined;
}

/** Writes a key-value setting to the meta table. */
export async function writeMeta<T>(database: PlummetDb, key: string, value: T): Promise<void> {
  await database.meta.put({ key, value });
}
