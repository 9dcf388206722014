import { FINDING_ROW, UNFIXED_STATES, type RowTemplate, type SyncPullFormat } from '@plummet/shared';
import { sql, type SQL } from 'drizzle-orm';

/**
 * A pulled finding as JSON text written by PostgreSQL: the record toSyncFinding (sync.mapper.ts)
 * makes from the same row, key for key and value for value. A pull page is a thousand findings of
 * thirty columns; decoding each cell, building the record and writing it out again was most of a
 * page's time on the server. The text goes into the answer unparsed (raw-json.ts). It is put
 * together by plain concatenation, compact, which costs the database about half of what
 * json_build_object does.
 *
 * What keeps the two the same:
 * - text is written by to_json, json and jsonb columns by their own output (json as it was
 *   stored), which the driver's parse plus JSON.stringify reproduce (the same values; spacing
 *   aside); uuids and enum labels need no escaping;
 * - `real` columns print the shortest decimal that identifies the stored float, which is what the
 *   driver parses (the physics never stores a non-finite one);
 * - timestamps are written as Date#toISOString writes them: UTC, milliseconds, the microseconds cut
 *   off as a Date parsed from PostgreSQL's text cuts them;
 * - overdue is isOverdue (finding.mapper.ts): a due time, in milliseconds, before `now`, and not fixed.
 * sync-pull.int-spec.ts compares both for findings with every optional column set and unset.
 *
 * Asked for rows (`format=rows`), the same values are written as a row in shared's FINDING_ROW
 * order, without keys, and the estimate as the row stored beside it (`estimate_row`, written with the
 * estimate by finding-input.ts), or as its object where there is none.
 */
type Kind = 'id' | 'text' | 'label' | 'number' | 'json' | 'time';

/** A value of `kind` as JSON text; null as `null` (concat() would drop a NULL). */
function asJson(kind: Kind, e: string): string {
  switch (kind) {
    case 'id':
    case 'label':
      return `coalesce('"' || ${e} || '"', 'null')`;
    case 'text':
      return `coalesce(to_json(${e})::text, 'null')`;
    case 'number':
    case 'json':
      return `coalesce(${e}::text, 'null')`;
    case 'time':
      return `coalesce('"' || to_char(${e} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"') || '"', 'null')`;
  }
}

const unfixed = UNFIXED_STATES.map((s) => `'${s}'`).join(', ');

/** What each of the record's keys is written from (its order is shared's FINDING_ROW, toFinding's). */
function sources(f: string, siteId: string, format: SyncPullFormat): Record<string, [Kind, string]> {
  return {
    id: ['id', `${f}.id`],
    inspectionId: ['id', `${f}.inspection_id`],
    scaffoldId: ['id', `${f}.scaffold_id`],
    elevation: ['text', `${f}.elevation`],
    lift: ['number', `${f}.lift`],
    bay: ['number', `${f}.bay`],
    heightM: ['number', `${f}.height_m`],
    'item.catalogueItemId': ['id', `${f}.catalogue_item_id`],
    'item.name': ['text', `${f}.item_name`],
    'item.massKg': ['number', `${f}.mass_kg`],
    'item.shape': ['json', `${f}.shape`],
    exposure: ['label', `${f}.exposure`],
    likelihoodAnswers: ['json', `${f}.likelihood_answers`],
    likelihood: ['number', `${f}.likelihood`],
    // As a row, the estimate's row stored with it (migration 0020), or its object where there is none.
    estimate: ['json', format === 'rows' ? `coalesce(${f}.estimate_row, ${f}.estimate::text)` : `${f}.estimate`],
    severity: ['number', `${f}.severity`],
    riskScore: ['number', `${f}.risk_score`],
    riskBand: ['label', `${f}.risk_band`],
    state: ['label', `${f}.state`],
    assigneeId: ['id', `${f}.assignee_id`],
    dueAt: ['time', `${f}.due_at`],
    overdue: ['json', ''],
    notes: ['text', `${f}.notes`],
    madeSafeNote: ['text', `${f}.made_safe_note`],
    madeSafeUntil: ['time', `${f}.made_safe_until`],
    handBack: ['json', `${f}.hand_back`],
    madeSafeControl: ['label', `${f}.made_safe_control`],
    zoneRadiusM: ['number', `${f}.zone_radius_m`],
    madeSafePhotoIds: ['json', `array_to_json(${f}.made_safe_photo_ids)`],
    createdBy: ['id', `${f}.created_by`],
    createdAt: ['time', `${f}.created_at`],
    updatedAt: ['time', `${f}.updated_at`],
    version: ['number', `${f}.version`],
    organisationId: ['id', `${f}.organisation_id`],
    siteId: ['id', siteId],
  };
}

/**
 * `f`: the alias of the findings row; `siteId`: an expression for its scaffold's site; `now`:
 * milliseconds since the epoch, the instant overdue is judged at; `format`: the record as an object,
 * or as a row (shared/src/sync/finding-rows.ts). Aliases and expressions are the caller's SQL, never input.
 */
export function syncFindingJson(f: string, siteId: string, now: number, format: SyncPullFormat = 'records'): SQL {
  const [before, after] = textAround(f, siteId, format);
  const overdue = sql.raw(`${f}.due_at is not null and ${f}.state in (${unfixed}) and floor(extract(epoch from ${f}.due_at) * 1000)`);
  return sql`${sql.raw(before)}case when ${overdue} < ${now}::numeric then 'true' else 'false' end${sql.raw(after)}`;
}

/** The SQL text before and after the overdue test, built once per alias and format (a pull builds its query for every page). */
const texts = new Map<string, [string, string]>();

function textAround(f: string, siteId: string, format: SyncPullFormat): [string, string] {
  const key = `${f} ${siteId} ${format}`;
  let found = texts.get(key);
  if (!found) {
    const [before, after] = written(FINDING_ROW, sources(f, siteId, format), format).split('\u0000') as [string, string];
    found = [before, after];
    texts.set(key, found);
  }
  return found;
}

/** concat() of a template's values: `{"key":value,…}` for records, `[value,…]` for rows; nested templates the same way. */
function written(template: RowTemplate, from: Record<string, [Kind, string]>, format: SyncPullFormat, prefix = ''): string {
  const [open, close] = format === 'rows' ? ['[', ']'] : ['{', '}'];
  const parts = template.map((slot, i) => {
    const key = typeof slot === 'string' ? slot : slot[0];
    const lead = `'${i === 0 ? open : ','}${format === 'rows' ? '' : `"${key}":`}', `;
    if (typeof slot !== 'string') return `${lead}${written(slot[1], from, format, `${prefix}${key}.`)}`;
    // Where the overdue test goes (it carries `now` as a parameter); SQL text never holds a NUL.
    if (prefix + key === 'overdue') return `${lead}\u0000`;
    const source = from[prefix + key];
    if (!source) throw new Error(`No column for the pulled finding's ${prefix}${key}`);
    return `${lead}${asJson(...source)}`;
  });
  return `concat(${parts.join(', ')}, '${close}')`;
}
