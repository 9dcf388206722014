import { z } from 'zod';

/** What a photo can belong to: the hazard, a ticked control, the proof of a fix, or a verification. */
export const PHOTO_OWNER_TYPES = ['finding', 'control-check', 'fix', 'verification'] as const;
export const PhotoOwnerTypeSchema = z.enum(PHOTO_OWNER_TYPES);
export type PhotoOwnerType = z.infer<typeof PhotoOwnerTypeSchema>;

/** Image types the server accepts, told apart by the file's bytes (HEIC only where the server can decode it). */
export const PHOTO_ACCEPTED_MEDIA_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif'] as const;

/** Every stored photo is re-encoded to this type. */
export const PHOTO_STORED_MEDIA_TYPE = 'image/jpeg';

/** Long edge of the stored photo and of its thumbnail, in pixels. */
export const PHOTO_MAX_EDGE_PX = 2560;
export const PHOTO_THUMBNAIL_EDGE_PX = 320;

const EARLIEST_TAKEN_AT = Date.UTC(2000, 0, 1);
const ONE_DAY_MS = 86_400_000;

/**
 * The text fields of `POST /api/photos` (multipart/form-data; the image itself is the `file` part).
 * `id` is generated on the phone so that a retried upload stores nothing twice.
 */
export const PhotoUploadSchema = z.object({
  id: z.uuid(),
  ownerType: PhotoOwnerTypeSchema,
  ownerId: z.uuid(),
  /** When the camera took it (ISO 8601 with offset); a phone clock may be off, but not by years. */
  takenAt: z.iso
    .datetime({ offset: true })
    .refine((v) => {
      const t = Date.parse(v);
      return t >= EARLIEST_TAKEN_AT && t <= Date.now() + ONE_DAY_MS;
    }, 'takenAt must lie between 2000-01-01 and tomorrow')
    .optional(),
});
export type PhotoUpload = z.infer<typeof PhotoUploadSchema>;

/** `GET /api/photos?ownerType=&ownerId=`: the photos of one owner. */
export const PhotoListQuerySchema = z.object({
  ownerType: PhotoOwnerTypeSchema,
  ownerId: z.uuid(),
});
export type PhotoListQuery = z.infer<typeof PhotoListQuerySchema>;

/** Path parameters of `/api/photos/:id…`. */
export const PhotoIdParamsSchema = z.object({ id: z.uuid() });

/** A photo's metadata; the bytes are at `url` and `thumbnailUrl` (same organisation only). */
export const PhotoSchema = z.object({
  id: z.uuid(),
  ownerType: PhotoOwnerTypeSchema,
  ownerId: z.uuid(),
  /** sha256 of the stored JPEG, hex; also the ETag of `url`. */
  contentHash: z.string().regex(/^[0-9a-f]{64}$/),
  sizeBytes: z.number().int().nonnegative(),
  mediaType: z.literal(PHOTO_STORED_MEDIA_TYPE),
  width: z.number().int().positive().nullable(),
  height: z.number().int().positive().nullable(),
  takenAt: z.iso.datetime({ offset: true }).nullable(),
  uploadedBy: z.uuid(),
  createdAt: z.iso.datetime({ offset: true }),
  url: z.string(),
  thumbnailUrl: z.string(),
});
export type Photo = z.infer<typeof PhotoSchema>;

export const PhotoListSchema = z.object({ items: z.array(PhotoSchema) });
export type PhotoList = z.infer<typeof PhotoListSchema>;
