import { Inject, Injectable } from '@nestjs/common';
import { sql } from 'drizzle-orm';
import type { MailJob } from '@plummet/shared';
import { DRIZZLE, type Db } from '../../db/db.tokens.js';
import { MAIL_QUEUES } from './job-schema.js';

const KIND: Record<string, MailJob['kind']> = {
  [MAIL_QUEUES.report]: 'inspection-report',
  [MAIL_QUEUES.assignment]: 'finding-assignment',
  [MAIL_QUEUES.digest]: 'daily-digest',
};

interface FailedRow {
  id: string;
  name: string;
  record_id: string | null;
  data: Record<string, unknown> | null;
  retry_count: number;
  created_on: Date;
  completed_on: Date | null;
  output: unknown;
}

/** A failed job as stored, with the job's data (for the service to say what the e-mail was). */
export type FailedJobRow = Omit<MailJob, 'subject' | 'recipients'> & { queue: string; data: Record<string, unknown> };

/** Reads pg-boss's job table for the organisation's failed mail jobs (pg-boss has no listing API). */
@Injectable()
export class FailedMailJobsRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async list(organisationId: string, jobId?: string): Promise<FailedJobRow[]> {
    const result = await this.db.execute(sql`
      select j.id::text as id, j.name, coalesce(j.data->>'inspectionId', j.data->>'findingId') as record_id,
             j.data, j.retry_count, j.created_on, j.completed_on, j.output
      from pgboss.job j
      left join inspections i on j.name = ${MAIL_QUEUES.report} and i.id::text = j.data->>'inspectionId'
      left join findings f on j.name = ${MAIL_QUEUES.assignment} and f.id::text = j.data->>'findingId'
      where j.state = 'failed'
        and j.name in (${MAIL_QUEUES.report}, ${MAIL_QUEUES.assignment}, ${MAIL_QUEUES.digest})
        and coalesce(i.organisation_id::text, f.organisation_id::text, case when j.name = ${MAIL_QUEUES.digest} then j.data->>'organisationId' end) = ${organisationId}
        ${jobId ? sql`and j.id::text = ${jobId}` : sql``}
      order by j.completed_on desc nulls last
      limit 100`);
    return (result.rows as unknown as FailedRow[]).map((r) => ({
      id: r.id,
      queue: r.name,
      data: r.data ?? {},
      kind: KIND[r.name] ?? 'inspection-report',
      recordId: r.record_id,
      attempts: Number(r.retry_count) + 1,
      createdAt: new Date(r.created_on).toISOString(),
      failedAt: r.completed_on ? new Date(r.completed_on).toISOString() : null,
      error: errorText(r.output),
    }));
  }
}

function errorText(output: unknown): string | null {
  if (output && typeof output === 'object' && 'message' in output) return String((output as { message: unknown }).message).slice(0, 500);
  return output ? JSON.stringify(output).slice(0, 500) : null;
}
