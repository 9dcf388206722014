import type { PlummetDb } from '../../local-db/db';
import type { PhotoRecord } from '../../local-db/records';

const PROBE_KEY = 'blob-storage-probe';
const probes = new WeakMap<PlummetDb, Promise<boolean>>();

/**
 * Whether this browser's IndexedDB keeps Blobs (some older WebKit builds refuse them, or hand
 * back an unreadable one). Asked once per database by storing a tiny Blob and reading it back.
 */
export function canStoreBlobs(database: PlummetDb): Promise<boolean> {
  let probe = probes.get(database);
  if (!probe) {
    probe = (async () => {
      try {
        await database.meta.put({ key: PROBE_KEY, value: new Blob(['ok'], { type: 'text/plain' }) });
        const back = (await database.meta.get(PROBE_KEY))?.value;
        await database.meta.delete(PROBE_KEY);
        return back instanceof Blob && (await back.text()) === 'ok';
      } catch {
        return false;
      }
    })();
    probes.set(database, probe);
  }
  return probe;
}

/** What to store for a photo: the Blob itself, or its bytes where Blobs are refused. */
export async function storablePhotoData(database: PlummetDb, blob: Blob, blobsWork?: boolean): Promise<Blob | ArrayBuffer> {
  const useBlob = blobsWork ?? (await canStoreBlobs(database));
  return useBlob ? blob : blob.arrayBuffer();
}

/** The stored photo as a Blob, whichever way it was kept. */
export function photoBlob(photo: Pick<PhotoRecord, 'data' | 'mimeType'>): Blob {
  return photo.data instanceof Blob ? photo.data : new Blob([photo.data], { type: photo.mimeType });
}

/** A photo read back from the database, or undefined when it is not a usable one. */
export function restorePhoto(value: unknown): PhotoRecord | undefined {
  if (typeof value !== 'object' || value === null) return undefined;
  const photo = value as Partial<PhotoRecord>;
  const hasData = photo.data instanceof Blob || photo.data instanceof ArrayBuffer;
  if (typeof photo.id !== 'string' || typeof photo.ownerId !== 'string' || !hasData || typeof photo.mimeType !== 'string') return undefined;
  return photo as PhotoRecord;
}
