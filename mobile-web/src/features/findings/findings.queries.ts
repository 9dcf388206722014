import { useLiveQuery } from 'dexie-react-hooks';
import { db } from '../../local-db/db';
import type { FindingRecord } from '../../local-db/records';
import { findingsOfInspection, findingsOfScaffold, findingsOfSite, getFinding } from './findings.store';

export function useFindingsOfScaffold(scaffoldId: string | undefined): FindingRecord[] | undefined {
  return useLiveQuery(() => (scaffoldId ? findingsOfScaffold(db, scaffoldId) : []), [scaffoldId]);
}

export function useFindingsOfInspection(inspectionId: string | undefined): FindingRecord[] | undefined {
  return useLiveQuery(() => (inspectionId ? findingsOfInspection(db, inspectionId) : []), [inspectionId]);
}

export function useFindingsOfSite(siteId: string | undefined): FindingRecord[] | undefined {
  return useLiveQuery(() => (siteId ? findingsOfSite(db, siteId) : []), [siteId]);
}

/** One finding: undefined while loading, null when it is not on the phone (or not readable). */
export function useFinding(findingId: string | undefined): FindingRecord | null | undefined {
  return useLiveQuery(async () => (findingId ? ((await getFinding(db, findingId)) ?? null) : null), [findingId]);
}
