/**
 * Severity 1–5 of a drop estimate from its impact energy and peak force, against a threshold table.
 * The result says in words the estimate's own figure and the reference it reached. Results are
 * frozen and cached per threshold and rounded figure, so rating an estimate seldom allocates.
 */
import type { Exposure } from '../physics/exposure.js';
import { EXPOSURES } from '../physics/exposure.js';
import { DEFAULT_SEVERITY_TABLE, SEVERITY_LABELS, type SeverityLevel, type SeverityTable, type SeverityThreshold } from './severity-table.js';

export interface Severity {
  readonly level: SeverityLevel;
  readonly label: string;
  /** Which reference the estimate crossed, in words, with its source. */
  readonly basis: string;
}

/** Thrown when an organisation's severity table is malformed. */
export class SeverityTableError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'SeverityTableError';
  }
}

/**
 * Relative tolerance of every threshold comparison: a value within one part in 10⁹ below a threshold
 * counts as reaching it, so the level never depends on the order of floating-point operations
 * (the EN 397 striker on the helmet spring computes 4999.999999999999 N against 5,000 N).
 */
export const SEVERITY_RELATIVE_TOLERANCE = 1e-9;
const REACH = 1 - SEVERITY_RELATIVE_TOLERANCE;

/** Cached results per threshold (or per list, for "below every reference"), keyed by the rounded figure. */
const crossedCache = new WeakMap<SeverityThreshold, Map<number, Severity>>();
const belowCache = new WeakMap<readonly SeverityThreshold[], Map<number, Severity>>();
const checkedTables = new WeakSet<SeverityTable>();
/** Past this many cached figures per threshold the cache starts afresh (memory stays bounded). */
const CACHE_LIMIT = 4096;

/** Three significant figures, the precision the basis quotes (no string work: a cache key). */
function rounded(x: number): number {
  const step = x < 1 ? 0.001 : x < 10 ? 0.01 : x < 100 ? 0.1 : x < 1000 ? 1 : x < 10_000 ? 10 : x < 100_000 ? 100 : 10 ** (Math.floor(Math.log10(x)) - 2);
  return Math.round(x / step) * step;
}

function formatNumber(x: number): string {
  return String(Number(x.toPrecision(3)));
}

function formatQuantity(quantity: 'energy' | 'force', value: number): string {
  if (quantity === 'energy') return `${formatNumber(value)} J`;
  return value >= 1000 ? `${formatNumber(value / 1000)} kN` : `${formatNumber(value)} N`;
}

function crossed(t: SeverityThreshold, value: number): Severity {
  let byFigure = crossedCache.get(t);
  if (byFigure === undefined) crossedCache.set(t, (byFigure = new Map()));
  const key = rounded(value);
  let result = byFigure.get(key);
  if (result === undefined) {
    const what = t.quantity === 'energy' ? 'Impact energy' : 'Peak force';
    result = Object.freeze({
      level: t.level,
      label: SEVERITY_LABELS[t.level],
      basis: `${what} ${formatQuantity(t.quantity, key)} reaches ${formatQuantity(t.quantity, t.atLeast)}, ${t.reference} (${t.source}).`,
    });
    if (byFigure.size >= CACHE_LIMIT) byFigure.clear();
    byFigure.set(key, result);
  }
  return result;
}

function below(thresholds: readonly SeverityThreshold[], exposure: Exposure, energyJ: number, peakForceN: number): Severity {
  let byFigures = belowCache.get(thresholds);
  if (byFigures === undefined) belowCache.set(thresholds, (byFigures = new Map()));
  const energy = rounded(energyJ);
  const force = rounded(peakForceN);
  // Below every reference both figures are small; one number keys the pair.
  const key = energy * 1e7 + force;
  let result = byFigures.get(key);
  if (result === undefined) {
    const lowest = (q: 'energy' | 'force') =>
      thresholds.filter((t) => t.quantity === q).sort((a, b) => a.atLeast - b.atLeast)[0];
    const parts = [lowest('energy'), lowest('force')].filter((t): t is SeverityThreshold => t !== undefined);
    const who = exposure === 'helmet' ? 'a helmeted head' : 'a bare head';
    result = Object.freeze({
      level: 1,
      label: SEVERITY_LABELS[1],
      basis:
        `Impact energy ${formatQuantity('energy', energy)} and peak force ${formatQuantity('force', force)}, below every reference for ${who}` +
        (parts.length ? `: under ${parts.map((t) => `${formatQuantity(t.quantity, t.atLeast)}, ${t.reference}`).join('; and under ')}.` : '.'),
    });
    if (byFigures.size >= CACHE_LIMIT) byFigures.clear();
    if (force < 1e7) byFigures.set(key, result); // the key is unique only while the force stays below 10⁷ N
  }
  return result;
}

/** Checks an organisation's table once (levels 2–5, positive finite thresholds, a source on each). */
export function validateSeverityTable(table: SeverityTable): void {
  if (checkedTables.has(table)) return;
  for (const exposure of EXPOSURES) {
    const list = table?.[exposure];
    if (!Array.isArray(list)) throw new SeverityTableError(exposure, `The severity table has no list for ${exposure}.`);
    list.forEach((t: SeverityThreshold, i: number) => {
      const field = `${exposure}[${i}]`;
      if (![2, 3, 4, 5].includes(t?.level)) throw new SeverityTableError(`${field}.level`, 'A threshold level must be 2, 3, 4 or 5.');
      if (t.quantity !== 'energy' && t.quantity !== 'force') throw new SeverityTableError(`${field}.quantity`, 'A threshold is on energy or force.');
      if (typeof t.atLeast !== 'number' || !(t.atLeast > 0) || !Number.isFinite(t.atLeast)) {
        throw new SeverityTableError(`${field}.atLeast`, 'A threshold value must be a positive finite number.');
      }
      if (typeof t.source !== 'string' || t.source.trim() === '') throw new SeverityTableError(`${field}.source`, 'Every threshold needs its source.');
      if (typeof t.reference !== 'string' || t.reference.trim() === '') throw new SeverityTableError(`${field}.reference`, 'Every threshold needs its reference in words.');
    });
  }
  checkedTables.add(table);
}

/**
 * Severity of an impact of `energyJ` joules and `peakForceN` newtons on `exposure`. The highest
 * level whose energy or force threshold is reached (within SEVERITY_RELATIVE_TOLERANCE) wins; on a
 * tie the rule listed first is named. The basis quotes the estimate's own figure (three significant
 * figures), then the threshold it reaches. Results are frozen and shared per threshold and figure.
 */
export function rateSeverity(
  energyJ: number,
  peakForceN: number,
  exposure: Exposure,
  table: SeverityTable = DEFAULT_SEVERITY_TABLE,
): Severity {
  if (table !== DEFAULT_SEVERITY_TABLE) validateSeverityTable(table);
  const thresholds = table[exposure];
  let best = -1;
  let bestLevel = 0;
  for (let i = 0; i < thresholds.length; i++) {
    const t = thresholds[i]!;
    const value = t.quantity === 'energy' ? energyJ : peakForceN;
    if (value >= t.atLeast * REACH && t.level > bestLevel) {
      best = i;
      bestLevel = t.level;
    }
  }
  if (best < 0) return below(thresholds, exposure, energyJ, peakForceN);
  const t = thresholds[best]!;
  return crossed(t, t.quantity === 'energy' ? energyJ : peakForceN);
}
