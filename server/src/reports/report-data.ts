import type { OrganisationSettings } from '@plummet/shared';
import type { controlChecks, findings, inspections, photos, scaffolds, sites } from '../db/schema/index.js';

export interface ReportPerson {
  id: string;
  name: string;
  email: string;
  position: string;
}

export interface ReportFinding {
  row: typeof findings.$inferSelect;
  assignee: ReportPerson | null;
  photos: (typeof photos.$inferSelect)[];
}

/** What the PDF and the e-mail are made from (database rows, SI units). */
export interface ReportData {
  inspection: typeof inspections.$inferSelect;
  scaffold: typeof scaffolds.$inferSelect;
  site: typeof sites.$inferSelect;
  organisation: { id: string; name: string; settings: OrganisationSettings };
  inspector: ReportPerson;
  controlChecks: (typeof controlChecks.$inferSelect)[];
  findings: ReportFinding[];
}

/** Highest risk first, then the higher position (a longer fall), then item name: the order of every list. */
export function byRisk(a: ReportFinding, b: ReportFinding): number {
  return b.row.riskScore - a.row.riskScore || b.row.heightM - a.row.heightM || a.row.itemName.localeCompare(b.row.itemName) || a.row.id.localeCompare(b.row.id);
}
