import { index, integer, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { createdAt, syncStampColumns } from './columns.js';
import { organisations } from './organisations.table.js';
import { users } from './users.table.js';

export const photoOwnerEnum = pgEnum('photo_owner', ['finding', 'control-check', 'fix', 'verification']);

/**
 * Photo metadata; the bytes live in object storage keyed by content hash (one object per hash).
 * The id is generated on the phone so a retried upload is idempotent.
 */
export const photos = pgTable(
  'photos',
  {
    id: uuid('id').primaryKey(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    ownerType: photoOwnerEnum('owner_type').notNull(),
    ownerId: uuid('owner_id').notNull(),
    contentHash: text('content_hash').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    mediaType: text('media_type').notNull(),
    width: integer('width'),
    height: integer('height'),
    storageKey: text('storage_key').notNull(),
    thumbnailKey: text('thumbnail_key').notNull(),
    takenAt: timestamp('taken_at', { withTimezone: true }),
    uploadedBy: uuid('uploaded_by').notNull().references(() => users.id),
    createdAt: createdAt(),
    ...syncStampColumns(),
  },
  (t) => [
    index('photos_owner_idx').on(t.ownerType, t.ownerId),
    index('photos_hash_idx').on(t.contentHash),
    index('photos_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq),
  ],
);
