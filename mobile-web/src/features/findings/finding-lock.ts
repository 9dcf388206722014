/**
 * When the finding editor is read-only, and where the work goes instead. The editor changes a
 * finding's details, which only inspectors do (the server refuses anyone else's edit); a signed
 * inspection is read-only, so its findings' details are kept as signed. Making safe and fixing go
 * through the fix loop whatever the inspection's state: the lock names that page, so a foreman (or
 * an inspector) is never left without a way to act on a finding of a signed inspection.
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
  const fixHref = `/fix-list/${findingId}`;
  if (role !== 'inspector') return { reason: 'Only inspectors change a finding’s details. Make it safe or record its fix from the fix list.', fixHref };
  if (inspectionSigned) {
    return { reason: 'This finding belongs to a signed inspection, so its details stay as signed. Make it safe or record its fix from the fix list.', fixHref };
  }
  return null;
}
