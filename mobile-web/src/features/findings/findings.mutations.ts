import { useMutation } from '@tanstack/react-query';
import { db } from '../../local-db/db';
import type { FindingRecord } from '../../local-db/records';
import { preparePhotoRecords, type PendingPhoto } from '../photos/photos.store';
import { saveFinding } from './findings.store';

export function useSaveFindingMutation() {
  return useMutation({
    mutationFn: async ({ finding, photos }: { finding: FindingRecord; photos: readonly PendingPhoto[] }) => {
      const records = await preparePhotoRecords(db, photos, { ownerType: 'finding', ownerId: finding.id });
      await saveFinding(db, finding, records);
      return finding;
    },
    meta: { errorToast: 'The finding could not be saved on this phone. Nothing was lost from the form; try Save again.' },
  });
}
