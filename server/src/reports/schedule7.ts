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
  // The phone drafts the location and equipment with the site and scaffold already named: say each once.
  const notIn = (text: string) => (part: string | null | undefined) => !!part && !text.toLowerCase().includes(part.toLowerCase());
  const location = [...[site.name, site.address].filter(notIn(i.location)), i.location].filter(Boolean).join(', ');
  const equipment = [...[`Scaffold ${scaffold.reference}`, scaffold.description].filter(notIn(i.equipment)), i.equipment].filter(Boolean).join(': ');
  return [
    ['1. Name and address of the person for whom the inspection was carried out', client || 'not recorded'],
    ['2. Location of the work equipment inspected', location],
    ['3. Description of the work equipment inspected', equipment],
    ['4. Date and time of the inspection', dateTime(i.finishedAt ?? i.startedAt, tz)],
    ['5. Details of any matter identified that could give rise to a risk to the health or safety of any person', matters.filter(Boolean).join(' ')],
    ['6. Details of any action taken as a result of any matter identified', i.actionTaken || 'none recorded'],
    ['7. Details of any further action considered necessary', i.furtherAction || 'none recorded'],
    ['8. Name and position of the person making the report', [i.reporterName || data.inspector.name, i.reporterPosition || data.inspector.position].filter(Boolean).join(', ')],
  ];
}
