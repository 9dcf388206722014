import { PHOTO_STORED_MEDIA_TYPE, type Photo } from '@plummet/shared';
import type { PhotoRow } from './photos.repository.js';

/** Object keys by content: identical stored bytes are one object, whoever uploads them. */
export function photoObjectKeys(contentHash: string): { storageKey: string; thumbnailKey: string } {
  return { storageKey: `photos/${contentHash}.jpg`, thumbnailKey: `thumbs/${contentHash}.jpg` };
}

/** The one mapping from a photos row to the API's Photo. */
export function toPhoto(row: PhotoRow): Photo {
  return {
    id: row.id,
    ownerType: row.ownerType,
    ownerId: row.ownerId,
    contentHash: row.contentHash,
    sizeBytes: row.sizeBytes,
    mediaType: PHOTO_STORED_MEDIA_TYPE,
    width: row.width,
    height: row.height,
    takenAt: row.takenAt?.toISOString() ?? null,
    uploadedBy: row.uploadedBy,
    createdAt: row.createdAt.toISOString(),
    url: `/api/photos/${row.id}`,
    thumbnailUrl: `/api/photos/${row.id}/thumbnail`,
  };
}
