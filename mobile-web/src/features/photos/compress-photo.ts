/**
 * Photos are shrunk on the phone before they are stored: a 12-megapixel camera JPEG of 4–6 MB
 * becomes about 200–400 KB at 1600 px and quality 0.8, which keeps a day of findings within the
 * browser's storage and the later upload short on a weak signal. Canvas-based, no library.
 */

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

async function encodeJpeg(bitmap: ImageBitmap, width: number, height: number): Promise<Blob> {
  if (typeof OffscreenCanvas !== 'undefined') {
    const canvas = new OffscreenCanvas(width, height);
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw the photo.');
    context.drawImage(bitmap, 0, 0, width, height);
    return canvas.convertToBlob({ type: 'image/jpeg', quality: PHOTO_JPEG_QUALITY });
  }
  const canvas = document.createElement('canvas');
  canvas.width = width;
  canvas.height = height;
  const context = canvas.getContext('2d');
  if (!context) throw new Error('This browser cannot draw the photo.');
  context.drawImage(bitmap, 0, 0, width, height);
  return new Promise((resolve, reject) =>
    canvas.toBlob((blob) => (blob ? resolve(blob) : reject(new Error('The photo could not be encoded.'))), 'image/jpeg', PHOTO_JPEG_QUALITY),
  );
}

/** Decodes a camera file (EXIF orientation applied), scales it to 1600 px at most and re-encodes it as JPEG. */
export async function compressPhoto(file: Blob): Promise<CompressedPhoto> {
  let bitmap: ImageBitmap;
  try {
    bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
  } catch {
    throw new Error('That file could not be read as a photo. Try taking it again.');
  }
  try {
    const size = fitWithin(bitmap.width, bitmap.height);
    const blob = await encodeJpeg(bitmap, size.width, size.height);
    // A small JPEG straight from the camera can be smaller than its re-encoding: keep the smaller.
    if (file.type === 'image/jpeg' && size.width === bitmap.width && size.height === bitmap.height && file.size <= blob.size) {
      return { blob: file, ...size };
    }
    return { blob, ...size };
  } finally {
    bitmap.close();
  }
}
