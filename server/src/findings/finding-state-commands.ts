/**
 * The fix loop's commands: state change (made safe, fixed, verified, reopened), assignment and
 * hand back. Called only through FindingCommands (finding-commands.ts).
 */
import { randomUUID } from 'node:crypto';
import {
  decideStateCommand,
  FindingAssignSchema,
  FindingHandBackInputSchema,
  FindingStateChangeSchema,
  isAlterationControl,
  madeSafeLapsesAt,
  UNFIXED_STATES,
} from '@plummet/shared';
import { AppError, ErrorCode, type ErrorIssue } from '../common/app-error.js';
import { applied, type CommandActor, type CommandResult, findingNotFound, inScope, invalid, mayAct, parseInput, requireRole } from './finding-command-rules.js';
import { toFinding } from './finding.mapper.js';
import type { FindingStore } from './finding-store.js';
import type { FindingChanges } from './findings.repository.js';

const SCOPE_REASON = 'The finding is not on your scaffolds or assigned to you';

/**
 * Moves the finding along the shared state machine and records what the move did: a fix row, a
 * verification row, or the made-safe measure on the finding (with when it lapses). The state it
 * is already in is a no-op answered as applied (see decideStateCommand).
 */
export async function changeFindingState(store: FindingStore, actor: CommandActor, id: string, payload: unknown): Promise<CommandResult> {
  const { user } = actor;
  requireRole(user, ['inspector', 'manager', 'foreman'], 'Your role cannot change the state of a finding');
  const input = parseInput(FindingStateChangeSchema, payload);
  const scoped = await store.finding(id);
  if (!scoped || !inScope(user, scoped)) throw findingNotFound();
  const current = scoped.finding;
  const decision = decideStateCommand(current.state, input.to, user.role, mayAct(user, scoped));
  if (decision.kind === 'noop') return applied(current, `Already ${input.to}: nothing to change`);
  if (decision.kind === 'reject') throw new AppError(decision.code === 'illegal' ? ErrorCode.Conflict : ErrorCode.Forbidden, decision.reason);
  const kind = decision.transition.kind;
  const settings = await store.settings();

  const issues: ErrorIssue[] = [];
  if (kind === 'reopen' && !input.note.trim()) issues.push({ path: ['note'], code: 'reason_required', message: 'Say why the finding is reopened' });
  const needsProof = (kind === 'make-safe' || kind === 'fix') && current.riskBand === 'High' && settings.proofPhotoRequiredForHigh;
  if (needsProof && input.photoIds.length === 0) {
    issues.push({ path: ['photoIds'], code: 'proof_photo_required', message: 'A High finding needs a proof photo of what was done' });
  }
  if (issues.length) throw invalid(issues);

  const recordId = input.recordId ?? randomUUID();
  // Proof photos belong to the record this change makes (the finding itself for made safe); they may upload later.
  const owner = kind === 'make-safe' ? { type: 'finding', id: current.id } : { type: kind === 'fix' ? 'fix' : 'verification', id: recordId };
  const photoIds = [...new Set(input.photoIds)];
  const foreign = (await store.photoOwners(photoIds)).filter((p) => p.ownerType !== owner.type || p.ownerId !== owner.id);
  if (foreign.length) {
    throw invalid([{ path: ['photoIds'], code: 'photo_owned_elsewhere', message: `These photos belong to another record: ${foreign.map((p) => p.id).join(', ')}` }]);
  }
  if (kind === 'verify' && settings.verifierMustDifferFromFixer && (await store.latestFixer(current.id)) === user.userId) {
    throw new AppError(ErrorCode.VerifierIsFixer, 'Whoever marked the finding fixed cannot verify it: another inspector or a manager must');
  }

  const now = await store.now();
  const control = input.control ?? null;
  const base = { id: recordId, organisationId: user.organisationId, findingId: current.id, note: input.note, photoIds };
  const changes: FindingChanges = { state: input.to, madeSafeUntil: null };
  if (kind === 'make-safe') {
    Object.assign(changes, {
      madeSafeNote: input.note,
      madeSafeControl: control,
      zoneRadiusM: input.zoneRadiusM ?? null,
      madeSafePhotoIds: photoIds,
      madeSafeUntil: madeSafeLapsesAt(now, settings),
    });
  } else if (kind === 'fix') {
    await store.insertFix({ ...base, control, fixedBy: user.userId, fixedAt: now });
    // An alteration changes the scaffold itself: inspection due before use (UK WAHR 2005 reg. 12(4)(b)).
    if (isAlterationControl(control)) await store.markScaffoldAltered(current.scaffoldId, now);
  } else {
    await store.insertVerification({ ...base, verifiedBy: user.userId, verifiedAt: now, outcome: kind === 'verify' ? 'verified' : 'reopened' });
  }
  const row = await store.updateFinding(current.id, changes);
  const transition = {
    kind,
    from: current.state,
    to: input.to,
    note: input.note,
    control: kind === 'verify' || kind === 'reopen' ? null : control,
    photoIds,
    zoneRadiusM: kind === 'make-safe' ? (input.zoneRadiusM ?? null) : null,
    recordId: kind === 'make-safe' ? null : recordId,
  };
  await store.audit({ entityType: 'finding', entityId: id, action: `state:${input.to}`, before: toFinding(current), after: { ...toFinding(row), transition } });
  return applied(row);
}

/**
 * Hands the finding to a foreman of the organisation (null takes it back); a due time given here
 * replaces the computed one. A new assignment clears a foreman's hand back. Assigning it again to
 * the same foreman with nothing else to change is a no-op.
 */
export async function assignFinding(store: FindingStore, actor: CommandActor, id: string, payload: unknown): Promise<CommandResult> {
  const { user } = actor;
  requireRole(user, ['inspector', 'manager', 'admin'], 'Only inspectors and managers assign findings');
  const input = parseInput(FindingAssignSchema, payload);
  const scoped = await store.finding(id);
  if (!scoped) throw findingNotFound();
  const current = scoped.finding;
  if (input.assigneeId && !(await store.isForeman(input.assigneeId))) {
    throw invalid([{ path: ['assigneeId'], code: 'not_a_foreman', message: 'Not a foreman of this organisation' }]);
  }
  const dueAt = input.dueAt ? new Date(input.dueAt) : undefined;
  const same = current.assigneeId === input.assigneeId && current.handBack === null && (dueAt === undefined || current.dueAt?.getTime() === dueAt.getTime());
  if (same) return applied(current, 'Already assigned so: nothing to change');
  const row = await store.updateFinding(id, { assigneeId: input.assigneeId, handBack: null, ...(dueAt ? { dueAt } : {}) });
  await store.audit({ entityType: 'finding', entityId: id, action: 'assign', before: toFinding(current), after: toFinding(row) });
  if (row.assigneeId && row.assigneeId !== current.assigneeId && row.riskBand === 'High') await store.assignedHigh(id, row.assigneeId);
  return applied(row);
}

/** A foreman returns a finding still to fix, with a reason; a manager then reassigns it. Nothing else changes. */
export async function handBackFinding(store: FindingStore, actor: CommandActor, id: string, payload: unknown): Promise<CommandResult> {
  const { user } = actor;
  requireRole(user, ['foreman'], 'Only foremen hand findings back');
  const input = parseInput(FindingHandBackInputSchema, payload);
  const scoped = await store.finding(id);
  if (!scoped || !inScope(user, scoped)) throw findingNotFound();
  if (!mayAct(user, scoped)) throw new AppError(ErrorCode.Forbidden, SCOPE_REASON);
  const current = scoped.finding;
  if (!UNFIXED_STATES.includes(current.state)) throw new AppError(ErrorCode.Conflict, `A ${current.state} finding cannot be handed back`);
  const handBack = { reason: input.reason, note: input.note, by: user.userId, at: (await store.now()).toISOString() };
  const row = await store.updateFinding(id, { handBack });
  await store.audit({ entityType: 'finding', entityId: id, action: 'hand-back', before: toFinding(current), after: toFinding(row) });
  return applied(row);
}
