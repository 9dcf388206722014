import {
  checkFindingTransition,
  madeSafeLapsesAt,
  type FindingControl,
  type HandBackReason,
  type OrganisationSettings,
  type Role,
} from '@plummet/shared';
import type { PlummetDb } from '../../local-db/db';
import { enqueueChange } from '../../local-db/outbox';
import type { FindingRecord, FixRecord, PhotoRecord, VerificationRecord } from '../../local-db/records';
import { addPhotos } from '../photos/photos.store';
import { FixLoopRefusal, latestFix, proofPhotoRequired } from './fix-loop-rules';

/** Who acts on the phone: the signed-in user. */
export interface Actor {
  userId: string;
  role: Role;
}

/** What the foreman (or inspector) did about a finding: made safe for now, or the permanent fix. */
export interface FixActionInput {
  note: string;
  control: FindingControl | null;
  /** Made safe by closing the zone below: its radius, m. */
  zoneRadiusM?: number;
  /** The fix's id, made on the phone so its proof photos can name their owner offline. */
  recordId: string;
  /** Proof photos, already prepared as records (owner: the fix, or the finding when made safe). */
  photos: readonly PhotoRecord[];
}

export interface VerifyInput {
  outcome: 'verified' | 'reopened';
  note: string;
  recordId: string;
  photos: readonly PhotoRecord[];
}

/** A foreman acts on findings assigned to them, or on scaffolds they look after. */
async function inScope(database: PlummetDb, finding: FindingRecord, actor: Actor): Promise<boolean> {
  if (finding.assigneeId === actor.userId) return true;
  const scaffold = await database.scaffolds.get(finding.scaffoldId);
  return scaffold?.foremanId === actor.userId;
}

async function checkedMove(database: PlummetDb, findingId: string, to: FindingRecord['state'], actor: Actor): Promise<FindingRecord> {
  const finding = await database.findings.get(findingId);
  if (!finding) throw new FixLoopRefusal('This finding is not on this phone.');
  const check = checkFindingTransition(finding.state, to, actor.role, await inScope(database, finding, actor));
  if (!check.ok) {
    const why = { illegal: `it is ${finding.state.replace('-', ' ')} now`, role: 'your role does not record this', scope: 'it is neither assigned to you nor on a scaffold you look after' }[check.reason];
    throw new FixLoopRefusal(`This cannot be recorded: ${why}.`);
  }
  return finding;
}

function requireProof(finding: FindingRecord, input: { photos: readonly PhotoRecord[] }, settings: OrganisationSettings): void {
  if (proofPhotoRequired(finding, settings) && input.photos.length === 0) {
    throw new FixLoopRefusal('A High finding needs a proof photo: take one with the camera first.');
  }
}

/**
 * Records a temporary measure (made safe): the finding, the state command and its proof photos
 * in one transaction, the photos queued after the command that names them. The measure lapses at
 * the end of the shift unless renewed.
 */
export async function recordMadeSafe(database: PlummetDb, findingId: string, input: FixActionInput, actor: Actor, settings: OrganisationSettings, now = new Date()): Promise<FindingRecord> {
  if (!input.note.trim()) throw new FixLoopRefusal('Say what was done to make it safe.');
  if (input.control === 'close-zone' && !(input.zoneRadiusM && input.zoneRadiusM > 0)) throw new FixLoopRefusal('Give the radius of the closed zone.');
  return database.transaction('rw', [database.findings, database.scaffolds, database.photos, database.outbox], async () => {
    const finding = await checkedMove(database, findingId, 'made-safe', actor);
    requireProof(finding, input, settings);
    const updated: FindingRecord = {
      ...finding,
      state: 'made-safe',
      madeSafeNote: input.note.trim(),
      madeSafeUntil: madeSafeLapsesAt(now, settings).toISOString(),
      ...(input.control === 'close-zone' ? { exposure: 'zone-closed' as const } : {}),
      updatedAt: now.toISOString(),
    };
    await database.findings.put(updated);
    await enqueueChange(database, findingId, {
      entity: 'finding',
      action: 'state',
      payload: {
        to: 'made-safe',
        note: input.note.trim(),
        ...(input.control ? { control: input.control } : {}),
        ...(input.zoneRadiusM ? { zoneRadiusM: input.zoneRadiusM } : {}),
        photoIds: input.photos.map((p) => p.id),
      },
    }, now);
    await addPhotos(database, input.photos);
    return updated;
  });
}

/** Records the permanent fix: the finding, the fix record (its fixer decides who may verify), the command, then its photos. */
export async function recordFix(database: PlummetDb, findingId: string, input: FixActionInput, actor: Actor, settings: OrganisationSettings, now = new Date()): Promise<FixRecord> {
  if (!input.note.trim()) throw new FixLoopRefusal('Say what was done to fix it.');
  const control = input.control;
  if (!control) throw new FixLoopRefusal('Choose the control that was applied.');
  return database.transaction('rw', [database.findings, database.scaffolds, database.fixes, database.photos, database.outbox], async () => {
    const finding = await checkedMove(database, findingId, 'fixed', actor);
    requireProof(finding, input, settings);
    const fix: FixRecord = {
      id: input.recordId,
      findingId,
      fixedBy: actor.userId,
      fixedAt: now.toISOString(),
      note: input.note.trim(),
      control: input.control,
      photoIds: input.photos.map((p) => p.id),
    };
    await database.findings.put({ ...finding, state: 'fixed', updatedAt: now.toISOString() });
    await database.fixes.put(fix);
    await enqueueChange(database, findingId, {
      entity: 'finding',
      action: 'state',
      payload: { to: 'fixed', note: fix.note, control, photoIds: fix.photoIds, recordId: fix.id },
    }, now);
    await addPhotos(database, input.photos);
    return fix;
  });
}

/**
 * Verifies a fix or reopens the finding. Whoever marked it fixed cannot verify it (separation of
 * duties, an organisation setting on by default), checked here from the phone's fix record; the
 * server checks again. A reopening needs its reason: the foreman reads it.
 */
export async function recordVerification(database: PlummetDb, findingId: string, input: VerifyInput, actor: Actor, settings: OrganisationSettings, now = new Date()): Promise<VerificationRecord> {
  if (input.outcome === 'reopened' && !input.note.trim()) throw new FixLoopRefusal('Say why it is reopened: the foreman will read it.');
  const to = input.outcome === 'verified' ? 'verified' : 'open';
  return database.transaction('rw', [database.findings, database.scaffolds, database.fixes, database.verifications, database.photos, database.outbox], async () => {
    const finding = await checkedMove(database, findingId, to, actor);
    if (input.outcome === 'verified' && settings.verifierMustDifferFromFixer) {
      const fix = await latestFix(database, findingId);
      if (fix?.fixedBy === actor.userId) throw new FixLoopRefusal('You marked this finding fixed, so someone else must verify it.');
    }
    const verification: VerificationRecord = {
      id: input.recordId,
      findingId,
      verifiedBy: actor.userId,
      verifiedAt: now.toISOString(),
      outcome: input.outcome,
      note: input.note.trim(),
      photoIds: input.photos.map((p) => p.id),
    };
    await database.findings.put({ ...finding, state: to, updatedAt: now.toISOString() });
    await database.verifications.put(verification);
    await enqueueChange(database, findingId, {
      entity: 'finding',
      action: 'state',
      payload: { to, note: verification.note, photoIds: verification.photoIds, recordId: verification.id },
    }, now);
    await addPhotos(database, input.photos);
    return verification;
  });
}

/** A foreman returns a finding with a reason, for a manager to reassign. */
export async function handBackFinding(database: PlummetDb, findingId: string, input: { reason: HandBackReason; note: string }, actor: Actor, now = new Date()): Promise<FindingRecord> {
  return database.transaction('rw', [database.findings, database.scaffolds, database.outbox], async () => {
    const finding = await database.findings.get(findingId);
    if (!finding) throw new FixLoopRefusal('This finding is not on this phone.');
    if (actor.role !== 'foreman' || !(await inScope(database, finding, actor))) throw new FixLoopRefusal('Only the foreman it is given to can hand it back.');
    if (finding.state !== 'open' && finding.state !== 'made-safe') throw new FixLoopRefusal('Only a finding still to fix can be handed back.');
    const updated: FindingRecord = { ...finding, handBack: { reason: input.reason, note: input.note.trim(), by: actor.userId, at: now.toISOString() }, updatedAt: now.toISOString() };
    await database.findings.put(updated);
    await enqueueChange(database, findingId, { entity: 'finding', action: 'hand-back', payload: { reason: input.reason, note: input.note.trim() } }, now);
    return updated;
  });
}

/** Gives a finding to a foreman (or nobody), offline too; a new assignment clears an earlier hand back. */
export async function assignFinding(database: PlummetDb, findingId: string, assigneeId: string | null, now = new Date()): Promise<FindingRecord> {
  return database.transaction('rw', database.findings, database.outbox, async () => {
    const finding = await database.findings.get(findingId);
    if (!finding) throw new FixLoopRefusal('This finding is not on this phone.');
    const updated: FindingRecord = { ...finding, assigneeId, handBack: null, updatedAt: now.toISOString() };
    await database.findings.put(updated);
    await enqueueChange(database, findingId, { entity: 'finding', action: 'assign', payload: { assigneeId, dueAt: finding.dueAt } }, now);
    return updated;
  });
}
