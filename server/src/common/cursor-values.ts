import type { SortCast } from './keyset.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const INT32 = { min: -(2n ** 31n), max: 2n ** 31n - 1n };
const INT64 = { min: -(2n ** 63n), max: 2n ** 63n - 1n };
const REAL = /^[+-]?(\d+(\.\d*)?|\.\d+)(e[+-]?\d{1,3})?$|^[+-]?Infinity$|^NaN$/i;
/** PostgreSQL's text form of timestamptz (what the key is read back as), or ISO 8601. */
const TIMESTAMP = /^(\d{4,6})-(\d{2})-(\d{2})[ T](\d{2}):(\d{2}):(\d{2})(\.\d{1,6})?(Z|[+-]\d{2}(:?\d{2})?)?$/;

function inRange(text: string, range: { min: bigint; max: bigint }): boolean {
  if (!/^-?\d{1,20}$/.test(text)) return false;
  const n = BigInt(text);
  return n >= range.min && n <= range.max;
}

function validTimestamp(text: string): boolean {
  if (text === 'infinity' || text === '-infinity') return true;
  const m = TIMESTAMP.exec(text);
  if (!m) return false;
  const [year, month, day, hour, minute, second] = m.slice(1, 7).map(Number);
  if (year < 1 || year > 294_276 || hour > 23 || minute > 59 || second > 59) return false;
  const date = new Date(Date.UTC(2000, month - 1, day));
  // A day that does not exist in its month (31 April) rolls into the next month.
  const leapSafe = new Date(Date.UTC(year % 400 === 0 ? 2000 : year % 100 === 0 ? 1900 : year % 4 === 0 ? 2004 : 2001, month - 1, day));
  return month >= 1 && month <= 12 && date.getUTCDate() > 0 && leapSafe.getUTCMonth() === month - 1 && leapSafe.getUTCDate() === day;
}

/**
 * Whether a value from a cursor can be cast to the sort key's type by PostgreSQL. A cursor is
 * opaque to the client but not trusted: a forged one must answer 400, not fail inside the query.
 */
export function castsCleanly(value: string, cast: SortCast): boolean {
  if (value.includes('\u0000')) return false;
  switch (cast) {
    case 'uuid':
      return UUID.test(value);
    case 'integer':
      return inRange(value, INT32);
    case 'bigint':
      return inRange(value, INT64);
    case 'real':
      // PostgreSQL refuses a real beyond ±3.4e38 rather than rounding it to infinity.
      return REAL.test(value) && (!/\d/.test(value) || Math.abs(Number(value)) < 3.4e38);
    case 'timestamptz':
      return validTimestamp(value);
    case 'text':
      return true;
  }
}
