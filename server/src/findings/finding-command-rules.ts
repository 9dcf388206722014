/**
 * The pieces every finding command shares: who is acting, what a command answers, and the one
 * typed rejection (AppError with its ErrorCode). The REST routes let the global filter turn a
 * rejection into an HTTP error; the sync push turns the same rejection into a rejected mutation
 * whose reason is the error's message (sync/mutation-rejected.ts).
 */
import type { Role } from '@plummet/shared';
import type { ZodType } from 'zod';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode, type ErrorIssue } from '../common/app-error.js';
import type { FindingRow } from './finding.mapper.js';
import type { FindingWithScope } from './findings.repository.js';

/** Who runs a command: the user, and for a push the phone's client and mutation ids (null through REST). */
export interface CommandActor {
  user: AuthUser;
  clientId: string | null;
  mutationId: number | null;
}

export interface CommandResult {
  /** `conflict`: applied, but it replaced a value its writer had not seen (kept as a conflict). */
  outcome: 'applied' | 'conflict';
  /** Why nothing changed (a retry, the state it is already in) or what the conflict replaced. */
  reason: string | null;
  conflictIds: string[];
  row: FindingRow;
}

export const applied = (row: FindingRow, reason: string | null = null): CommandResult => ({ outcome: 'applied', reason, conflictIds: [], row });

/** Whether the caller may see the finding: everyone in the organisation but a foreman outside their scaffolds and assignments. */
export function inScope(user: AuthUser, scoped: FindingWithScope): boolean {
  if (user.role !== 'foreman') return true;
  return scoped.scaffoldForemanId === user.userId || scoped.finding.assigneeId === user.userId;
}

/**
 * Whether a foreman may act on the finding: assigned to them, or on a scaffold they look after
 * while nobody is assigned (an assignment to another foreman takes it out of their hands).
 */
export function mayAct(user: AuthUser, scoped: FindingWithScope): boolean {
  if (user.role !== 'foreman') return true;
  const assignee = scoped.finding.assigneeId;
  return assignee === user.userId || (assignee === null && scoped.scaffoldForemanId === user.userId);
}

/** The one role check of a command (403 with the command's own words). */
export function requireRole(user: AuthUser, roles: readonly Role[], message: string): void {
  if (!roles.includes(user.role)) throw new AppError(ErrorCode.Forbidden, message);
}

export const findingNotFound = () => new AppError(ErrorCode.NotFound, 'The finding does not exist (deleted, never reached the server, or not yours to see)');

export const invalid = (issues: ErrorIssue[]) => new AppError(ErrorCode.ValidationFailed, 'The request is not valid', issues);

/** A command's input checked with its shared schema (REST has checked it already; a pushed payload has not). */
export function parseInput<T>(schema: ZodType<T>, payload: unknown): T {
  const parsed = schema.safeParse(payload);
  if (parsed.success) return parsed.data;
  throw invalid(parsed.error.issues.map((i) => ({ path: i.path.map((p) => (typeof p === 'symbol' ? String(p) : p)), code: i.code, message: i.message })));
}
