import type { InspectionFinish } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { db } from '../../local-db/db';
import { newId } from '../../local-db/ids';
import { preparePhotoRecords, type PendingPhoto } from '../photos/photos.store';
import { finishInspection, recordControlCheck, startInspection, type ControlCheckAnswer, type InspectionStart } from './inspections.store';

export function useStartInspectionMutation() {
  return useMutation({
    mutationFn: (start: InspectionStart) => startInspection(db, start),
    meta: { errorToast: 'The inspection could not be started on this phone.' },
  });
}

export function useRecordControlCheckMutation() {
  return useMutation({
    mutationFn: async ({ answer, photos = [] }: { answer: ControlCheckAnswer; photos?: PendingPhoto[] }) => {
      const existing = await db.controlChecks.where('[inspectionId+control]').equals([answer.inspectionId, answer.control]).first();
      const id = existing?.id ?? answer.id ?? newId();
      const records = await preparePhotoRecords(db, photos, { ownerType: 'control-check', ownerId: id });
      return recordControlCheck(db, { ...answer, id }, records);
    },
    meta: { errorToast: 'The control check could not be saved on this phone.' },
  });
}

export function useFinishInspectionMutation() {
  return useMutation({
    mutationFn: ({ inspectionId, report }: { inspectionId: string; report: InspectionFinish }) => finishInspection(db, inspectionId, report),
    meta: { errorToast: false },
  });
}
