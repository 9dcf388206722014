/**
 * The demo's sites, scaffolds, inspections and findings: a fictional scenario of our own (names,
 * addresses and clients are invented). Ids are fixed so seeding twice leaves one copy. Times are
 * offsets from the moment of the first seeding (hours; negative = in the past).
 */
import type { Control, ControlResult, FindingExposure, FindingState, LikelihoodAnswers } from '@plummet/shared';

const demoId = (kind: number, n: number) => `de${kind.toString(16).padStart(6, '0')}-0000-4000-8000-${n.toString(16).padStart(12, '0')}`;
const builtin = (n: number) => `c47a1000-0000-4000-8000-${n.toString(16).padStart(12, '0')}`;

export const DEMO_SITES = [
  {
    id: demoId(1, 1),
    org: 'harrow-span',
    name: 'Quayside Library refurbishment',
    address: '14 Wharfinger Lane, Eastmouth EM3 7QL',
    clientName: 'Eastmouth Libraries Trust',
    clientAddress: 'Civic Hall, 2 Tollgate Square, Eastmouth EM1 2AB',
    clientContactEmail: 'estates@eastmouth-libraries.test',
    regime: '7-day',
    reportRecipients: ['site-reports@eastmouth-libraries.test'],
  },
  {
    id: demoId(1, 2),
    org: 'harrow-span',
    name: 'Fennel Street student housing',
    address: 'Plot 6, Fennel Street, Brackley Vale BV2 9RT',
    clientName: 'Larchmont Residential Ltd',
    clientAddress: '88 Orchard Parade, Brackley Vale BV1 4LN',
    clientContactEmail: null,
    // The client's site rules ask for a check before every shift.
    regime: 'pre-shift',
    reportRecipients: ['hse@larchmont-residential.test'],
  },
  {
    id: demoId(1, 3),
    org: 'other-build',
    name: 'Marlow Yard offices',
    address: '3 Marlow Yard, Kettering Cross KX1 4DP',
    clientName: 'Marlow Yard Estates',
    clientAddress: '3 Marlow Yard, Kettering Cross KX1 4DP',
    clientContactEmail: null,
    regime: '7-day',
    reportRecipients: [],
  },
] as const;

export const DEMO_SCAFFOLDS = [
  { id: demoId(2, 1), site: demoId(1, 1), reference: 'QL-A', description: 'Main façade independent scaffold with brick guards', elevations: ['North', 'East'], lifts: 6, liftHeightM: 2, baysPerElevation: 12, status: 'cleared', foreman: true },
  { id: demoId(2, 2), site: demoId(1, 1), reference: 'QL-B', description: 'Rear stair-core tower', elevations: ['South'], lifts: 8, liftHeightM: 2, baysPerElevation: 3, status: 'limited', foreman: false },
  { id: demoId(2, 3), site: demoId(1, 2), reference: 'FS-1', description: 'Block A perimeter scaffold over the public footpath, with fan', elevations: ['Street', 'Courtyard'], lifts: 5, liftHeightM: 2, baysPerElevation: 18, status: 'cleared', foreman: true },
  { id: demoId(2, 4), site: demoId(1, 2), reference: 'FS-2', description: 'Loading bay', elevations: ['West'], lifts: 3, liftHeightM: 2, baysPerElevation: 4, status: 'limited', foreman: false },
  { id: demoId(2, 5), site: demoId(1, 3), reference: 'MY-1', description: 'Front elevation access scaffold', elevations: ['Front'], lifts: 4, liftHeightM: 2, baysPerElevation: 8, status: 'cleared', foreman: false },
] as const;

const REPORT = {
  reportFor: 'Eastmouth Libraries Trust',
  location: 'Quayside Library, 14 Wharfinger Lane, Eastmouth: scaffold QL-A, North and East elevations',
  equipment: 'Independent tube-and-fitting scaffold, 6 lifts × 2 m, 12 bays per elevation, brick guards on lifts 4–6',
  mattersGivingRisk: 'Loose fittings and offcuts on lifts 3–6; a toe board missing at North bay 7, lift 5; materials stacked above the toe board at East bay 2.',
  actionTaken: 'Fittings and offcuts bagged and lowered; materials restacked below toe-board height.',
  furtherAction: 'Refit the missing toe board at North bay 7, lift 5; foreman to clear the remaining items listed.',
  reporterName: 'Aileen Marsh',
  reporterPosition: 'Scaffold inspector (advanced)',
};

/** A short signed report for the routine inspections behind each scaffold's tag. */
const routine = (reportFor: string, location: string, equipment: string, restriction = '', reporter = { name: 'Aileen Marsh', position: 'Scaffold inspector (advanced)' }) => ({
  reportFor,
  location,
  equipment,
  mattersGivingRisk: restriction ? `Use limited: ${restriction}` : 'None found at this inspection.',
  actionTaken: 'None needed.',
  furtherAction: restriction ? 'Keep the limit signed at the access points until the scaffold is altered.' : 'None.',
  reporterName: reporter.name,
  reporterPosition: reporter.position,
});

/**
 * `finishedH: 'today'` is the pre-shift check done this morning (local time), whatever the hour of
 * seeding. Every scaffold tagged cleared or limited has a finished, signed inspection behind its
 * tag; its last/next inspection follow the site's regime. Left due on purpose, for the due list:
 * QL-B (7-day, last inspected eight days ago: overdue) and FS-1 (pre-shift, last checked
 * yesterday: overdue until the check under way this morning is signed).
 */
export const DEMO_INSPECTIONS: {
  id: string;
  scaffold: string;
  startedH: number;
  finishedH: number | 'today' | null;
  reason: 'scheduled' | 'after-bad-weather' | 'pre-shift';
  windSpeedMps: number;
  report: ReturnType<typeof routine> | null;
  restriction?: string;
}[] = [
  // Finished two days ago: the statutory record of QL-A.
  { id: demoId(3, 1), scaffold: demoId(2, 1), startedH: -50, finishedH: -48.5, reason: 'scheduled', windSpeedMps: 6.5, report: REPORT },
  // Under way this morning on FS-1.
  { id: demoId(3, 2), scaffold: demoId(2, 3), startedH: -1, finishedH: null, reason: 'after-bad-weather', windSpeedMps: 9, report: null },
  {
    id: demoId(3, 3),
    scaffold: demoId(2, 2),
    startedH: -193,
    finishedH: -192,
    reason: 'scheduled',
    windSpeedMps: 4,
    restriction: 'Top two lifts closed: no loading above lift 6',
    report: routine('Eastmouth Libraries Trust', 'Quayside Library: scaffold QL-B, rear stair-core tower', 'Stair-core tower, 8 lifts × 2 m, 3 bays', 'Top two lifts closed: no loading above lift 6'),
  },
  {
    id: demoId(3, 4),
    scaffold: demoId(2, 3),
    startedH: -27,
    finishedH: -26.5,
    reason: 'pre-shift',
    windSpeedMps: 3,
    report: routine('Larchmont Residential Ltd', 'Fennel Street Block A: scaffold FS-1, Street and Courtyard elevations', 'Perimeter scaffold, 5 lifts × 2 m, 18 bays per elevation, fan over the footpath'),
  },
  {
    id: demoId(3, 5),
    scaffold: demoId(2, 4),
    // For 'today' the start is a quarter of an hour before the finish; this figure is not used.
    startedH: -0.75,
    finishedH: 'today',
    reason: 'pre-shift',
    windSpeedMps: 5,
    restriction: 'Loading bay rated for one pallet at a time',
    report: routine('Larchmont Residential Ltd', 'Fennel Street: scaffold FS-2, West loading bay', 'Loading bay, 3 lifts × 2 m, 4 bays', 'Loading bay rated for one pallet at a time'),
  },
  {
    id: demoId(3, 6),
    scaffold: demoId(2, 5),
    startedH: -74,
    finishedH: -73,
    reason: 'scheduled',
    windSpeedMps: 2.5,
    report: routine('Marlow Yard Estates', 'Marlow Yard offices: scaffold MY-1, front elevation', 'Access scaffold, 4 lifts × 2 m, 8 bays', '', {
      name: 'Ruth Lindqvist',
      position: 'Project manager (competent person for scaffold inspection)',
    }),
  },
];

export const DEMO_CONTROL_CHECKS: { inspection: string; control: Control; result: ControlResult; note: string }[] = [
  { inspection: demoId(3, 1), control: 'toe-boards', result: 'fail', note: 'Missing at North bay 7, lift 5' },
  { inspection: demoId(3, 1), control: 'brick-guards', result: 'pass', note: '' },
  { inspection: demoId(3, 1), control: 'netting-or-sheeting', result: 'not-applicable', note: 'No sheeting on this scaffold' },
  { inspection: demoId(3, 1), control: 'fans-or-canopies', result: 'not-applicable', note: '' },
  { inspection: demoId(3, 1), control: 'exclusion-zone-barriers', result: 'pass', note: 'Temporary mesh fencing along the East elevation' },
  { inspection: demoId(3, 1), control: 'tool-tethering', result: 'fail', note: 'Two untethered podgers seen on lift 6' },
  { inspection: demoId(3, 1), control: 'material-storage', result: 'fail', note: 'Blocks stacked above the toe board at East bay 2' },
  { inspection: demoId(3, 2), control: 'fans-or-canopies', result: 'pass', note: 'Fan over the footpath intact after the storm' },
];

const A = (securing: LikelihoodAnswers['securing'], edgeDistance: LikelihoodAnswers['edgeDistance'], activity: LikelihoodAnswers['activity'], wind: LikelihoodAnswers['wind'], footTraffic: LikelihoodAnswers['footTraffic']): LikelihoodAnswers => ({
  securing,
  edgeDistance,
  activity,
  wind,
  footTraffic,
});

export interface DemoFinding {
  id: string;
  org: 'harrow-span' | 'other-build';
  scaffold: string;
  inspection: string | null;
  elevation: string;
  lift: number;
  bay: number;
  heightM: number;
  /** A built-in catalogue item, or a custom item. */
  item: { catalogue: string } | { name: string; massKg: number };
  exposure: FindingExposure;
  answers: LikelihoodAnswers;
  state: FindingState;
  assignToForeman?: boolean;
  dueH?: number;
  notes: string;
  madeSafeNote?: string;
}

export const DEMO_FINDINGS: DemoFinding[] = [
  { id: demoId(4, 1), org: 'harrow-span', scaffold: demoId(2, 1), inspection: demoId(3, 1), elevation: 'North', lift: 6, bay: 3, heightM: 12, item: { catalogue: builtin(2) }, exposure: 'public', answers: A('loose', 'at-edge', 'heavy', 'breezy', 'frequent'), state: 'open', assignToForeman: true, dueH: -4, notes: 'Podger left on the toe board above the library entrance' },
  { id: demoId(4, 2), org: 'harrow-span', scaffold: demoId(2, 1), inspection: demoId(3, 1), elevation: 'North', lift: 5, bay: 7, heightM: 10, item: { catalogue: builtin(8) }, exposure: 'public', answers: A('loose', 'at-edge', 'light', 'breezy', 'frequent'), state: 'open', assignToForeman: true, dueH: 20, notes: 'Spare right-angle coupler where the toe board is missing' },
  { id: demoId(4, 3), org: 'harrow-span', scaffold: demoId(2, 1), inspection: demoId(3, 1), elevation: 'East', lift: 2, bay: 2, heightM: 4, item: { catalogue: builtin(20) }, exposure: 'hard-hats', answers: A('contained', 'near-edge', 'light', 'calm', 'occasional'), state: 'made-safe', madeSafeNote: 'Restacked below toe-board height', notes: 'Blocks stacked above the toe board' },
  { id: demoId(4, 4), org: 'harrow-span', scaffold: demoId(2, 1), inspection: demoId(3, 1), elevation: 'East', lift: 6, bay: 10, heightM: 12, item: { catalogue: builtin(17) }, exposure: 'hard-hats', answers: A('secured', 'at-edge', 'none', 'calm', 'occasional'), state: 'fixed', notes: 'Tube offcut left across the boards' },
  { id: demoId(4, 5), org: 'harrow-span', scaffold: demoId(2, 1), inspection: demoId(3, 1), elevation: 'North', lift: 3, bay: 11, heightM: 6, item: { catalogue: builtin(4) }, exposure: 'zone-closed', answers: A('loose', 'away', 'none', 'calm', 'none'), state: 'verified', notes: 'Tape measure on the boards inside the closed zone' },
  { id: demoId(4, 6), org: 'harrow-span', scaffold: demoId(2, 1), inspection: demoId(3, 1), elevation: 'East', lift: 4, bay: 5, heightM: 8, item: { catalogue: builtin(24) }, exposure: 'hard-hats', answers: A('loose', 'at-edge', 'heavy', 'breezy', 'occasional'), state: 'open', assignToForeman: true, dueH: 30, notes: 'Timber offcuts by the brick guard' },
  { id: demoId(4, 7), org: 'harrow-span', scaffold: demoId(2, 2), inspection: null, elevation: 'South', lift: 8, bay: 1, heightM: 16, item: { catalogue: builtin(19) }, exposure: 'hard-hats', answers: A('loose', 'at-edge', 'light', 'strong', 'occasional'), state: 'open', dueH: 48, notes: 'Loose bricks on the top lift of the stair tower' },
  { id: demoId(4, 8), org: 'harrow-span', scaffold: demoId(2, 2), inspection: null, elevation: 'South', lift: 2, bay: 2, heightM: 4, item: { name: 'Empty paint tin', massKg: 0.3 }, exposure: 'zone-closed', answers: A('contained', 'away', 'none', 'calm', 'none'), state: 'open', notes: 'Empty tin inside the closed area' },
  { id: demoId(4, 9), org: 'harrow-span', scaffold: demoId(2, 3), inspection: demoId(3, 2), elevation: 'Street', lift: 5, bay: 9, heightM: 10, item: { catalogue: builtin(15) }, exposure: 'public', answers: A('loose', 'at-edge', 'heavy', 'strong', 'frequent'), state: 'open', assignToForeman: true, dueH: 2, notes: 'Loose board lifted by the storm over the public footpath' },
  { id: demoId(4, 10), org: 'harrow-span', scaffold: demoId(2, 3), inspection: demoId(3, 2), elevation: 'Street', lift: 3, bay: 14, heightM: 6, item: { catalogue: builtin(13) }, exposure: 'public', answers: A('contained', 'away', 'light', 'calm', 'frequent'), state: 'made-safe', madeSafeNote: 'Clip bagged and lowered', notes: 'Board clip on the boards' },
  { id: demoId(4, 11), org: 'harrow-span', scaffold: demoId(2, 3), inspection: demoId(3, 2), elevation: 'Courtyard', lift: 1, bay: 3, heightM: 2, item: { catalogue: builtin(7) }, exposure: 'hard-hats', answers: A('secured', 'away', 'light', 'calm', 'occasional'), state: 'open', notes: 'Trowel on the first lift, away from the edge' },
  { id: demoId(4, 12), org: 'harrow-span', scaffold: demoId(2, 4), inspection: null, elevation: 'West', lift: 3, bay: 2, heightM: 6, item: { catalogue: builtin(22) }, exposure: 'hard-hats', answers: A('loose', 'at-edge', 'heavy', 'breezy', 'frequent'), state: 'fixed', notes: 'Cement bag on the loading bay edge' },
  { id: demoId(4, 13), org: 'other-build', scaffold: demoId(2, 5), inspection: null, elevation: 'Front', lift: 4, bay: 2, heightM: 8, item: { catalogue: builtin(9) }, exposure: 'public', answers: A('loose', 'at-edge', 'light', 'calm', 'frequent'), state: 'open', notes: 'Swivel coupler on the top lift' },
  { id: demoId(4, 14), org: 'other-build', scaffold: demoId(2, 5), inspection: null, elevation: 'Front', lift: 2, bay: 6, heightM: 4, item: { catalogue: builtin(1) }, exposure: 'hard-hats', answers: A('loose', 'near-edge', 'light', 'calm', 'occasional'), state: 'verified', notes: 'Hammer left on the boards' },
];

/** Ids of the fix and verification rows behind the demo's fixed and verified findings. */
export const demoRecordId = (findingId: string, kind: 'fix' | 'verification') => `${findingId.slice(0, 9)}${kind === 'fix' ? 'f1f1' : 'e1e1'}${findingId.slice(13)}`;
