import { describe, expect, it } from 'vitest';
import { estimateFinding } from '../findings/finding-estimate.js';
import { FindingEstimateSchema } from '../findings/finding.schema.js';
import type { ShapeSpec } from '../physics/shape.js';
import { ESTIMATE_ROW, estimateRowText, FINDING_ROW, packRow, rowKeys, unpackEstimateRow, unpackFindingRow, unpackPullPage, unpackRow, type RowTemplate } from './finding-rows.js';
import { SyncFindingSchema } from './sync.schema.js';

const ANSWERS = { securing: 'loose', edgeDistance: 'at-edge', activity: 'light', wind: 'calm', footTraffic: 'frequent' } as const;

/** A row written the way the server writes one: the object's values in template order. */
function pack(template: RowTemplate, value: Record<string, unknown>): unknown[] {
  return template.map((slot) => (typeof slot === 'string' ? value[slot] : pack(slot[1], value[slot[0]] as Record<string, unknown>)));
}

const SHAPES: (ShapeSpec | null)[] = [
  null,
  { kind: 'box', lengthM: 0.3, widthM: 0.2, heightM: 0.1 },
  { kind: 'plate', lengthM: 1.2, widthM: 0.6, thicknessM: 0.018 },
  { kind: 'sphere', diameterM: 0.08 },
  { kind: 'rod', diameterM: 0.048, lengthM: 2 },
];

const estimate = (windSpeedMps: number | null) =>
  JSON.parse(
    JSON.stringify(
      estimateFinding({
        massKg: 2.4,
        heightM: 17.5,
        shape: { kind: 'box', lengthM: 0.3, widthM: 0.2, heightM: 0.1 },
        exposure: 'public',
        likelihoodAnswers: ANSWERS,
        windSpeedMps,
      }).estimate,
    ),
  ) as Record<string, unknown>;

const record = (est: unknown) => ({
  id: '7d1f3c52-0c43-4d9e-9a5e-1f2b3c4d5e6f',
  inspectionId: null,
  scaffoldId: 'de000002-0000-4000-8000-000000000002',
  elevation: 'North',
  lift: 3,
  bay: 7,
  heightM: 17.5,
  item: { catalogueItemId: null, name: 'Box of clips "large"', massKg: 2.4, shape: { kind: 'box', lengthM: 0.3, widthM: 0.2, heightM: 0.1 } },
  exposure: 'public',
  likelihoodAnswers: ANSWERS,
  likelihood: 4,
  estimate: est,
  severity: 4,
  riskScore: 16,
  riskBand: 'High',
  state: 'open',
  assigneeId: null,
  dueAt: '2026-12-03T09:00:00.000Z',
  overdue: false,
  notes: 'Line one\nline two',
  madeSafeNote: null,
  madeSafeUntil: null,
  handBack: null,
  madeSafeControl: null,
  zoneRadiusM: null,
  madeSafePhotoIds: [],
  createdBy: '4e2e2f87-5f21-4445-ab9b-15920f065cb4',
  createdAt: '2026-12-02T08:00:00.000Z',
  updatedAt: '2026-12-02T08:00:00.000Z',
  version: 2,
  organisationId: '034190cb-e548-4073-b618-ab6ede72e9dd',
  siteId: 'de000001-0000-4000-8000-000000000001',
});

describe('finding rows', () => {
  it('name every key of a pulled finding and of its estimate, each once', () => {
    const top = (t: RowTemplate) => t.map((slot) => (typeof slot === 'string' ? slot : slot[0]));
    expect(new Set(top(FINDING_ROW))).toEqual(new Set(Object.keys(SyncFindingSchema.shape)));
    expect(new Set(top(ESTIMATE_ROW))).toEqual(new Set(Object.keys(FindingEstimateSchema.shape)));
    for (const template of [FINDING_ROW, ESTIMATE_ROW]) expect(new Set(rowKeys(template)).size).toBe(rowKeys(template).length);
    // The estimate's nested objects as the physics writes them today: exactly the template's keys.
    for (const wind of [null, 0, 12]) {
      const est = estimate(wind);
      expect(Object.keys(est).sort()).toEqual(top(ESTIMATE_ROW).sort());
      for (const slot of ESTIMATE_ROW) {
        if (typeof slot !== 'string') expect(Object.keys(est[slot[0]] as object).sort()).toEqual(top(slot[1]).sort());
      }
    }
  });

  it('unpack to the record they were written from, with the estimate as a row or as its object', () => {
    for (const wind of [null, 9]) {
      const est = estimate(wind);
      const whole = record(est);
      const asRow = pack(FINDING_ROW, { ...whole, estimate: pack(ESTIMATE_ROW, est) } as Record<string, unknown>);
      expect(unpackFindingRow(JSON.parse(JSON.stringify(asRow)))).toEqual(whole);
      // An estimate stored before a field was added travels as its object.
      const { windPeakForceN: _dropped, ...older } = est;
      expect(unpackFindingRow(pack(FINDING_ROW, record(older) as Record<string, unknown>))).toEqual(record(older));
      expect(SyncFindingSchema.safeParse(unpackFindingRow(asRow)).success).toBe(true);
    }
  });

  it('turn a page\'s finding rows into records and leave every other change as it is', () => {
    const est = estimate(null);
    const site = { type: 'site', record: { id: 'x', name: 'Quayside' } };
    const page = {
      changes: [{ type: 'finding', row: pack(FINDING_ROW, { ...record(est), estimate: pack(ESTIMATE_ROW, est) } as Record<string, unknown>) }, site, { type: 'finding', record: record(est) }],
      cursor: '1.2',
      hasMore: false,
    };
    expect(unpackPullPage(page)).toEqual({ changes: [{ type: 'finding', record: record(est) }, site, { type: 'finding', record: record(est) }], cursor: '1.2', hasMore: false });
  });

  it("are written for every estimate the physics makes, as JSON that unpacks to the estimate as stored", () => {
    for (const shape of SHAPES) {
      for (const windSpeedMps of [null, 0, 7.5, 25]) {
        for (const exposure of ['public', 'hard-hats', 'zone-closed'] as const) {
          const { estimate: est } = estimateFinding({ massKg: 3.2, heightM: 22.5, shape, exposure, likelihoodAnswers: ANSWERS, windSpeedMps });
          const text = estimateRowText(est);
          expect(text).not.toBeNull();
          expect(text).toMatch(/^[\x20-\x7e]+$/);
          // The estimate as the database stores it: its JSON.
          expect(unpackRow(ESTIMATE_ROW, JSON.parse(text!))).toEqual(JSON.parse(JSON.stringify(est)));
        }
      }
    }
  });

  it('write characters outside ASCII as escapes that parse back to them', () => {
    const est = estimate(null);
    const severity = { ...(est.severity as object), basis: 'Façade – “quoted” 10 m², 𝑣 ≥ 5 m/s\u007f' };
    const text = estimateRowText({ ...est, severity })!;
    expect(text).toMatch(/^[\x20-\x7e]+$/);
    expect(text).toContain('Fa\\u00e7ade \\u2013 \\u201cquoted\\u201d');
    expect(unpackRow(ESTIMATE_ROW, JSON.parse(text))).toEqual({ ...est, severity });
  });

  it('are not written for an estimate of another shape, which then travels as its object', () => {
    const est = estimate(7.5);
    const severity = est.severity as Record<string, unknown>;
    const { stillAirPeakForceN: _older, ...withoutAField } = est;
    const others: unknown[] = [
      withoutAField,
      { ...est, stillAirPeakForceN: undefined },
      { ...est, comment: 'a field the template does not know' },
      { ...est, severity: { ...severity, source: 'an extra nested field' } },
      { ...est, severity: 'Major' },
      { ...est, resolved: [est.resolved] },
      { ...est, likelihood: null },
      [est],
      'an estimate',
      null,
    ];
    for (const other of others) expect(estimateRowText(other)).toBeNull();
    expect(packRow(ESTIMATE_ROW, est)).toHaveLength(ESTIMATE_ROW.length);
  });

  it('are unpacked by the written-out functions exactly as by their templates', () => {
    // Every position holds a value of its own, so a key read from the wrong position shows.
    let n = 0;
    const distinct = (template: RowTemplate): unknown[] => template.map((slot) => (typeof slot === 'string' ? `v${n++}` : distinct(slot[1])));
    const estimateRow = distinct(ESTIMATE_ROW);
    expect(unpackEstimateRow(estimateRow)).toEqual(unpackRow(ESTIMATE_ROW, estimateRow));
    expect(Object.keys(unpackEstimateRow(estimateRow))).toEqual(Object.keys(unpackRow(ESTIMATE_ROW, estimateRow)));
    const findingRow = distinct(FINDING_ROW);
    expect(unpackFindingRow(findingRow)).toEqual(unpackRow(FINDING_ROW, findingRow));
    expect(Object.keys(unpackFindingRow(findingRow))).toEqual(Object.keys(unpackRow(FINDING_ROW, findingRow)));
    findingRow[FINDING_ROW.indexOf('estimate')] = estimateRow;
    expect(unpackFindingRow(findingRow).estimate).toEqual(unpackRow(ESTIMATE_ROW, estimateRow));
  });

  it('refuse a row of another length, naming what came', () => {
    expect(() => unpackRow(FINDING_ROW, [1, 2, 3])).toThrow(`A row of ${FINDING_ROW.length} values was expected, got 3 values`);
    expect(() => unpackRow(ESTIMATE_ROW, { riseM: 0 })).toThrow('got object');
    const short = pack(FINDING_ROW, record(estimate(null)) as Record<string, unknown>);
    short[7] = ['only a name'];
    expect(() => unpackFindingRow(short)).toThrow('A row of 4 values was expected, got 1 values');
  });
});
