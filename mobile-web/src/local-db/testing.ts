/** Helpers for unit tests of the stores (with fake-indexeddb imported first). Not used by the app. */
import type { Scaffold, Site, UserProfile } from '@plummet/shared';
import Dexie from 'dexie';
import { PlummetDb } from './db';
import type { FindingRecord } from './records';

const open: PlummetDb[] = [];

/** A database of its own for one test; dropTestDatabases() removes them. */
export function freshDb(): PlummetDb {
  const database = new PlummetDb(`plummet-test-${crypto.randomUUID()}`);
  open.push(database);
  return database;
}

export async function dropTestDatabases(): Promise<void> {
  await Promise.all(open.splice(0).map((database) => database.delete()));
}

export const ORG_ID = '0a000000-0000-4000-8000-000000000001';
export const USER_ID = '0b000000-0000-4000-8000-000000000001';
export const SITE_ID = '0c000000-0000-4000-8000-000000000001';
export const SCAFFOLD_ID = '0d000000-0000-4000-8000-000000000001';

export const inspector: UserProfile = {
  id: USER_ID,
  email: 'inspector@demo.test',
  name: 'Aileen Marsh',
  position: 'Scaffold inspector',
  units: 'si',
  windUnits: 'mps',
  role: 'inspector',
  organisation: { id: ORG_ID, name: 'Harrow & Span Access Ltd' },
};

export const site: Site = {
  id: SITE_ID,
  name: 'Quayside Library refurbishment',
  address: '14 Wharfinger Lane, Eastmouth',
  clientName: 'Eastmouth Libraries Trust',
  clientAddress: '',
  clientContactEmail: null,
  timeZone: 'Europe/London',
  regime: '7-day',
  jurisdiction: 'uk',
  reportRecipients: [],
  createdAt: '2026-01-05T08:00:00.000Z',
  updatedAt: '2026-01-05T08:00:00.000Z',
  version: 1,
};

export const scaffold: Scaffold = {
  id: SCAFFOLD_ID,
  siteId: SITE_ID,
  reference: 'QL-A',
  statusSetAt: null,
  description: 'Main façade',
  elevations: ['North', 'East'],
  lifts: 6,
  liftHeightM: 2,
  liftHeightsM: [],
  baysPerElevation: 12,
  status: 'cleared',
  foremanId: null,
  regime: null,
  loadClass: null,
  designReference: '',
  erectingContractor: '',
  handedOverOn: null,
  lastInspectedAt: '2026-02-20T10:00:00.000Z',
  nextDueAt: '2026-02-27T10:00:00.000Z',
  archivedAt: null,
  createdAt: '2026-01-05T08:00:00.000Z',
  updatedAt: '2026-01-05T08:00:00.000Z',
  version: 1,
};

/** A finding as the server would send it, with the phone's fields. */
export function sampleFinding(overrides: Partial<FindingRecord> = {}): FindingRecord {
  return {
    id: '0f000000-0000-4000-8000-000000000001',
    organisationId: ORG_ID,
    siteId: SITE_ID,
    scaffoldId: SCAFFOLD_ID,
    inspectionId: '0e000000-0000-4000-8000-000000000001',
    elevation: 'North',
    lift: 2,
    bay: 1,
    heightM: 4,
    item: { catalogueItemId: null, name: 'Brick', massKg: 2.3, shape: null },
    exposure: 'public',
    likelihoodAnswers: { securing: 'loose', edgeDistance: 'at-edge', activity: 'light', wind: 'calm', footTraffic: 'frequent' },
    likelihood: 4,
    estimate: {
      terminalVelocityMps: null,
      impactVelocityMps: 8.86,
      vacuumImpactVelocityMps: 8.86,
      fallTimeS: 0.9,
      riseM: 0,
      impactEnergyJ: 90,
      meanForceN: 5000,
      peakForceN: 7800,
      driftM: 0,
      severity: { level: 4, label: 'Major', basis: 'test' },
      likelihood: { level: 4, label: 'Likely', reasons: [] },
      resolved: {},
    },
    severity: 4,
    riskScore: 16,
    riskBand: 'High',
    state: 'open',
    assigneeId: null,
    dueAt: null,
    overdue: false,
    notes: '',
    madeSafeNote: null,
    madeSafeUntil: null,
    handBack: null,
    createdBy: USER_ID,
    createdAt: '2026-02-01T00:00:00.000Z',
    updatedAt: '2026-03-01T08:30:00.000Z',
    version: 1,
    ...overrides,
  };
}

/**
 * The phone database exactly as the first release laid it out (written out here, not taken from
 * db.ts, so an upgrade test keeps testing what phones in the field really hold).
 */
export function openVersion1Database(name: string): Dexie {
  const v1 = new Dexie(name);
  v1.version(1).stores({
    sites: 'id, organisationId, updatedAt',
    scaffolds: 'id, siteId, updatedAt',
    inspections: 'id, scaffoldId, siteId, status, startedAt, updatedAt',
    findings: 'id, siteId, scaffoldId, inspectionId, state, dueAt, updatedAt, [scaffoldId+state]',
    controlChecks: 'id, inspectionId, [inspectionId+control]',
    photos: 'id, [ownerType+ownerId], uploadedAt',
    catalogue: 'id, category, *words',
    outbox: '++id, [entity+entityId], createdAt',
    meta: 'key',
  });
  return v1;
}
