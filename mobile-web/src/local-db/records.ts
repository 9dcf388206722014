/**
 * What the phone keeps in IndexedDB. Records are the API shapes of @plummet/shared plus the few
 * fields the phone needs (organisation, site, local state). Values are SI, as on the server.
 * Whatever is read back is validated by the feature that reads it; a record that does not validate is treated as absent.
 */
import type {
  CatalogueItem,
  ControlCheck,
  Finding,
  FindingAssign,
  FindingCreate,
  FindingHandBackInput,
  FindingStateChangeInput,
  FindingUpdate,
  Fix,
  Photo,
  Inspection,
  InspectionCreate,
  InspectionDetail,
  InspectionFinish,
  InspectionUpdate,
  PhotoOwnerType,
  Scaffold,
  ScaffoldStatusChange,
  Site,
  UserProfileUpdate,
  ControlCheckPut,
  Verification,
} from '@plummet/shared';

/** ISO 8601 date-time string, e.g. 2026-03-01T08:30:00.000Z. */
export type IsoDateTime = string;

/** Fields every synced record carries. Ids are UUIDs made on the device, so offline creates never clash. */
export interface SyncedRecord {
  id: string;
  organisationId: string;
  updatedAt: IsoDateTime;
}

export interface SiteRecord extends Site, SyncedRecord {
  /** True when the inspector chose "make available offline" for this site. */
  offline?: boolean;
  /** When its scaffolds, open findings and the catalogue were last downloaded. */
  downloadedAt?: IsoDateTime;
}

export type ScaffoldRecord = Scaffold & SyncedRecord;

export interface InspectionRecord extends Inspection, SyncedRecord {
  siteId: string;
  status: 'in-progress' | 'finished';
}

/**
 * The last signed report of a scaffold, kept for reading at the scaffold with no signal (whichever
 * phone signed it). One per scaffold: a newer signature replaces it.
 */
export interface SignedReportRecord extends InspectionDetail {
  organisationId: string;
}

export type FindingState = Finding['state'];

/** A finding as the server shapes it; estimate fields are computed on the phone with the same shared code. */
export interface FindingRecord extends Finding, SyncedRecord {
  siteId: string;
}

/** A fix as recorded (made on this phone, or from the change feed). `fixedBy` decides who may verify it. */
export type FixRecord = Fix;

/** A verification or reopening of a fixed finding. */
export type VerificationRecord = Verification;

export type ControlOutcome = ControlCheck['result'];

export type ControlCheckRecord = ControlCheck & SyncedRecord;

export interface PhotoRecord {
  id: string;
  ownerType: PhotoOwnerType;
  ownerId: string;
  mimeType: string;
  /** Some browsers refuse Blobs in IndexedDB; those get the bytes as an ArrayBuffer. */
  data: Blob | ArrayBuffer;
  /** Bytes of the stored (compressed) image. */
  sizeBytes: number;
  width: number;
  height: number;
  createdAt: IsoDateTime;
  /** Set once the upload has reached the server. */
  uploadedAt?: IsoDateTime;
}

/**
 * A photo's metadata as the server has it (any phone's upload); the bytes come from its url on
 * demand. The phone's own photos, with their bytes, are in `photos`.
 */
export type PhotoMetaRecord = Photo;

export interface CatalogueItemRecord extends CatalogueItem {
  /** Lower-case words of the name, for prefix search (a multi-entry index). */
  words: string[];
}

export type OutboxEntity = 'site' | 'scaffold' | 'inspection' | 'finding' | 'control-check' | 'photo' | 'user';

/**
 * Each change the server must hear about, with the body the sync will send. `entityId` is the
 * record the change is about (for a control check: its inspection, as the route has it).
 */
export type OutboxChange =
  | { entity: 'inspection'; action: 'create'; payload: InspectionCreate }
  | { entity: 'inspection'; action: 'update'; payload: InspectionUpdate }
  | { entity: 'inspection'; action: 'finish'; payload: InspectionFinish }
  | { entity: 'control-check'; action: 'put'; payload: ControlCheckPut & { inspectionId: string; control: ControlCheck['control'] } }
  | { entity: 'finding'; action: 'create'; payload: FindingCreate }
  | { entity: 'finding'; action: 'update'; payload: FindingUpdate }
  | { entity: 'finding'; action: 'state'; payload: FindingStateChangeInput }
  | { entity: 'finding'; action: 'assign'; payload: FindingAssign }
  | { entity: 'finding'; action: 'hand-back'; payload: FindingHandBackInput }
  | { entity: 'scaffold'; action: 'status'; payload: ScaffoldStatusChange }
  | { entity: 'photo'; action: 'upload'; payload: { id: string; ownerType: PhotoOwnerType; ownerId: string; takenAt?: IsoDateTime } }
  | { entity: 'user'; action: 'update'; payload: UserProfileUpdate };

export type OutboxAction = OutboxChange['action'];

export type OutboxEntry = OutboxChange & {
  /** Auto-incremented by IndexedDB, so entries replay in the order they were made. */
  id?: number;
  entityId: string;
  op: 'put' | 'delete';
  createdAt: IsoDateTime;
  attempts: number;
};

export interface MetaEntry<T = unknown> {
  key: string;
  value: T;
}
