import type { PhotoOwnerType } from '@plummet/shared';
import { useLiveQuery } from 'dexie-react-hooks';
import { db } from '../../local-db/db';
import type { PhotoRecord } from '../../local-db/records';
import { photosOf } from './photos.store';

export function usePhotos(ownerType: PhotoOwnerType, ownerId: string | undefined): PhotoRecord[] | undefined {
  return useLiveQuery(() => (ownerId ? photosOf(db, ownerType, ownerId) : []), [ownerType, ownerId]);
}
