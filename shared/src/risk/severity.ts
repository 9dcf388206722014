/**
 * Severity 1–5 of a drop estimate from its impact energy and peak force, against a threshold table.
 * The result says in words which reference the estimate crossed. Results are frozen and cached per
 * threshold, so rating an estimate allocates nothing.
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

const crossedCache = new WeakMap<SeverityThreshold, Severity>();
const belowCache = new WeakMap<readonly SeverityThreshold[], Severity>();
const checkedTables = new WeakSet<SeverityTable>();

function formatThreshold(t: SeverityThreshold): string {
  return t.quantity === 'energy' ? `${t.atLeast} J` : t.atLeast >= 1000 ? `${t.atLeast / 1000} kN` : `${t.atLeast} N`;
}

function crossed(t: SeverityThreshold): Severity {
  let result = crossedCache.get(t);
  if (result === undefined) {
    const what = t.quantity === 'energy' ? 'Impact energy' : 'Peak force';
    result = Object.freeze({
      level: t.level,
      label: SEVERITY_LABELS[t.level],
      basis: `${what} reaches ${formatThreshold(t)}, ${t.reference} (${t.source}).`,
    });
    crossedCache.set(t, result);
  }
  return result;
}

function below(thresholds: readonly SeverityThreshold[], exposure: Exposure): Severity {
  let result = belowCache.get(thresholds);
  if (result === undefined) {
    const lowest = (q: 'energy' | 'force') =>
      thresholds.filter((t) => t.quantity === q).sort((a, b) => a.atLeast - b.atLeast)[0];
    const parts = [lowest('energy'), lowest('force')].filter((t): t is SeverityThreshold => t !== undefined);
    const who = exposure === 'helmet' ? 'a helmeted head' : 'a bare head';
    result = Object.freeze({
      level: 1,
      label: SEVERITY_LABELS[1],
      basis:
        `Below every reference for ${who}` +
        (parts.length ? `: under ${parts.map((t) => `${formatThreshold(t)}, ${t.reference}`).join('; and under ')}.` : '.'),
    });
    belowCache.set(thresholds, result);
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
 * level whose energy or force threshold is reached wins; on a tie the rule listed first is named.
 */
export function rateSeverity(
  energyJ: number,
  peakForceN: number,
  exposure: Exposure,
  table: SeverityTable = DEFAULT_SEVERITY_TABLE,
): Severity {
  const isDefault = table === DEFAULT_SEVERITY_TABLE;
  if (!isDefault) validateSeverityTable(table);
  const thresholds = table[exposure];
  let best = -1;
  let bestLevel = 0;
  for (let i = 0; i < thresholds.length; i++) {
    const t = thresholds[i]!;
    const value = t.quantity === 'energy' ? energyJ : peakForceN;
    if (value >= t.atLeast && t.level > bestLevel) {
      best = i;
      bestLevel = t.level;
    }
  }
  if (isDefault) {
    // The default table's results are built once, so the hot path does no map lookup.
    const results = exposure === 'helmet' ? DEFAULT_HELMET_RESULTS : DEFAULT_BARE_HEAD_RESULTS;
    return best < 0 ? results.below : results.crossed[best]!;
  }
  return best < 0 ? below(thresholds, exposure) : crossed(thresholds[best]!);
}

interface PrecomputedResults {
  readonly crossed: readonly Severity[];
  readonly below: Severity;
}

const precompute = (exposure: Exposure): PrecomputedResults => ({
  crossed: DEFAULT_SEVERITY_TABLE[exposure].map(crossed),
  below: below(DEFAULT_SEVERITY_TABLE[exposure], exposure),
});
const DEFAULT_BARE_HEAD_RESULTS = precompute('bare-head');
const DEFAULT_HELMET_RESULTS = precompute('helmet');
