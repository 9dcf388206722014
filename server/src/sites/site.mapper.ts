import type { Site } from '@plummet/shared';
import type { sites } from '../db/schema/index.js';

export type SiteRow = typeof sites.$inferSelect;

export function toSite(row: SiteRow): Site {
  return {
    id: row.id,
    name: row.name,
    address: row.address,
    clientName: row.clientName,
    clientAddress: row.clientAddress,
    clientContactEmail: row.clientContactEmail,
    timeZone: row.timeZone,
    regime: row.regime,
    jurisdiction: row.jurisdiction,
    reportRecipients: row.reportRecipients,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    version: row.version,
  };
}
