import { ESTIMATE_ROW, type RowTemplate } from '@plummet/shared';

/**
 * The body of the SQL function `finding_estimate_row(e jsonb) returns text` (drizzle migration
 * 0020), written from shared's ESTIMATE_ROW: the stored estimate as a row (shared/src/sync/finding-rows.ts),
 * or NULL when the estimate is not of exactly that shape (one stored before a field was added),
 * which then travels as its object. PostgreSQL keeps the result in the generated column
 * `findings.estimate_row`, written once when the estimate is, so a pull copies text and never
 * formats an estimate's numbers again.
 *
 * Each value is the estimate's own JSON text (jsonb's output), as `estimate::text` writes it. When
 * ESTIMATE_ROW changes, a new migration replaces the function with this body (and rewrites the
 * column: `ALTER TABLE findings ALTER COLUMN estimate_row SET EXPRESSION` is PostgreSQL 17; on 15,
 * drop and add it). sync-rows.int-spec.ts fails until the database's function is this one.
 */
export function estimateRowFunctionBody(template: RowTemplate = ESTIMATE_ROW): string {
  return `
  select case when ${shapeTest('e', template)}
    then ${rowText('e', template)}
  end
`;
}

const quoted = (key: string) => `'${key.replaceAll("'", "''")}'`;
const keyArray = (template: RowTemplate) => `array[${template.map((slot) => quoted(typeof slot === 'string' ? slot : slot[0])).join(', ')}]`;

/**
 * An object with exactly the template's keys, and objects of their templates where it has them:
 * every key present (`?&`), and nothing left when they are taken away. CASE, not AND, so that no key
 * test runs on something that is not an object.
 */
function shapeTest(e: string, template: RowTemplate): string {
  const nested = template.filter((slot): slot is readonly [string, RowTemplate] => typeof slot !== 'string');
  const own = `case when jsonb_typeof(${e}) = 'object' then ${e} ?& ${keyArray(template)} and ${e} - ${keyArray(template)} = '{}'::jsonb else false end`;
  return nested.reduce((test, [key, inner]) => `case when ${test} then ${shapeTest(`(${e} -> ${quoted(key)})`, inner)} else false end`, own);
}

/** The row's JSON text: each value's own text in template order, nested templates as rows. */
function rowText(e: string, template: RowTemplate): string {
  const parts = template.map((slot, i) => {
    const lead = i === 0 ? "'['" : "','";
    const value = typeof slot === 'string' ? `(${e} -> ${quoted(slot)})::text` : rowText(`(${e} -> ${quoted(slot[0])})`, slot[1]);
    return `${lead}, ${value}`;
  });
  return `concat(${parts.join(', ')}, ']')`;
}
