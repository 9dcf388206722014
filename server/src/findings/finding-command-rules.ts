/**
 * The pieces every finding command shares: who is acting, what a command answers, and the one
 * typed rejection (AppError with its ErrorCode). The REST routes let the global filter turn a
 * rejection into an HTTP error; the sync push turns the same rejection into a rejected mutation
 * whose reason is the error's message (sync/mutation-rejected.ts).
 */
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import type { FindingRow } from './finding.mapper.js';
import type { FindingWithScope } from './findings.repository.js';

export type { CommandActor } from '../common/command-actor.js';
export { invalid, parseInput, requireRole } from '../common/command-actor.js';

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

export const findingNotFound = () => new AppError(ErrorCode.NotFound, 'The finding does not exist (deleted, never reached the server, or not yours to see)');
