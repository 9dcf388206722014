/**
 * The sync protocol: a phone pushes batches of mutations with per-client increasing ids
 * and pulls changes after a server-side cursor. One schema per API shape; the server wraps them,
 * the phone parses answers with them.
 */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, NoteSchema } from '../common/fields.schema.js';
import { CatalogueItemSchema } from '../catalogue/catalogue-item.schema.js';
import { FindingSchema, FixSchema, VerificationSchema } from '../findings/finding.schema.js';
import { ControlCheckSchema, ControlResultSchema, ControlSchema } from '../inspections/control-check.schema.js';
import { InspectionSchema } from '../inspections/inspection.schema.js';
import { PhotoSchema } from '../photos/photo.schema.js';
import { ScaffoldSchema } from '../scaffolds/scaffold.schema.js';
import { SiteSchema } from '../sites/site.schema.js';
import { UserProfileSchema } from '../users/user.schema.js';

/** Most mutations one push may carry (a phone back from a long walk sends several batches). */
export const SYNC_PUSH_MAX = 1000;
/** Most changes one pull page holds. */
export const SYNC_PULL_MAX = 1000;

/** The records a phone changes through push: findings, inspections, their control checks, a scaffold's tag status, and the user's own settings. */
export const SYNC_ENTITIES = ['finding', 'inspection', 'control-check', 'scaffold', 'user'] as const;
export const SyncEntitySchema = z.enum(SYNC_ENTITIES);
export type SyncEntity = z.infer<typeof SyncEntitySchema>;

/**
 * finding: create, update, state, assign, hand-back; inspection: create, update, finish;
 * control-check: put (the answer to one control, made or changed); scaffold: status (its tag status,
 * with a reason); user: update (own settings).
 */
export const SyncActionSchema = z.enum(['create', 'update', 'state', 'assign', 'hand-back', 'finish', 'put', 'status']);
export type SyncAction = z.infer<typeof SyncActionSchema>;

/**
 * One mutation. The envelope is checked for the whole batch; the payload is checked per mutation by
 * the server with the schema of its command (FindingCreateSchema, InspectionUpdateSchema,
 * ControlCheckSyncPutSchema, ScaffoldStatusChangeSchema, UserProfileUpdateSchema…), so one invalid
 * payload is rejected with its reason instead of blocking every later mutation.
 */
export const SyncMutationSchema = z.object({
  /** Per-client mutation id: 1, 2, 3… with no gaps. */
  id: z.number().int().min(1).max(Number.MAX_SAFE_INTEGER),
  entity: SyncEntitySchema,
  entityId: IdSchema,
  action: SyncActionSchema,
  /** The record version the client last saw when it made the change (0: it made the record). */
  baseVersion: z.number().int().min(0).default(0),
  payload: z.record(z.string(), z.unknown()),
});
export type SyncMutation = z.infer<typeof SyncMutationSchema>;
export type SyncMutationInput = z.input<typeof SyncMutationSchema>;

/** A control check's answer through push: which inspection and control it answers, with the result and note. */
export const ControlCheckSyncPutSchema = z.object({
  inspectionId: IdSchema,
  control: ControlSchema,
  result: ControlResultSchema.optional(),
  note: NoteSchema.optional(),
});
export type ControlCheckSyncPut = z.infer<typeof ControlCheckSyncPutSchema>;

export const SyncPushSchema = z.object({
  /** The phone's id (one per browser database), made on the phone. */
  clientId: IdSchema,
  mutations: z.array(SyncMutationSchema).min(1).max(SYNC_PUSH_MAX),
});
export type SyncPush = z.infer<typeof SyncPushSchema>;

export const SyncOutcomeSchema = z.enum(['applied', 'conflict', 'rejected']);
export type SyncOutcome = z.infer<typeof SyncOutcomeSchema>;

export const SyncMutationResultSchema = z.object({
  id: z.number().int(),
  outcome: SyncOutcomeSchema,
  /** Why a mutation was rejected (or why it changed nothing). */
  reason: z.string().nullable(),
  /** True when this mutation had been applied by an earlier push (a retry): its first outcome is repeated. */
  replayed: z.boolean(),
  /** Conflicts this mutation opened (values it replaced that its writer had not seen). */
  conflictIds: z.array(IdSchema),
});
export type SyncMutationResult = z.infer<typeof SyncMutationResultSchema>;

/** A finding as the change feed carries it: the API shape plus the organisation and site the phone files it under. */
export const SyncFindingSchema = FindingSchema.extend({ organisationId: IdSchema, siteId: IdSchema });
export type SyncFinding = z.infer<typeof SyncFindingSchema>;

export const SyncPushResponseSchema = z.object({
  /** The last mutation id the server has applied from this client. */
  lastMutationId: z.number().int(),
  results: z.array(SyncMutationResultSchema),
  /** The records the batch touched, as they now are (so a phone learns the outcome of a rejected change too). */
  records: z.array(SyncFindingSchema),
});
export type SyncPushResponse = z.infer<typeof SyncPushResponseSchema>;

export const SyncConflictStatusSchema = z.enum(['open', 'resolved']);
export const SyncConflictKeepSchema = z.enum(['current', 'replaced', 'custom']);

export const SyncConflictSchema = z.object({
  id: IdSchema,
  entity: SyncEntitySchema,
  entityId: IdSchema,
  field: z.string(),
  /** The value the later write left in place. */
  currentValue: z.unknown(),
  /** The value it replaced without its writer having seen it. */
  replacedValue: z.unknown(),
  winnerUserId: IdSchema.nullable(),
  /** Who wrote the replaced value and when (null when the server cannot tell, e.g. an older conflict). */
  replacedUserId: IdSchema.nullable().default(null),
  replacedAt: DateTimeSchema.nullable().default(null),
  /** The two writers' names as the organisation knows them (null when it cannot tell, or from an older server). */
  winnerName: z.string().nullable().default(null),
  replacedName: z.string().nullable().default(null),
  status: SyncConflictStatusSchema,
  resolution: SyncConflictKeepSchema.nullable(),
  resolvedBy: IdSchema.nullable(),
  resolvedAt: DateTimeSchema.nullable(),
  createdAt: DateTimeSchema,
});
export type SyncConflict = z.infer<typeof SyncConflictSchema>;

export const SyncConflictListQuerySchema = z.object({
  status: SyncConflictStatusSchema.optional(),
  entityId: IdSchema.optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type SyncConflictListQuery = z.infer<typeof SyncConflictListQuerySchema>;

export const SyncConflictListResponseSchema = z.object({ items: z.array(SyncConflictSchema) });

/** Settles a conflict: keep the current value, put the replaced one back, or type another. */
export const SyncConflictResolveSchema = z
  .object({ keep: SyncConflictKeepSchema, value: z.unknown().optional() })
  .refine((v) => v.keep !== 'custom' || v.value !== undefined, { path: ['value'], message: 'A custom value is needed' });
export type SyncConflictResolve = z.infer<typeof SyncConflictResolveSchema>;

/** Position in the change feed: `<transaction id>.<sequence>`; absent from the start. */
export const SyncCursorSchema = z
  .string()
  .regex(/^\d{1,20}\.\d{1,20}$/, 'A cursor from an earlier pull')
  // The transaction id is a PostgreSQL xid8 (unsigned 64 bits), the sequence a bigint.
  .refine((c) => {
    const [xid, seq] = c.split('.');
    return BigInt(xid) <= 2n ** 64n - 1n && BigInt(seq) <= 2n ** 63n - 1n;
  }, 'A cursor from an earlier pull');

export const SyncPullQuerySchema = z.object({
  cursor: SyncCursorSchema.optional(),
  /** The phone's id: the server notes the versions it hands it (a later push's base version is checked against them). */
  clientId: IdSchema.optional(),
  /**
   * Only this site's records (its scaffolds, inspections and checks, findings with their fixes,
   * verifications and photos), with the organisation's catalogue and the caller's profile: the first
   * pull of a site a phone makes available offline. Its cursor is its own, not the phone's feed cursor.
   */
  siteId: IdSchema.optional(),
  limit: z.coerce.number().int().min(1).max(SYNC_PULL_MAX).default(500),
  /**
   * `rows`: each finding as `{ type: 'finding', row: [...] }`, its values without their keys, which
   * unpackPullPage (finding-rows.ts) turns back into records; `records` (the default, for phones
   * that predate rows): each as its record.
   */
  format: z.enum(['records', 'rows']).default('records'),
});
export type SyncPullFormat = SyncPullQuery['format'];
export type SyncPullQuery = z.infer<typeof SyncPullQuerySchema>;

/** Every kind of record a phone holds; the change feed carries each, and a tombstone names one to drop. */
export const SYNC_RECORD_TYPES = [
  'site',
  'scaffold',
  'inspection',
  'control-check',
  'finding',
  'fix',
  'verification',
  'photo',
  'catalogue-item',
  'user',
  'conflict',
] as const;
export const SyncRecordTypeSchema = z.enum(SYNC_RECORD_TYPES);
export type SyncRecordType = z.infer<typeof SyncRecordTypeSchema>;

/**
 * A record the phone must drop: deleted, archived, or no longer in the caller's scope (a foreman
 * reassigned away from a finding). The id is the record's id (a control check: `<inspectionId>:<control>`).
 */
export const SyncTombstoneSchema = z.object({
  recordType: SyncRecordTypeSchema,
  id: z.string().min(1).max(120),
  reason: z.enum(['deleted', 'archived', 'out-of-scope']),
});
export type SyncTombstone = z.infer<typeof SyncTombstoneSchema>;

export const SyncChangeSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('finding'), record: SyncFindingSchema }),
  z.object({ type: z.literal('conflict'), record: SyncConflictSchema }),
  z.object({ type: z.literal('fix'), record: FixSchema }),
  z.object({ type: z.literal('verification'), record: VerificationSchema }),
  /** Photo metadata; the bytes come from GET /api/photos/:id (and its thumbnail). */
  z.object({ type: z.literal('photo'), record: PhotoSchema }),
  z.object({ type: z.literal('site'), record: SiteSchema }),
  z.object({ type: z.literal('scaffold'), record: ScaffoldSchema }),
  z.object({ type: z.literal('inspection'), record: InspectionSchema }),
  z.object({ type: z.literal('control-check'), record: ControlCheckSchema }),
  z.object({ type: z.literal('catalogue-item'), record: CatalogueItemSchema }),
  /** The caller's own profile and settings (units). */
  z.object({ type: z.literal('user'), record: UserProfileSchema }),
  z.object({ type: z.literal('tombstone'), record: SyncTombstoneSchema }),
]);
export type SyncChange = z.infer<typeof SyncChangeSchema>;

export const SyncPullResponseSchema = z.object({
  changes: z.array(SyncChangeSchema),
  /** Pass it to the next pull; unchanged when nothing new. */
  cursor: SyncCursorSchema,
  hasMore: z.boolean(),
});
export type SyncPullResponse = z.infer<typeof SyncPullResponseSchema>;

export const SYNC_CURSOR_START = '0.0';
