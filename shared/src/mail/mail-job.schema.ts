import { z } from 'zod';

/** A queued e-mail that kept failing after its retries (`GET /api/mail-jobs/failed`, admins). */
export const MailJobSchema = z.object({
  id: z.string(),
  kind: z.enum(['inspection-report', 'finding-assignment', 'daily-digest']),
  /** The inspection or finding the e-mail is about. */
  recordId: z.string().nullable(),
  /** The e-mail's subject as it would be sent now; null when its record is gone. */
  subject: z.string().nullable(),
  /** Who it goes to (To and Cc). */
  recipients: z.array(z.string()),
  attempts: z.number().int(),
  createdAt: z.string(),
  failedAt: z.string().nullable(),
  error: z.string().nullable(),
});
export type MailJob = z.infer<typeof MailJobSchema>;

export const MailJobListResponseSchema = z.object({ items: z.array(MailJobSchema) });
export type MailJobListResponse = z.infer<typeof MailJobListResponseSchema>;

/** `POST /api/inspections/:id/report/send` answers 202 with the queued job's id. */
export const ReportSendResponseSchema = z.object({ jobId: z.string() });
export type ReportSendResponse = z.infer<typeof ReportSendResponseSchema>;
