import { UNFIXED_STATES } from '@plummet/shared';
import { sql, type SQL } from 'drizzle-orm';

/**
 * A pulled finding as JSON text written by PostgreSQL: the record toSyncFinding (sync.mapper.ts)
 * makes from the same row, key for key and value for value. A pull page is a thousand findings of
 * thirty columns; decoding each cell, building the record and writing it out again was most of a
 * page's time on the server. The text goes into the answer unparsed (raw-json.ts).
 *
 * What keeps the two the same:
 * - jsonb and text columns are written by PostgreSQL's JSON output, which the driver's parse plus
 *   JSON.stringify reproduce (the same values; spacing aside);
 * - `real` columns print the shortest decimal that identifies the stored float, which is what the
 *   driver parses;
 * - timestamps are written as Date#toISOString writes them: UTC, milliseconds, the microseconds cut
 *   off as a Date parsed from PostgreSQL's text cuts them;
 * - overdue is isOverdue (finding.mapper.ts): a due time, in milliseconds, before `now`, and not fixed.
 * sync-pull.int-spec.ts compares both for findings with every optional column set and unset.
 */
const iso = (column: string) => `to_char(${column} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;

const unfixed = UNFIXED_STATES.map((s) => `'${s}'`).join(', ');

/** The record's keys in toFinding's order, then toSyncFinding's two; each a column of `f` or an expression of it. */
function fields(f: string, siteId: string, now: number): [string, string | SQL][] {
  return [
    ['id', `${f}.id`],
    ['inspectionId', `${f}.inspection_id`],
    ['scaffoldId', `${f}.scaffold_id`],
    ['elevation', `${f}.elevation`],
    ['lift', `${f}.lift`],
    ['bay', `${f}.bay`],
    ['heightM', `${f}.height_m`],
    ['item', `json_build_object('catalogueItemId', ${f}.catalogue_item_id, 'name', ${f}.item_name, 'massKg', ${f}.mass_kg, 'shape', ${f}.shape)`],
    ['exposure', `${f}.exposure`],
    ['likelihoodAnswers', `${f}.likelihood_answers`],
    ['likelihood', `${f}.likelihood`],
    ['estimate', `${f}.estimate`],
    ['severity', `${f}.severity`],
    ['riskScore', `${f}.risk_score`],
    ['riskBand', `${f}.risk_band`],
    ['state', `${f}.state`],
    ['assigneeId', `${f}.assignee_id`],
    ['dueAt', iso(`${f}.due_at`)],
    ['overdue', sql`(${sql.raw(`${f}.due_at is not null and floor(extract(epoch from ${f}.due_at) * 1000)`)} < ${now}::numeric ${sql.raw(`and ${f}.state in (${unfixed})`)})`],
    ['notes', `${f}.notes`],
    ['madeSafeNote', `${f}.made_safe_note`],
    ['madeSafeUntil', iso(`${f}.made_safe_until`)],
    ['handBack', `${f}.hand_back`],
    ['madeSafeControl', `${f}.made_safe_control`],
    ['zoneRadiusM', `${f}.zone_radius_m`],
    ['madeSafePhotoIds', `${f}.made_safe_photo_ids`],
    ['createdBy', `${f}.created_by`],
    ['createdAt', iso(`${f}.created_at`)],
    ['updatedAt', iso(`${f}.updated_at`)],
    ['version', `${f}.version`],
    ['organisationId', `${f}.organisation_id`],
    ['siteId', siteId],
  ];
}

/**
 * `f`: the alias of the findings row; `siteId`: an expression for its scaffold's site; `now`:
 * milliseconds since the epoch, the instant overdue is judged at. Aliases and expressions are the
 * caller's SQL, never input.
 */
export function syncFindingJson(f: string, siteId: string, now: number): SQL {
  const pairs = fields(f, siteId, now).map(([key, value]) => sql`${sql.raw(`'${key}'`)}, ${typeof value === 'string' ? sql.raw(value) : value}`);
  return sql`json_build_object(${sql.join(pairs, sql`, `)})::text`;
}
