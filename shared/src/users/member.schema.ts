import { z } from 'zod';
import { ROLE_VALUES } from '../auth/roles.js';
import { DateTimeSchema, IdSchema, NameSchema } from '../common/fields.schema.js';
import { listQueryShape, listResponseSchema } from '../common/list.schema.js';
import { EmailSchema } from './user.schema.js';

/** A member of the caller's organisation, as admins see them. */
export const MemberSchema = z.object({
  id: IdSchema,
  email: z.string(),
  name: z.string(),
  position: z.string(),
  role: z.enum(ROLE_VALUES),
  active: z.boolean(),
  /** Invited but has not chosen a password yet. */
  invitationPending: z.boolean(),
  /** When they joined (or were invited to) the organisation. */
  createdAt: DateTimeSchema,
});
export type Member = z.infer<typeof MemberSchema>;

/** `GET /api/users`: the organisation's members, by name unless sorted otherwise. */
export const MemberListQuerySchema = z.object({
  ...listQueryShape(['name', 'email', 'createdAt'], 'name', 'asc'),
  role: z.enum(ROLE_VALUES).optional(),
});
export type MemberListQuery = z.infer<typeof MemberListQuerySchema>;

export const MemberListResponseSchema = listResponseSchema(MemberSchema);
export type MemberListResponse = z.infer<typeof MemberListResponseSchema>;

/** `POST /api/users/invitations`: an admin invites someone by e-mail with a role. */
export const InvitationCreateSchema = z.strictObject({
  email: EmailSchema,
  name: NameSchema,
  role: z.enum(ROLE_VALUES),
});
export type InvitationCreate = z.infer<typeof InvitationCreateSchema>;

/** `PATCH /api/users/:id`: an admin changes a member's role or (de)activates them. */
export const MemberUpdateSchema = z
  .strictObject({
    role: z.enum(ROLE_VALUES).optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined, 'Send a role or active');
export type MemberUpdate = z.infer<typeof MemberUpdateSchema>;

/**
 * `GET /api/users/foremen`: the organisation's active foremen, for an inspector or manager to hand a
 * finding to. `phone` is the number to call when the organisation keeps one (null otherwise).
 */
export const ForemanSchema = z.object({
  id: IdSchema,
  name: z.string(),
  position: z.string(),
  phone: z.string().nullable(),
});
export type Foreman = z.infer<typeof ForemanSchema>;
export const ForemanListResponseSchema = z.object({ items: z.array(ForemanSchema) });
export type ForemanListResponse = z.infer<typeof ForemanListResponseSchema>;
