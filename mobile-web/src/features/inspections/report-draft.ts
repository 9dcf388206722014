/**
 * The statutory report's first draft, written from the walk (UK WAHR 2005 Schedule 7: for whom,
 * where, what equipment, each matter that could give rise to risk, action taken, further action,
 * name and position of the person reporting). The inspector reads and edits every line.
 */
import { liftHeightsOf, topPlatformHeightM, type InspectionFinish, type LiftHeightSource, type UserProfile } from '@plummet/shared';
import type { ControlCheckRecord, FindingRecord, ScaffoldRecord, SiteRecord } from '../../local-db/records';
import { formatQuantity, type Units } from '../../lib/units';
import { CONTROL_WORDS } from './inspection-words';

/** "6 lifts of 2 m", or with lifts of differing heights each one and the top platform's height. */
function liftsInWords(scaffold: LiftHeightSource, units: Units): string {
  const heights = liftHeightsOf(scaffold);
  if (heights.every((h) => h === scaffold.liftHeightM)) return `${scaffold.lifts} lifts of ${formatQuantity('height', scaffold.liftHeightM, units)}`;
  const each = heights.map((h) => formatQuantity('height', h, units)).join(', ');
  return `${scaffold.lifts} lifts (${each} from the bottom; top platform at ${formatQuantity('height', topPlatformHeightM(scaffold), units)})`;
}

export type ReportFields = Omit<InspectionFinish, 'signature' | 'finishedAt' | 'tagStatus' | 'restriction' | 'accessTagsChanged'>;

export const REPORT_FIELD_LABELS: Record<keyof ReportFields, string> = {
  reportFor: 'Report for (client)',
  location: 'Location',
  equipment: 'Scaffold inspected',
  mattersGivingRisk: 'Matters that could give rise to risk',
  actionTaken: 'Action taken',
  furtherAction: 'Further action needed',
  reporterName: 'Your name',
  reporterPosition: 'Your position',
};

interface DraftSources {
  site: Pick<SiteRecord, 'name' | 'address' | 'clientName'> | undefined;
  scaffold: Pick<ScaffoldRecord, 'reference' | 'description' | 'elevations' | 'lifts' | 'liftHeightM' | 'baysPerElevation'> & Partial<Pick<ScaffoldRecord, 'liftHeightsM'>>;
  findings: readonly FindingRecord[];
  checks: readonly ControlCheckRecord[];
  user: Pick<UserProfile, 'name' | 'position'>;
  units: Units;
}

function findingLine(finding: FindingRecord, units: Units): string {
  return `${finding.item.name} at ${finding.elevation}, lift ${finding.lift}, bay ${finding.bay} (${formatQuantity('height', finding.heightM, units)} up): ${finding.riskBand} risk ${finding.riskScore}`;
}

export function draftReport({ site, scaffold, findings, checks, user, units }: DraftSources): ReportFields {
  const failed = checks.filter((check) => check.result === 'fail');
  const madeSafe = findings.filter((finding) => finding.state === 'made-safe');
  const stillOpen = findings.filter((finding) => finding.state === 'open');
  const elevations = scaffold.elevations.join(' and ');

  const matters = [
    ...findings.map((finding) => `- ${findingLine(finding, units)}${finding.notes ? `. ${finding.notes}` : ''}`),
    ...failed.map((check) => `- ${CONTROL_WORDS[check.control].label} failed${check.note ? `: ${check.note}` : ''}`),
  ];
  const further = [
    ...stillOpen.map((finding) => `- Secure or remove: ${findingLine(finding, units)}`),
    ...failed.map((check) => `- Put right: ${CONTROL_WORDS[check.control].label}${check.note ? ` (${check.note})` : ''}`),
  ];

  return {
    reportFor: site?.clientName ?? '',
    location: site ? `${site.name}, ${site.address}: scaffold ${scaffold.reference}, ${elevations}` : `Scaffold ${scaffold.reference}, ${elevations}`,
    equipment: `${scaffold.description || 'Scaffold'}; ${liftsInWords(scaffold, units)}, ${scaffold.baysPerElevation} bays per elevation`,
    mattersGivingRisk: matters.length > 0 ? matters.join('\n') : 'No matters that could give rise to risk from falling objects were found.',
    actionTaken: madeSafe.length > 0 ? madeSafe.map((finding) => `- ${finding.item.name}: ${finding.madeSafeNote ?? 'made safe'}`).join('\n') : 'None on the spot.',
    furtherAction: further.length > 0 ? further.join('\n') : 'None.',
    reporterName: user.name,
    reporterPosition: user.position,
  };
}
