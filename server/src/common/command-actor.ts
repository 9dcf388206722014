/**
 * What every command layer (findings, inspections, scaffolds, user settings) shares: who is acting, the one
 * role check, a pushed payload checked with its shared schema, and the rows that keep clashes. A command refuses with one
 * typed rejection (AppError): REST answers it as an HTTP error, sync push as a rejected mutation
 * whose reason is the error's message (sync/mutation-rejected.ts).
 */
import type { FieldConflict, Role, SyncEntity } from '@plummet/shared';
import type { ZodType } from 'zod';
import type { AuthUser } from '../auth/auth.types.js';
import type { syncConflicts } from '../db/schema/index.js';
import { AppError, ErrorCode, type ErrorIssue } from './app-error.js';

/** Who runs a command: the user, and for a push the phone's client and mutation ids (null through REST). */
export interface CommandActor {
  user: AuthUser;
  clientId: string | null;
  mutationId: number | null;
}

/** The client id a conflict names when a server-side write wins (it never does: a server write has seen every value). */
export const SERVER_CLIENT = '00000000-0000-0000-0000-000000000000';

/** The one role check of a command (403 with the command's own words). */
export function requireRole(user: AuthUser, roles: readonly Role[], message: string): void {
  if (!roles.includes(user.role)) throw new AppError(ErrorCode.Forbidden, message);
}

export const invalid = (issues: ErrorIssue[]) => new AppError(ErrorCode.ValidationFailed, 'The request is not valid', issues);

/** A command's input checked with its shared schema (REST has checked it already; a pushed payload has not). */
export function parseInput<T>(schema: ZodType<T>, payload: unknown): T {
  const parsed = schema.safeParse(payload);
  if (parsed.success) return parsed.data;
  throw invalid(parsed.error.issues.map((i) => ({ path: i.path.map((p) => (typeof p === 'symbol' ? String(p) : p)), code: i.code, message: i.message })));
}

/**
 * The version a writer had seen. A REST write has seen the record as it is; a push's base version
 * is never taken above what the server has given that phone (`given`, when known) nor above the
 * record's own version, so a high number cannot hide a conflict.
 */
export function seenVersion(actor: CommandActor, current: number, baseVersion: number | undefined, given?: number): number {
  if (actor.clientId === null) return current;
  return Math.min(baseVersion ?? 0, current, given ?? current);
}

/** What a conflict answer tells the phone: the fields that clashed with values its writer had not seen. */
export function conflictReason(conflicts: readonly { field: string }[]): string {
  return `Clashed with a value you had not seen: ${conflicts.map((c) => c.field).join(', ')}`;
}

/**
 * The rows that keep a merge's clashes: the value left in place, the one it replaced with who wrote
 * it and when (from the field's stamp), and the writer that won (the actor; a REST write names no phone).
 */
export function conflictRows(actor: CommandActor, entity: SyncEntity, entityId: string, conflicts: readonly FieldConflict[]): (typeof syncConflicts.$inferInsert)[] {
  return conflicts.map((c) => ({
    organisationId: actor.user.organisationId,
    entity,
    entityId,
    field: c.field,
    currentValue: c.currentValue ?? null,
    replacedValue: c.replacedValue ?? null,
    replacedVersion: c.replacedStamp.v,
    replacedClientId: c.replacedStamp.c,
    replacedUserId: c.replacedStamp.u ?? null,
    replacedAt: c.replacedStamp.t ? new Date(c.replacedStamp.t) : null,
    winnerClientId: actor.clientId ?? SERVER_CLIENT,
    winnerUserId: actor.user.userId,
    mutationId: actor.mutationId ?? 0,
  }));
}
