/**
 * What the phone keeps in IndexedDB. Only the fields the database indexes, or that every record
 * needs, are typed here; each feature narrows its records with the zod schemas from
 * @plummet/shared and validates what it reads back (STYLE habit 7).
 */

/** ISO 8601 date-time string, e.g. 2026-03-01T08:30:00.000Z. */
export type IsoDateTime = string;

/** Fields every synced record carries. Ids are UUIDs made on the device, so offline creates never clash. */
export interface SyncedRecord {
  id: string;
  organisationId: string;
  updatedAt: IsoDateTime;
}

export interface SiteRecord extends SyncedRecord {
  name: string;
  /** True when the inspector chose "make available offline" for this site. */
  offline?: boolean;
}

export interface ScaffoldRecord extends SyncedRecord {
  siteId: string;
  name: string;
}

export interface InspectionRecord extends SyncedRecord {
  siteId: string;
  scaffoldId: string;
  status: 'in-progress' | 'finished' | 'signed';
  startedAt: IsoDateTime;
}

export type FindingState = 'open' | 'made-safe' | 'fixed' | 'verified';

export interface FindingRecord extends SyncedRecord {
  siteId: string;
  scaffoldId: string;
  inspectionId: string;
  state: FindingState;
  /** Severity × likelihood, 1–25 (BRIEF, risk score). */
  riskScore?: number;
  dueAt?: IsoDateTime;
}

export type ControlOutcome = 'pass' | 'fail' | 'not-applicable';

export interface ControlCheckRecord extends SyncedRecord {
  inspectionId: string;
  /** Which falling-object control, e.g. 'toe-boards', 'brick-guards'. */
  control: string;
  outcome?: ControlOutcome;
}

export interface PhotoRecord {
  id: string;
  ownerType: 'finding' | 'control-check' | 'fix-proof';
  ownerId: string;
  mimeType: string;
  /** Some browsers refuse Blobs in IndexedDB; those get the bytes as an ArrayBuffer. */
  data: Blob | ArrayBuffer;
  createdAt: IsoDateTime;
  /** Set once the upload has reached the server. */
  uploadedAt?: IsoDateTime;
}

export interface CatalogueItemRecord {
  id: string;
  name: string;
  category: string;
  /** Lower-case words of the name, for prefix search (a multi-entry index). */
  words: string[];
}

export type OutboxEntity = 'site' | 'scaffold' | 'inspection' | 'finding' | 'control-check' | 'photo';

export interface OutboxEntry {
  /** Auto-incremented by IndexedDB, so entries replay in the order they were made. */
  id?: number;
  entity: OutboxEntity;
  entityId: string;
  op: 'put' | 'delete';
  payload?: unknown;
  createdAt: IsoDateTime;
  attempts: number;
}

export interface MetaEntry<T = unknown> {
  key: string;
  value: T;
}
