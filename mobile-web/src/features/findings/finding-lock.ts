/**
 * When the finding editor is read-only, and where the work goes instead, by the server's rules
 * for finding commands (server/src/findings/finding-commands.ts): only inspectors change a
 * finding's details, whichever inspection it came from (a signed inspection is itself read-only,
 * but its findings are still corrected and followed up); no new finding goes into a signed
 * inspection. Making safe and fixing go through the fix loop whatever the inspection's state: a
 * lock names that page, so a foreman is never left without a way to act on a finding.
 */
import type { Role } from '@plummet/shared';

export interface FindingLock {
  reason: string;
  /** The fix loop's page for this finding (make safe, record the fix, verify). */
  fixHref: string;
}

export interface FindingLockInput {
  role: Role;
  /** The finding being opened; absent for a new one. */
  findingId?: string;
  /** Whether the inspection the finding belongs to (or is being recorded in) is signed. */
  inspectionSigned: boolean;
}

export function findingLock({ role, findingId, inspectionSigned }: FindingLockInput): FindingLock | null {
  if (!findingId) {
    return inspectionSigned ? { reason: 'This inspection is signed: record new findings in a new inspection.', fixHref: '/fix-list' } : null;
  }
  if (role !== 'inspector') {
    return { reason: 'Only inspectors change a finding’s details. Make it safe or record its fix from the fix list.', fixHref: `/fix-list/${findingId}` };
  }
  return null;
}
