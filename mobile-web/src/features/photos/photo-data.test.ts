import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { dropTestDatabases, freshDb } from '../../local-db/testing';
import { fitWithin, PHOTO_MAX_EDGE } from './compress-photo';
import { canStoreBlobs, photoBlob, restorePhoto, storablePhotoData } from './photo-data';

afterEach(dropTestDatabases);

const jpegBytes = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0xff, 0xd9]);

describe('photo storage', () => {
  it('keeps a Blob where the database accepts Blobs', async () => {
    const database = freshDb();
    expect(await canStoreBlobs(database)).toBe(true);
    const data = await storablePhotoData(database, new Blob([jpegBytes], { type: 'image/jpeg' }));
    expect(data).toBeInstanceOf(Blob);
    expect(await database.meta.count()).toBe(0); // the probe leaves nothing behind
  });

  it('falls back to the bytes as an ArrayBuffer where Blobs are refused, and reads either back as a Blob', async () => {
    const database = freshDb();
    const data = await storablePhotoData(database, new Blob([jpegBytes], { type: 'image/jpeg' }), false);
    expect(data).toBeInstanceOf(ArrayBuffer);
    await database.photos.add({ id: 'p-1', ownerType: 'finding', ownerId: 'f-1', mimeType: 'image/jpeg', data, sizeBytes: 8, width: 1, height: 1, createdAt: '2026-03-01T09:00:00.000Z' });

    const stored = restorePhoto(await database.photos.get('p-1'));
    const blob = photoBlob(stored!);
    expect(blob.type).toBe('image/jpeg');
    expect(new Uint8Array(await blob.arrayBuffer())).toEqual(jpegBytes);
  });

  it('refuses a stored photo without image data', () => {
    expect(restorePhoto({ id: 'p', ownerId: 'f', mimeType: 'image/jpeg', data: 'nope' })).toBeUndefined();
    expect(restorePhoto(null)).toBeUndefined();
  });

  it('shrinks a camera picture to 1600 px on its long edge and never enlarges a small one', () => {
    expect(fitWithin(4032, 3024)).toEqual({ width: PHOTO_MAX_EDGE, height: 1200 });
    expect(fitWithin(3024, 4032)).toEqual({ width: 1200, height: PHOTO_MAX_EDGE });
    expect(fitWithin(800, 600)).toEqual({ width: 800, height: 600 });
  });
});
