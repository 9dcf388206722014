import { createHash } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { PHOTO_ACCEPTED_MEDIA_TYPES, PHOTO_MAX_EDGE_PX, PHOTO_THUMBNAIL_EDGE_PX } from '@plummet/shared';
import { AppError, ErrorCode } from '../common/app-error.js';

/**
 * Decoded size above which an upload is refused before it is decoded (a small file can decode to
 * a huge bitmap: 40 MP of RGBA is 160 MB). 40 megapixels is above what phone cameras store by
 * default; larger sensors' full-resolution modes are refused with their own code.
 */
export const MAX_INPUT_PIXELS = 40_000_000;
const PHOTO_JPEG_QUALITY = 85;
const THUMBNAIL_JPEG_QUALITY = 75;

export interface ProcessedPhoto {
  /** The stored JPEG: upright, at most PHOTO_MAX_EDGE_PX on its long edge. */
  photo: Buffer;
  thumbnail: Buffer;
  width: number;
  height: number;
  /** sha256 of `photo`, hex. */
  contentHash: string;
}

/** The media type told by the file's own bytes (never its name or the part's header). */
export async function detectImageType(bytes: Buffer): Promise<string> {
  const detected = await fileTypeFromBuffer(bytes);
  const mime = detected?.mime;
  if (!mime || !(PHOTO_ACCEPTED_MEDIA_TYPES as readonly string[]).includes(mime)) {
    throw new AppError(
      ErrorCode.UnsupportedMediaType,
      `The file is not a JPEG, PNG, WebP or HEIC image${mime ? ` (it is ${mime})` : ''}`,
    );
  }
  return mime;
}

function undecodable(mime: string, error: unknown): AppError {
  const message = error instanceof Error ? error.message : String(error);
  if (/pixel limit/i.test(message)) {
    return new AppError(ErrorCode.ImageTooLarge, `The image has too many pixels (limit ${MAX_INPUT_PIXELS / 1_000_000} megapixels)`);
  }
  if (mime === 'image/heic' || mime === 'image/heif') {
    return new AppError(
      ErrorCode.UnsupportedMediaType,
      'This HEIC image cannot be read by the server; send it as JPEG (the camera\'s "most compatible" format)',
    );
  }
  return new AppError(ErrorCode.UnsupportedMediaType, 'The image is damaged or cannot be read');
}

/**
 * Turns an upload into what is stored: turned upright by its EXIF orientation, no larger than
 * PHOTO_MAX_EDGE_PX, re-encoded to JPEG. Every metadata block (EXIF with GPS position, XMP,
 * IPTC, ICC) is dropped, unless `keepLocation`, when the EXIF block (GPS included) is kept.
 * The thumbnail is made from the stored JPEG and never carries metadata.
 */
export async function processPhoto(input: Buffer, mime: string, options: { keepLocation: boolean }): Promise<ProcessedPhoto> {
  try {
    const pipeline = sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' })
      .rotate()
      .resize({ width: PHOTO_MAX_EDGE_PX, height: PHOTO_MAX_EDGE_PX, fit: 'inside', withoutEnlargement: true });
    if (options.keepLocation) pipeline.keepExif();
    const { data: photo, info } = await pipeline.jpeg({ quality: PHOTO_JPEG_QUALITY }).toBuffer({ resolveWithObject: true });
    const thumbnail = await sharp(photo)
      .resize({ width: PHOTO_THUMBNAIL_EDGE_PX, height: PHOTO_THUMBNAIL_EDGE_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: THUMBNAIL_JPEG_QUALITY })
      .toBuffer();
    return {
      photo,
      thumbnail,
      width: info.width,
      height: info.height,
      contentHash: createHash('sha256').update(photo).digest('hex'),
    };
  } catch (error) {
    throw undecodable(mime, error);
  }
}
