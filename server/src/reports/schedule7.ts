import type { ReportData } from './report-data.js';
import { dateTime } from './report-format.js';

/**
 * The particulars a report must hold under the Work at Height Regulations 2005 (UK), reg. 12 and
 * Schedule 7, in that Schedule's order, with Plummet's wording of each heading.
 */
export function schedule7Fields(data: ReportData): [string, string][] {
  const { inspection: i, site, scaffold } = data;
  const tz = data.organisation.settings.timeZone;
  const client = [i.reportFor || site.clientName, site.clientAddress].filter((s) => s.trim() !== '').join(', ');
  const stated = i.mattersGivingRisk.trim();
  const matters = [stated && !/[.!?]$/.test(stated) ? `${stated}.` : stated, `${data.findings.length} falling-object finding${data.findings.length === 1 ? '' : 's'} recorded (listed below).`];
  return [
    ['1. Name and address of the person for whom the inspection was carried out', client || 'not recorded'],
    ['2. Location of the work equipment inspected', [site.name, site.address, i.location].filter(Boolean).join(', ')],
    ['3. Description of the work equipment inspected', [`Scaffold ${scaffold.reference}`, scaffold.description, i.equipment].filter(Boolean).join(': ')],
    ['4. Date and time of the inspection', dateTime(i.finishedAt ?? i.startedAt, tz)],
    ['5. Details of any matter identified that could give rise to a risk to the health or safety of any person', matters.filter(Boolean).join(' ')],
    ['6. Details of any action taken as a result of any matter identified', i.actionTaken || 'none recorded'],
    ['7. Details of any further action considered necessary', i.furtherAction || 'none recorded'],
    ['8. Name and position of the person making the report', [i.reporterName || data.inspector.name, i.reporterPosition || data.inspector.position].filter(Boolean).join(', ')],
  ];
}
