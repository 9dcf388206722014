/**
 * Photos are shrunk on the phone before they are stored: a 12-megapixel camera JPEG of 4–6 MB
 * becomes about 200–400 KB at 1600 px and quality 0.8, which keeps a day of findings within the
 * browser's storage and the later upload short on a weak signal. browser-image-compression does
 * the work in a web worker, so the screen stays responsive while a large photo is re-encoded.
 */
import imageCompression from 'browser-image-compression';
// The worker loads the library by URL; serve our own copy (precached, works offline) rather than a CDN's.
import libraryUrl from 'browser-image-compression/dist/browser-image-compression.js?url';

/** Longest edge of a stored photo, px. */
export const PHOTO_MAX_EDGE = 1600;
/** JPEG quality of a stored photo (0–1). */
export const PHOTO_JPEG_QUALITY = 0.8;

export interface CompressedPhoto {
  blob: Blob;
  width: number;
  height: number;
}

/** The size that fits within `maxEdge` on the longer side, keeping the aspect ratio; never enlarges. */
export function fitWithin(width: number, height: number, maxEdge: number = PHOTO_MAX_EDGE): { width: number; height: number } {
  const scale = Math.min(1, maxEdge / Math.max(width, height));
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}

async function sizeOf(blob: Blob): Promise<{ width: number; height: number }> {
  const bitmap = await createImageBitmap(blob);
  try {
    return { width: bitmap.width, height: bitmap.height };
  } finally {
    bitmap.close();
  }
}

/** Decodes a camera file (EXIF orientation applied), scales it to 1600 px at most and re-encodes it as JPEG. */
export async function compressPhoto(file: Blob): Promise<CompressedPhoto> {
  const asFile = file instanceof File ? file : new File([file], 'photo', { type: file.type });
  let blob: Blob;
  try {
    blob = await imageCompression(asFile, {
      maxWidthOrHeight: PHOTO_MAX_EDGE,
      initialQuality: PHOTO_JPEG_QUALITY,
      fileType: 'image/jpeg',
      useWebWorker: true,
      libURL: new URL(libraryUrl, location.href).href,
      // No size target: one pass at the chosen quality, as before.
      maxIteration: 1,
    });
  } catch {
    throw new Error('That file could not be read as a photo. Try taking it again.');
  }
  // The library hands back the original when it is already small enough and re-encoding would not help.
  return { blob, ...(await sizeOf(blob)) };
}
