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
  const values = rowOf(template, row);
  const out: Record<string, unknown> = {};
  for (let i = 0; i < template.length; i++) {
    const slot = template[i]!;
    if (typeof slot === 'string') out[slot] = values[i];
    else out[slot[0]] = unpackRow(slot[1], values[i]);
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

/** `value` if it is a row of `template`'s length; throws otherwise (a client and server that disagree). */
function rowOf(template: RowTemplate, value: unknown): unknown[] {
  if (Array.isArray(value) && value.length === template.length) return value;
  throw new TypeError(`A row of ${template.length} values was expected, got ${Array.isArray(value) ? `${value.length} values` : typeof value}`);
}

const ITEM_ROW = (FINDING_ROW[7] as readonly [string, RowTemplate])[1];
const [SEVERITY_ROW, LIKELIHOOD_ROW, RESOLVED_ROW] = ESTIMATE_ROW.slice(16).map((slot) => (slot as readonly [string, RowTemplate])[1]) as [RowTemplate, RowTemplate, RowTemplate];

/**
 * A finding record from its pulled row; its estimate from a row or, for an estimate of another shape,
 * as it came. unpackRow with FINDING_ROW and ESTIMATE_ROW, written out as object literals: a page
 * unpacks a thousand of them, and a key at a time took longer than parsing the page
 * (finding-rows.test.ts checks this against unpackRow for every position).
 */
export function unpackFindingRow(row: unknown): Record<string, unknown> {
  const r = rowOf(FINDING_ROW, row);
  const item = rowOf(ITEM_ROW, r[7]);
  return {
    id: r[0],
    inspectionId: r[1],
    scaffoldId: r[2],
    elevation: r[3],
    lift: r[4],
    bay: r[5],
    heightM: r[6],
    item: { catalogueItemId: item[0], name: item[1], massKg: item[2], shape: item[3] },
    exposure: r[8],
    likelihoodAnswers: r[9],
    likelihood: r[10],
    estimate: Array.isArray(r[11]) ? unpackEstimateRow(r[11]) : r[11],
    severity: r[12],
    riskScore: r[13],
    riskBand: r[14],
    state: r[15],
    assigneeId: r[16],
    dueAt: r[17],
    overdue: r[18],
    notes: r[19],
    madeSafeNote: r[20],
    madeSafeUntil: r[21],
    handBack: r[22],
    madeSafeControl: r[23],
    zoneRadiusM: r[24],
    madeSafePhotoIds: r[25],
    createdBy: r[26],
    createdAt: r[27],
    updatedAt: r[28],
    version: r[29],
    organisationId: r[30],
    siteId: r[31],
  };
}

/** unpackRow(ESTIMATE_ROW, row), written out (see unpackFindingRow). */
export function unpackEstimateRow(row: unknown): Record<string, unknown> {
  const r = rowOf(ESTIMATE_ROW, row);
  const severity = rowOf(SEVERITY_ROW, r[16]);
  const likelihood = rowOf(LIKELIHOOD_ROW, r[17]);
  const resolved = rowOf(RESOLVED_ROW, r[18]);
  return {
    terminalVelocityMps: r[0],
    impactVelocityMps: r[1],
    vacuumImpactVelocityMps: r[2],
    fallTimeS: r[3],
    riseM: r[4],
    impactEnergyJ: r[5],
    meanForceN: r[6],
    peakForceN: r[7],
    driftM: r[8],
    governingImpact: r[9],
    stillAirImpactVelocityMps: r[10],
    stillAirImpactEnergyJ: r[11],
    stillAirPeakForceN: r[12],
    windImpactVelocityMps: r[13],
    windImpactEnergyJ: r[14],
    windPeakForceN: r[15],
    severity: { level: severity[0], label: severity[1], basis: severity[2] },
    likelihood: { level: likelihood[0], label: likelihood[1], reasons: likelihood[2] },
    resolved: {
      massKg: resolved[0],
      heightM: resolved[1],
      initialVelocityMps: resolved[2],
      dragAreaM2: resolved[3],
      dragAreaSource: resolved[4],
      airDensityKgM3: resolved[5],
      gravityMps2: resolved[6],
      windSpeedMps: resolved[7],
      exposure: resolved[8],
      contact: resolved[9],
      defaultsApplied: resolved[10],
    },
  };
}

/**
 * A pull page answered with `format=rows`, its findings turned back into records (in place: a page
 * is parsed JSON nobody else holds). Every other change is a record already.
 */
export function unpackPullPage<T>(page: T): T {
  const changes = (page as { changes?: unknown }).changes;
  if (Array.isArray(changes)) {
    for (let i = 0; i < changes.length; i++) {
      const change = changes[i] as { type?: unknown; row?: unknown } | null;
      if (change?.type === 'finding' && 'row' in change) changes[i] = { type: 'finding', record: unpackFindingRow(change.row) };
    }
  }
  return page;
}

/** The keys of a template in row order, nested keys as `outer.inner` (for tests and documentation). */
export function rowKeys(template: RowTemplate, prefix = ''): string[] {
  return template.flatMap((slot) => (typeof slot === 'string' ? [prefix + slot] : rowKeys(slot[1], `${prefix}${slot[0]}.`)));
}
