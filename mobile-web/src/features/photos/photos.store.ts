import type { PhotoOwnerType } from '@plummet/shared';
import type { PlummetDb } from '../../local-db/db';
import { enqueueChange } from '../../local-db/outbox';
import type { PhotoRecord } from '../../local-db/records';
import type { CompressedPhoto } from './compress-photo';
import { restorePhoto, storablePhotoData } from './photo-data';

/** A photo taken in a form that has not been saved yet (kept in memory until Save). */
export interface PendingPhoto extends CompressedPhoto {
  id: string;
  takenAt: string;
}

/**
 * Turns pending photos into records for `owner`. Runs before the save transaction: reading a
 * Blob's bytes is not an IndexedDB request and would end a Dexie transaction early.
 */
export async function preparePhotoRecords(
  database: PlummetDb,
  pending: readonly PendingPhoto[],
  owner: { ownerType: PhotoOwnerType; ownerId: string },
): Promise<PhotoRecord[]> {
  return Promise.all(
    pending.map(async (photo) => ({
      id: photo.id,
      ownerType: owner.ownerType,
      ownerId: owner.ownerId,
      mimeType: photo.blob.type || 'image/jpeg',
      data: await storablePhotoData(database, photo.blob),
      sizeBytes: photo.blob.size,
      width: photo.width,
      height: photo.height,
      createdAt: photo.takenAt,
    })),
  );
}

/** Stores photos and their upload entries. Call inside a transaction with photos and outbox. */
export async function addPhotos(database: PlummetDb, photos: readonly PhotoRecord[]): Promise<void> {
  for (const photo of photos) {
    await database.photos.add(photo);
    await enqueueChange(database, photo.id, {
      entity: 'photo',
      action: 'upload',
      payload: { id: photo.id, ownerType: photo.ownerType, ownerId: photo.ownerId, takenAt: photo.createdAt },
    });
  }
}

export async function photosOf(database: PlummetDb, ownerType: PhotoOwnerType, ownerId: string): Promise<PhotoRecord[]> {
  const rows = await database.photos.where('[ownerType+ownerId]').equals([ownerType, ownerId]).toArray();
  return rows
    .map(restorePhoto)
    .filter((photo): photo is PhotoRecord => photo !== undefined)
    .sort((a, b) => a.createdAt.localeCompare(b.createdAt));
}

/**
 * Removes a photo that has not been uploaded yet, with its waiting upload. An uploaded photo
 * stays: removing it from the server is the sync's business.
 */
export async function removeWaitingPhoto(database: PlummetDb, photoId: string): Promise<boolean> {
  return database.transaction('rw', database.photos, database.outbox, async () => {
    const photo = await database.photos.get(photoId);
    if (!photo || photo.uploadedAt) return false;
    await database.photos.delete(photoId);
    await database.outbox.where('[entity+entityId]').equals(['photo', photoId]).delete();
    return true;
  });
}
