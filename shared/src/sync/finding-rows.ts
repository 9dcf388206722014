/**
 * Findings in a pull page as rows: a finding's values in a fixed order, without its keys. A page is
 * a thousand findings, and their keys (the estimate's above all: `stillAirImpactVelocityMps` and
 * the like) were close to half of its bytes, which the server wrote, the network carried and the
 * phone parsed again for every finding. A phone asks for rows (`GET /sync/pull?format=rows`) and
 * turns each back into the record with `unpackFindingRow`; without the parameter the pull answers
 * records, as older phones expect. Only keys are left out: every value is written as the record has
 * it, so a row unpacks to exactly the record the findings API reads.
 *
 * A row's layout is a template: a key, or a key with the template of an object held at that key.
 * PostgreSQL writes the record's own values in the same order (server/src/sync/sync-finding-json.ts);
 * the estimate's row is written by `estimateRowText` when the estimate is stored, and kept beside it
 * (`findings.estimate_row`). An estimate of another shape (one stored before a field was added)
 * travels as its object, so `unpackFindingRow` takes either.
 */
export type RowTemplate = readonly (string | readonly [key: string, template: RowTemplate])[];

/** A finding record's keys, in row order (SyncFindingSchema). */
export const FINDING_ROW: RowTemplate = [
  'id',
  'inspectionId',
  'scaffoldId',
  'elevation',
  'lift',
  'bay',
  'heightM',
  ['item', ['catalogueItemId', 'name', 'massKg', 'shape']],
  'exposure',
  'likelihoodAnswers',
  'likelihood',
  'estimate',
  'severity',
  'riskScore',
  'riskBand',
  'state',
  'assigneeId',
  'dueAt',
  'overdue',
  'notes',
  'madeSafeNote',
  'madeSafeUntil',
  'handBack',
  'madeSafeControl',
  'zoneRadiusM',
  'madeSafePhotoIds',
  'createdBy',
  'createdAt',
  'updatedAt',
  'version',
  'organisationId',
  'siteId',
];

/**
 * The stored estimate's keys, in row order (FindingEstimateSchema). `resolved.contact` keeps its
 * object: which of its keys are set depends on the contact given.
 */
export const ESTIMATE_ROW: RowTemplate = [
  'terminalVelocityMps',
  'impactVelocityMps',
  'vacuumImpactVelocityMps',
  'fallTimeS',
  'riseM',
  'impactEnergyJ',
  'meanForceN',
  'peakForceN',
  'driftM',
  'governingImpact',
  'stillAirImpactVelocityMps',
  'stillAirImpactEnergyJ',
  'stillAirPeakForceN',
  'windImpactVelocityMps',
  'windImpactEnergyJ',
  'windPeakForceN',
  ['severity', ['level', 'label', 'basis']],
  ['likelihood', ['level', 'label', 'reasons']],
  [
    'resolved',
    [
      'massKg',
      'heightM',
      'initialVelocityMps',
      'dragAreaM2',
      'dragAreaSource',
      'airDensityKgM3',
      'gravityMps2',
      'windSpeedMps',
      'exposure',
      'contact',
      'defaultsApplied',
    ],
  ],
];

/** The object a row of `template` stands for. Throws on a row of the wrong length (a client and server that disagree). */
export function unpackRow(template: RowTemplate, row: unknown): Record<string, unknown> {
  if (!Array.isArray(row) || row.length !== template.length) {
    throw new TypeError(`A row of ${template.length} values was expected, got ${Array.isArray(row) ? `${row.length} values` : typeof row}`);
  }
  const out: Record<string, unknown> = {};
  for (let i = 0; i < template.length; i++) {
    const slot = template[i]!;
    if (typeof slot === 'string') out[slot] = row[i];
    else out[slot[0]] = unpackRow(slot[1], row[i]);
  }
  return out;
}

/**
 * `value` as a row of `template`: its values in template order, nested templates as rows; undefined
 * unless it has exactly the template's keys at every level, so that the row unpacks to what
 * JSON.stringify writes of it (a key holding undefined counts as absent, as it does there).
 */
export function packRow(template: RowTemplate, value: unknown): unknown[] | undefined {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return undefined;
  const object = value as Record<string, unknown>;
  let keys = 0;
  for (const key in object) if (Object.hasOwn(object, key) && object[key] !== undefined) keys += 1;
  if (keys !== template.length) return undefined;
  const row: unknown[] = new Array(template.length);
  for (let i = 0; i < template.length; i++) {
    const slot = template[i]!;
    const key = typeof slot === 'string' ? slot : slot[0];
    if (!Object.hasOwn(object, key) || object[key] === undefined) return undefined;
    if (typeof slot === 'string') row[i] = object[key];
    else if ((row[i] = packRow(slot[1], object[key])) === undefined) return undefined;
  }
  return row;
}

/**
 * The estimate's row as JSON text, stored beside it for the pull; null when it is not of
 * ESTIMATE_ROW's shape. Written in ASCII: any other character as its \u escape (the same string
 * once parsed). Every severity's basis cites a page range with an en dash, and one such character
 * makes JavaScript hold a whole pull page two bytes a character, on the server and on the phone,
 * which is slower to decode, measure, encode and parse.
 */
export function estimateRowText(estimate: unknown): string | null {
  const row = packRow(ESTIMATE_ROW, estimate);
  return row === undefined ? null : JSON.stringify(row).replace(NOT_ASCII, escaped);
}

const NOT_ASCII = /[\u007f-\uffff]/g;
const escaped = (c: string) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`;

/** A finding record from its pulled row; its estimate from a row or, for an estimate of another shape, as it came. */
export function unpackFindingRow(row: unknown): Record<string, unknown> {
  const record = unpackRow(FINDING_ROW, row);
  if (Array.isArray(record.estimate)) record.estimate = unpackRow(ESTIMATE_ROW, record.estimate);
  return record;
}

/**
 * A pull page answered with `format=rows`, its findings turned back into records (in place: a page
 * is parsed JSON nobody else holds). Every other change is a record already.
 */
export function unpackPullPage<T>(page: T): T {
  const changes = (page as { changes?: unknown }).changes;
  if (Array.isArray(changes)) {
    for (const change of changes as { type?: unknown; record?: unknown; row?: unknown }[]) {
      if (change?.type === 'finding' && 'row' in change) {
        change.record = unpackFindingRow(change.row);
        delete change.row;
      }
    }
  }
  return page;
}

/** The keys of a template in row order, nested keys as `outer.inner` (for tests and documentation). */
export function rowKeys(template: RowTemplate, prefix = ''): string[] {
  return template.flatMap((slot) => (typeof slot === 'string' ? [prefix + slot] : rowKeys(slot[1], `${prefix}${slot[0]}.`)));
}
