/** Audit events: who changed what and when, with the record before and after. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema } from './fields.schema.js';
import { listQueryShape, listResponseSchema } from './list.schema.js';

export const AUDIT_ENTITY_TYPES = ['site', 'scaffold', 'inspection', 'control-check', 'finding', 'catalogue-item', 'user', 'photo', 'organisation'] as const;

export const AuditEventSchema = z.object({
  id: z.string(),
  actorId: IdSchema.nullable(),
  entityType: z.string(),
  entityId: z.string(),
  action: z.string(),
  before: z.unknown().nullable(),
  after: z.unknown().nullable(),
  at: DateTimeSchema,
});
export type AuditEvent = z.infer<typeof AuditEventSchema>;

export const AuditListQuerySchema = z.object({
  ...listQueryShape(['at'], 'at', 'desc'),
  entityType: z.string().min(1).max(50).optional(),
  entityId: z.string().min(1).max(100).optional(),
  actorId: IdSchema.optional(),
});
export type AuditListQuery = z.infer<typeof AuditListQuerySchema>;

export const AuditListResponseSchema = listResponseSchema(AuditEventSchema);
