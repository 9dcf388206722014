import { Injectable, Logger } from '@nestjs/common';
import { PHOTO_STORED_MEDIA_TYPE, type Photo, type PhotoListQuery, type PhotoOwnerType, type PhotoUpload } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { scopedForeman } from '../common/foreman-scope.js';
import { ObjectStorage, type StoredObject } from '../storage/object-storage.service.js';
import { keepsPhotoLocation, mayAttachPhoto, mayDeletePhoto } from './photo-access.js';
import { detectImageType, processPhoto } from './photo-image.js';
import { photoObjectKeys, toPhoto } from './photo.mapper.js';
import { type PhotoOwnerRow, type PhotoRow, PhotosRepository } from './photos.repository.js';

/** The part of a multer file the service reads. */
export interface UploadedImage {
  buffer: Buffer;
}

export type PhotoVariant = 'photo' | 'thumbnail';

const OWNER_NAMES: Record<PhotoOwnerType, string> = {
  finding: 'Finding',
  'control-check': 'Control check',
  fix: 'Fix',
  verification: 'Verification',
};

@Injectable()
export class PhotosService {
  private readonly logger = new Logger(PhotosService.name);

  constructor(
    private readonly photos: PhotosRepository,
    private readonly storage: ObjectStorage,
  ) {}

  /**
   * Stores a photo once: a repeated id answers with the first upload (`created: false`), identical
   * bytes share one object. The objects are written before the row, outside the transaction; if
   * the row cannot be written, the objects stay (content-addressed, so a later upload reuses them).
   */
  async upload(user: AuthUser, fields: PhotoUpload, file: UploadedImage | undefined): Promise<{ photo: Photo; created: boolean }> {
    if (!file) {
      throw new AppError(ErrorCode.ValidationFailed, 'Attach the image as the "file" part', [
        { path: ['file'], code: 'invalid_type', message: 'Required' },
      ]);
    }
    await this.attachableOwner(user, fields.ownerType, fields.ownerId);
    const earlier = await this.photos.findByIdForUpload(user.organisationId, fields.id);
    if (earlier) return { photo: this.replay(user, fields, earlier), created: false };

    const mime = await detectImageType(file.buffer);
    const keepLocation = keepsPhotoLocation(await this.photos.organisationSettings(user.organisationId));
    const image = await processPhoto(file.buffer, mime, { keepLocation });
    const keys = photoObjectKeys(image.contentHash);

    // The objects go first and outside any transaction: a slow or stalled store then holds no
    // database connection and no lock, and a row never points at an object that was not written.
    await this.storeObjects(keys, image);
    const inserted = await this.photos.transaction(async (tx) => {
      await this.photos.lockContent(image.contentHash, tx);
      const row = await this.photos.insertIfAbsent(
        {
          id: fields.id,
          organisationId: user.organisationId,
          ownerType: fields.ownerType,
          ownerId: fields.ownerId,
          contentHash: image.contentHash,
          sizeBytes: image.photo.length,
          mediaType: PHOTO_STORED_MEDIA_TYPE,
          width: image.width,
          height: image.height,
          ...keys,
          takenAt: fields.takenAt ? new Date(fields.takenAt) : null,
          uploadedBy: user.userId,
        },
        tx,
      );
      if (row) {
        const after = toPhoto(row);
        await this.photos.insertAudit(
          { organisationId: user.organisationId, actorId: user.userId, entityId: row.id, action: 'create', before: null, after },
          tx,
        );
      }
      return row;
    });
    // A photo with the same bytes deleted meanwhile may have taken the shared objects with it:
    // writing them again when missing (a HEAD when present) keeps this row whole.
    if (inserted) {
      await this.storeObjects(keys, image).catch((error: unknown) => {
        this.logger.warn(`photo ${inserted.id}: could not re-check its objects after commit (${String(error)})`);
      });
    }
    if (inserted) return { photo: toPhoto(inserted), created: true };
    // A concurrent upload of the same id committed first: answer as for a retry.
    const winner = await this.photos.findByIdForUpload(user.organisationId, fields.id);
    if (!winner) throw new AppError(ErrorCode.Conflict, 'The photo was removed while it was being uploaded');
    return { photo: this.replay(user, fields, winner), created: false };
  }

  async list(user: AuthUser, query: PhotoListQuery): Promise<Photo[]> {
    await this.owner(user, query.ownerType, query.ownerId);
    const rows = await this.photos.listByOwner(user.organisationId, query.ownerType, query.ownerId, scopedForeman(user));
    return rows.map(toPhoto);
  }

  /** The photo's row in the caller's organisation; 404 for an unknown or another organisation's id. */
  async get(user: AuthUser, id: string): Promise<PhotoRow> {
    const row = await this.photos.findById(user.organisationId, id, undefined, scopedForeman(user));
    if (!row) throw AppError.notFound('Photo');
    return row;
  }

  async openObject(row: PhotoRow, variant: PhotoVariant): Promise<StoredObject> {
    const key = variant === 'photo' ? row.storageKey : row.thumbnailKey;
    const object = await this.storage.get(key);
    if (!object) {
      this.logger.error(`photo ${row.id}: object ${key} is missing from storage`);
      throw new AppError(ErrorCode.NotFound, 'The image of this photo is missing from storage');
    }
    return object;
  }

  /**
   * Deletes the row (and its audit event) and then, when no row of any organisation still points
   * at the same content, the objects. A failed object removal leaves an unreferenced object,
   * never a broken row.
   */
  async remove(user: AuthUser, id: string): Promise<void> {
    const row = await this.get(user, id);
    if (!mayDeletePhoto(user, row.uploadedBy)) {
      throw new AppError(ErrorCode.Forbidden, 'Only the uploader, a manager or an admin can delete this photo');
    }
    const orphaned = await this.photos.transaction(async (tx) => {
      await this.photos.lockContent(row.contentHash, tx);
      const deleted = await this.photos.delete(user.organisationId, id, tx);
      if (!deleted) throw AppError.notFound('Photo');
      await this.photos.insertAudit(
        { organisationId: user.organisationId, actorId: user.userId, entityId: id, action: 'delete', before: toPhoto(deleted), after: null },
        tx,
      );
      return (await this.photos.contentInUse(deleted.contentHash, tx)) ? null : deleted;
    });
    // After the commit, never inside the transaction: the store may be slow. An upload of the same
    // bytes racing with this removal writes the objects again after its own commit.
    if (!orphaned) return;
    for (const key of [orphaned.storageKey, orphaned.thumbnailKey]) {
      await this.storage.remove(key).catch((error: unknown) => {
        this.logger.warn(`photo ${id}: object ${key} left in storage (${String(error)})`);
      });
    }
  }

  private async storeObjects(keys: { storageKey: string; thumbnailKey: string }, image: { photo: Buffer; thumbnail: Buffer }): Promise<void> {
    await this.storage.putIfAbsent(keys.storageKey, image.photo, PHOTO_STORED_MEDIA_TYPE);
    await this.storage.putIfAbsent(keys.thumbnailKey, image.thumbnail, PHOTO_STORED_MEDIA_TYPE);
  }

  private async owner(user: AuthUser, ownerType: PhotoOwnerType, ownerId: string): Promise<PhotoOwnerRow> {
    const owner = await this.photos.findOwner(user.organisationId, ownerType, ownerId);
    if (!owner) throw AppError.notFound(OWNER_NAMES[ownerType]);
    return owner;
  }

  private async attachableOwner(user: AuthUser, ownerType: PhotoOwnerType, ownerId: string): Promise<void> {
    const owner = await this.owner(user, ownerType, ownerId);
    if (!mayAttachPhoto(user, ownerType, owner)) {
      throw new AppError(ErrorCode.Forbidden, `Your role does not allow adding photos to this ${OWNER_NAMES[ownerType].toLowerCase()}`);
    }
  }

  /** The same id again: the first upload if it went to the same owner, else a conflict. */
  private replay(user: AuthUser, fields: PhotoUpload, earlier: PhotoRow | 'taken'): Photo {
    const sameOwner =
      earlier !== 'taken' &&
      earlier.organisationId === user.organisationId && earlier.ownerType === fields.ownerType && earlier.ownerId === fields.ownerId;
    if (!sameOwner) throw new AppError(ErrorCode.Conflict, 'A photo with this id is already attached to another record');
    return toPhoto(earlier);
  }
}
