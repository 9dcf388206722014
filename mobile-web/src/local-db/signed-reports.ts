import type { PlummetDb } from './db';
import type { SignedReportRecord } from './records';

/**
 * Keeps a signed report as its scaffold's last one unless a later signature is already here. The
 * same report again keeps the control checks stored with it when the new copy brings none (the
 * change feed sends the inspection without them).
 */
export async function keepSignedReport(database: PlummetDb, report: SignedReportRecord): Promise<boolean> {
  if (!report.finishedAt) return false;
  const current = await database.signedReports.get(report.scaffoldId);
  if (current && current.id !== report.id && Date.parse(current.finishedAt ?? '') > Date.parse(report.finishedAt)) return false;
  const controlChecks = report.controlChecks.length === 0 && current?.id === report.id ? current.controlChecks : report.controlChecks;
  await database.signedReports.put({ ...report, controlChecks });
  return true;
}
