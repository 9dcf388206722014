/**
 * The fix loop's rules on the phone, as pure functions over what Dexie holds: who sees which
 * finding, in which order, when it is due, and whether a proof photo is needed.
 */
import { describeDue, fixDueAt, type DueWords, type FindingControl, type OrganisationSettings } from '@plummet/shared';
import type { PlummetDb } from '../../local-db/db';
import type { FindingRecord, FixRecord, ScaffoldRecord } from '../../local-db/records';

/** A refusal worded for the person holding the phone (shown as it is). */
export class FixLoopRefusal extends Error {
  override readonly name = 'FixLoopRefusal';
}

const BAND_RANK: Record<FindingRecord['riskBand'], number> = { High: 0, Medium: 1, Low: 2 };

/** A High finding needs a proof photo to be made safe or fixed when the organisation asks for one. */
export const proofPhotoRequired = (finding: Pick<FindingRecord, 'riskBand'>, settings: Pick<OrganisationSettings, 'proofPhotoRequiredForHigh'>): boolean =>
  finding.riskBand === 'High' && settings.proofPhotoRequiredForHigh;

/**
 * When the permanent fix is due: the server's due time when it sent one, otherwise computed here
 * from the band and the organisation's hours (Low: the scaffold's next inspection).
 */
export function dueAtOf(finding: FindingRecord, scaffold: ScaffoldRecord | undefined, settings: OrganisationSettings): Date | null {
  if (finding.dueAt) return new Date(finding.dueAt);
  return fixDueAt(finding.riskBand, new Date(finding.createdAt), settings, scaffold?.nextDueAt ? new Date(scaffold.nextDueAt) : null);
}

/** One line of the fix list: the finding with its due time worked out. */
export interface FixListEntry {
  finding: FindingRecord;
  scaffold: ScaffoldRecord | undefined;
  dueAt: Date | null;
  due: DueWords;
}

/** Still to fix, not handed back, and the foreman's: assigned to them, or unassigned on a scaffold they look after. */
export function isOnFixList(finding: FindingRecord, scaffold: ScaffoldRecord | undefined, userId: string): boolean {
  if (finding.state !== 'open' && finding.state !== 'made-safe') return false;
  if (finding.handBack) return false;
  return finding.assigneeId === userId || (finding.assigneeId === null && scaffold?.foremanId === userId);
}

/** Band (High first), then due time (soonest first, none last), then height (highest first). */
export function fixOrder(a: FixListEntry, b: FixListEntry): number {
  const band = BAND_RANK[a.finding.riskBand] - BAND_RANK[b.finding.riskBand];
  if (band) return band;
  const dueA = a.dueAt?.getTime() ?? Number.POSITIVE_INFINITY;
  const dueB = b.dueAt?.getTime() ?? Number.POSITIVE_INFINITY;
  if (dueA !== dueB) return dueA < dueB ? -1 : 1;
  return b.finding.heightM - a.finding.heightM || a.finding.id.localeCompare(b.finding.id);
}

/** The foreman's fix list, ordered. */
export function buildFixList(findings: readonly FindingRecord[], scaffolds: ReadonlyMap<string, ScaffoldRecord>, userId: string, settings: OrganisationSettings, now: Date): FixListEntry[] {
  return findings
    .filter((finding) => isOnFixList(finding, scaffolds.get(finding.scaffoldId), userId))
    .map((finding) => {
      const scaffold = scaffolds.get(finding.scaffoldId);
      const dueAt = dueAtOf(finding, scaffold, settings);
      return { finding, scaffold, dueAt, due: describeDue(dueAt, now) };
    })
    .sort(fixOrder);
}

/** One line of the inspector's to-verify list: the finding and its latest fix (when on the phone). */
export interface ToVerifyEntry {
  finding: FindingRecord;
  fix: FixRecord | undefined;
}

const fixedAtOf = (entry: ToVerifyEntry) => entry.fix?.fixedAt ?? entry.finding.updatedAt;

/** Fixed findings waiting for a second pair of eyes: band (High first), then the oldest fix first. */
export function buildToVerify(findings: readonly FindingRecord[], fixes: readonly FixRecord[]): ToVerifyEntry[] {
  const latest = new Map<string, FixRecord>();
  for (const fix of fixes) {
    const seen = latest.get(fix.findingId);
    if (!seen || fix.fixedAt > seen.fixedAt) latest.set(fix.findingId, fix);
  }
  return findings
    .filter((finding) => finding.state === 'fixed')
    .map((finding) => ({ finding, fix: latest.get(finding.id) }))
    .sort((a, b) => BAND_RANK[a.finding.riskBand] - BAND_RANK[b.finding.riskBand] || fixedAtOf(a).localeCompare(fixedAtOf(b)));
}

/** The latest fix of a finding on this phone. */
export async function latestFix(database: PlummetDb, findingId: string): Promise<FixRecord | undefined> {
  const fixes = await database.fixes.where('findingId').equals(findingId).sortBy('fixedAt');
  return fixes.at(-1);
}

/**
 * Controls worth considering for a finding, best first along the usual hierarchy (remove, lower,
 * secure, contain, keep people away); common practice, no source. Alterations come last: they are
 * the scaffold contractor's work.
 */
export function suggestControls(finding: Pick<FindingRecord, 'exposure' | 'likelihoodAnswers'>): FindingControl[] {
  const { securing, edgeDistance } = finding.likelihoodAnswers;
  const out: FindingControl[] = ['remove', 'lower'];
  if (securing !== 'secured') out.push('tether');
  if (edgeDistance !== 'away') out.push('move-back');
  if (finding.exposure !== 'zone-closed') out.push('close-zone');
  if (edgeDistance === 'at-edge') out.push('fit-toe-board', 'fit-brick-guard', 'fit-netting');
  return out;
}
