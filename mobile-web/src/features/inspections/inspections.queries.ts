import { useLiveQuery } from 'dexie-react-hooks';
import { db } from '../../local-db/db';
import type { ControlCheckRecord, InspectionRecord } from '../../local-db/records';
import { controlChecksOf, inspectionInProgress } from './inspections.store';

/** One inspection: undefined while loading, null when it is not on the phone. */
export function useInspection(inspectionId: string | undefined): InspectionRecord | null | undefined {
  return useLiveQuery(async () => (inspectionId ? ((await db.inspections.get(inspectionId)) ?? null) : null), [inspectionId]);
}

/** The walk under way on a scaffold: undefined while loading, null when there is none. */
export function useInspectionInProgress(scaffoldId: string | undefined): InspectionRecord | null | undefined {
  return useLiveQuery(async () => (scaffoldId ? ((await inspectionInProgress(db, scaffoldId)) ?? null) : null), [scaffoldId]);
}

export function useControlChecks(inspectionId: string | undefined): ControlCheckRecord[] | undefined {
  return useLiveQuery(() => (inspectionId ? controlChecksOf(db, inspectionId) : []), [inspectionId]);
}
