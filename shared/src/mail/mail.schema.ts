import { z } from 'zod';
import { listResponseSchema } from '../common/list.schema.js';

/** A message captured by the local SMTP fake (development aid; `GET /api/mail`). */
export const MailMessageSchema = z.object({
  /** File name in the fake's folder; `GET /api/mail/:name` returns the raw message. */
  name: z.string(),
  subject: z.string(),
  to: z.string(),
  date: z.string().nullable(),
});
export type MailMessage = z.infer<typeof MailMessageSchema>;

/** Newest first; `cursor` is the previous page's `nextCursor`. */
export const MailListQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(20),
  cursor: z.string().min(1).max(1000).optional(),
});
export type MailListQuery = z.infer<typeof MailListQuerySchema>;

export const MailListResponseSchema = listResponseSchema(MailMessageSchema);
export type MailListResponse = z.infer<typeof MailListResponseSchema>;

/** One captured message opened in the viewer: its parts and the attachments it carries. */
export const MailMessageViewSchema = MailMessageSchema.extend({
  cc: z.string(),
  text: z.string(),
  /** The HTML part with inline images as data: URLs; `GET /api/mail/:name/html` serves it to render. */
  html: z.string().nullable(),
  attachments: z.array(z.object({ filename: z.string().nullable(), contentType: z.string(), size: z.number().int(), inline: z.boolean() })),
});
export type MailMessageView = z.infer<typeof MailMessageViewSchema>;
