import type { OrganisationSettings } from '@plummet/shared';
import { useLiveQuery } from 'dexie-react-hooks';
import { db } from '../../local-db/db';
import type { FindingRecord, FixRecord, ScaffoldRecord, SiteRecord, VerificationRecord } from '../../local-db/records';
import { buildFixList, buildToVerify, type FixListEntry, type ToVerifyEntry } from './fix-loop-rules';

/* The organisation's settings, which the fix list needs, are read in organisation-settings.queries.ts. */

async function scaffoldsById(): Promise<Map<string, ScaffoldRecord>> {
  return new Map((await db.scaffolds.toArray()).map((scaffold) => [scaffold.id, scaffold]));
}

export function useSitesById(): Map<string, SiteRecord> | undefined {
  return useLiveQuery(async () => new Map((await db.sites.toArray()).map((site) => [site.id, site])), []);
}

/** The foreman's fix list, live from the phone's database. `now` is read when the data changes. */
export function useFixList(userId: string | undefined, settings: OrganisationSettings): FixListEntry[] | undefined {
  return useLiveQuery(async () => {
    if (!userId) return [];
    const [findings, scaffolds] = await Promise.all([db.findings.where('state').anyOf('open', 'made-safe').toArray(), scaffoldsById()]);
    return buildFixList(findings, scaffolds, userId, settings, new Date());
  }, [userId, settings]);
}

/** The inspector's to-verify list. */
export function useToVerify(): ToVerifyEntry[] | undefined {
  return useLiveQuery(async () => {
    const findings = await db.findings.where('state').equals('fixed').toArray();
    const fixes = await db.fixes.where('findingId').anyOf(findings.map((f) => f.id)).toArray();
    return buildToVerify(findings, fixes);
  }, []);
}

/** A finding's fixes and verifications on this phone, oldest first. */
export function useFixHistory(findingId: string | undefined): { fixes: FixRecord[]; verifications: VerificationRecord[] } | undefined {
  return useLiveQuery(async () => {
    if (!findingId) return { fixes: [], verifications: [] };
    const [fixes, verifications] = await Promise.all([
      db.fixes.where('findingId').equals(findingId).sortBy('fixedAt'),
      db.verifications.where('findingId').equals(findingId).sortBy('verifiedAt'),
    ]);
    return { fixes, verifications };
  }, [findingId]);
}

/** Every finding of the scaffolds in a foreman's area (for the shift start), with those scaffolds. */
export function useShiftScaffolds(userId: string | undefined): { scaffolds: ScaffoldRecord[]; findings: FindingRecord[] } | undefined {
  return useLiveQuery(async () => {
    if (!userId) return { scaffolds: [], findings: [] };
    const assigned = await db.findings.where('assigneeId').equals(userId).toArray();
    const all = await db.scaffolds.toArray();
    const ids = new Set([...all.filter((s) => s.foremanId === userId).map((s) => s.id), ...assigned.map((f) => f.scaffoldId)]);
    const scaffolds = all.filter((s) => ids.has(s.id)).sort((a, b) => a.reference.localeCompare(b.reference));
    const findings = await db.findings.where('scaffoldId').anyOf([...ids]).toArray();
    return { scaffolds, findings: findings.filter((f) => f.state === 'open' || f.state === 'made-safe') };
  }, [userId]);
}
